/**
 * The network inventory as Sequelize models. Columns are snake_case in the
 * database and camelCase here; every table carries an optimistic-lock
 * `version` (Sequelize's own `version: true` bumps it on save).
 */
import { DataTypes, Model, type Sequelize, type ModelAttributes } from 'sequelize';

export class SiteRow extends Model {}
export class ServiceRow extends Model {}
export class RiskGroupRow extends Model {}
export class CarriageRow extends Model {}
export class FeedRow extends Model {}
export class FeedViaSiteRow extends Model {}
export class FeedGroupRow extends Model {}
export class SiteGroupRow extends Model {}

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
const common = {
  createdAt: { type: DataTypes.DATE, field: 'created_at' },
  updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
  // as the migration has it: a new row starts at 1 (Sequelize's own default would be 0)
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
};
const num = (field: string) => ({ type: DataTypes.DOUBLE, allowNull: true, field });
const opts = (sequelize: Sequelize, tableName: string) => ({ sequelize, tableName, version: true });

/**
 * Each inventory table's columns, described once: the models below are
 * built from these, and the set-based reads (server/services/networkLoader.ts,
 * server/services/inventory/queries.ts) take their select lists from them
 * (server/db/columns.ts), so a new field is added here and nowhere else in SQL.
 */
export const SITE_ATTRIBUTES = {
  id,
  code: { type: DataTypes.TEXT, allowNull: false },
  name: { type: DataTypes.TEXT, allowNull: false },
  role: { type: DataTypes.TEXT, allowNull: false },
  lat: { type: DataTypes.DOUBLE, allowNull: false },
  lon: { type: DataTypes.DOUBLE, allowNull: false },
  groundHeightM: num('ground_height_m'),
  mastHeightM: num('mast_height_m'),
  households: { type: DataTypes.INTEGER, allowNull: true },
  ...common,
};
export const SERVICE_ATTRIBUTES = { id, code: { type: DataTypes.TEXT, allowNull: false }, name: { type: DataTypes.TEXT, allowNull: false }, kind: { type: DataTypes.TEXT, allowNull: false }, ...common };
export const GROUP_ATTRIBUTES = { id, code: { type: DataTypes.TEXT, allowNull: false }, name: { type: DataTypes.TEXT, allowNull: false }, note: { type: DataTypes.TEXT, allowNull: true }, ...common };
export const CARRIAGE_ATTRIBUTES = {
  id,
  code: { type: DataTypes.TEXT, allowNull: false },
  siteId: { type: DataTypes.INTEGER, allowNull: false, field: 'site_id' },
  serviceId: { type: DataTypes.INTEGER, allowNull: false, field: 'service_id' },
  frequencyMHz: num('frequency_mhz'),
  channel: { type: DataTypes.TEXT, allowNull: true },
  erpW: num('erp_w'),
  polarisation: { type: DataTypes.TEXT, allowNull: true },
  antennaHeightM: num('antenna_height_m'),
  onChannelRepeater: { type: DataTypes.BOOLEAN, allowNull: true, field: 'on_channel_repeater' },
  ...common,
};
export const FEED_ATTRIBUTES = {
  id,
  code: { type: DataTypes.TEXT, allowNull: false },
  fromCarriageId: { type: DataTypes.INTEGER, allowNull: false, field: 'from_carriage_id' },
  toCarriageId: { type: DataTypes.INTEGER, allowNull: false, field: 'to_carriage_id' },
  medium: { type: DataTypes.TEXT, allowNull: false },
  role: { type: DataTypes.TEXT, allowNull: false },
  rxFrequencyMHz: num('rx_frequency_mhz'),
  rxChannel: { type: DataTypes.TEXT, allowNull: true, field: 'rx_channel' },
  rxAntenna: { type: DataTypes.TEXT, allowNull: true, field: 'rx_antenna' },
  bearingDeg: num('bearing_deg'),
  ...common,
};

