import { DataTypes, Model, type Sequelize } from 'sequelize';

export class AuditRow extends Model {}

export function defineAudit(sequelize: Sequelize) {
  AuditRow.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      userId: { type: DataTypes.INTEGER, allowNull: true, field: 'user_id' },
      userEmail: { type: DataTypes.TEXT, allowNull: true, field: 'user_email' },
      action: { type: DataTypes.TEXT, allowNull: false },
      entityKind: { type: DataTypes.TEXT, allowNull: false, field: 'entity_kind' },
      entityCode: { type: DataTypes.TEXT, allowNull: true, field: 'entity_code' },
      before: { type: DataTypes.JSONB, allowNull: true },
      after: { type: DataTypes.JSONB, allowNull: true },
      networkVersion: { type: DataTypes.BIGINT, allowNull: true, field: 'network_version' },
    },
    { sequelize, tableName: 'audit_log', timestamps: false },
  );
}