/** The link tables: a feed's hops in order, and the groups of feeds and of sites. */
export const FEED_VIA_ATTRIBUTES = {
  feedId: { type: DataTypes.INTEGER, primaryKey: true, field: 'feed_id' },
  position: { type: DataTypes.INTEGER, primaryKey: true },
  siteId: { type: DataTypes.INTEGER, allowNull: false, field: 'site_id' },
};
export const FEED_GROUP_ATTRIBUTES = {
  feedId: { type: DataTypes.INTEGER, primaryKey: true, field: 'feed_id' },
  groupId: { type: DataTypes.INTEGER, primaryKey: true, field: 'group_id' },
};
export const SITE_GROUP_ATTRIBUTES = {
  siteId: { type: DataTypes.INTEGER, primaryKey: true, field: 'site_id' },
  groupId: { type: DataTypes.INTEGER, primaryKey: true, field: 'group_id' },
};

/** Each model's table, for the set-based SQL that reads before the models are defined (server/services/inventory/queries.ts). */
export const TABLES = {
  sites: 'sites',
  services: 'services',
  groups: 'risk_groups',
  carriages: 'carriages',
  feeds: 'feeds',
  feedVia: 'feed_via_sites',
  feedGroups: 'feed_groups',
  siteGroups: 'site_groups',
} as const;

export function defineInventory(sequelize: Sequelize) {
  SiteRow.init(SITE_ATTRIBUTES as ModelAttributes, opts(sequelize, TABLES.sites));
  ServiceRow.init(SERVICE_ATTRIBUTES as ModelAttributes, opts(sequelize, TABLES.services));
  RiskGroupRow.init(GROUP_ATTRIBUTES as ModelAttributes, opts(sequelize, TABLES.groups));
  CarriageRow.init(CARRIAGE_ATTRIBUTES as ModelAttributes, opts(sequelize, TABLES.carriages));
  FeedRow.init(FEED_ATTRIBUTES as ModelAttributes, opts(sequelize, TABLES.feeds));
  FeedViaSiteRow.init(FEED_VIA_ATTRIBUTES as ModelAttributes, { sequelize, tableName: TABLES.feedVia, timestamps: false });
  FeedGroupRow.init(FEED_GROUP_ATTRIBUTES as ModelAttributes, { sequelize, tableName: TABLES.feedGroups, timestamps: false });
  SiteGroupRow.init(SITE_GROUP_ATTRIBUTES as ModelAttributes, { sequelize, tableName: TABLES.siteGroups, timestamps: false });

  CarriageRow.belongsTo(SiteRow, { as: 'site', foreignKey: 'siteId' });
  CarriageRow.belongsTo(ServiceRow, { as: 'service', foreignKey: 'serviceId' });
  SiteRow.hasMany(CarriageRow, { as: 'carriages', foreignKey: 'siteId' });
  ServiceRow.hasMany(CarriageRow, { as: 'carriages', foreignKey: 'serviceId' });
  FeedRow.belongsTo(CarriageRow, { as: 'from', foreignKey: 'fromCarriageId' });
  FeedRow.belongsTo(CarriageRow, { as: 'to', foreignKey: 'toCarriageId' });
  FeedRow.hasMany(FeedViaSiteRow, { as: 'viaSites', foreignKey: 'feedId' });
  FeedViaSiteRow.belongsTo(SiteRow, { as: 'site', foreignKey: 'siteId' });
  FeedGroupRow.belongsTo(RiskGroupRow, { as: 'group', foreignKey: 'groupId' });
  SiteGroupRow.belongsTo(RiskGroupRow, { as: 'group', foreignKey: 'groupId' });
  FeedRow.belongsToMany(RiskGroupRow, { as: 'groups', through: FeedGroupRow, foreignKey: 'feedId', otherKey: 'groupId' });
  SiteRow.belongsToMany(RiskGroupRow, { as: 'groups', through: SiteGroupRow, foreignKey: 'siteId', otherKey: 'groupId' });
  RiskGroupRow.belongsToMany(SiteRow, { as: 'sites', through: SiteGroupRow, foreignKey: 'groupId', otherKey: 'siteId' });
  RiskGroupRow.belongsToMany(FeedRow, { as: 'feeds', through: FeedGroupRow, foreignKey: 'groupId', otherKey: 'feedId' });
}
