/** Subscriptions, outside contacts and sent notices (migration 0005; server/notices/README.md). */
import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Subscription extends Model {
  declare id: number;
  declare userId: number;
  declare everything: boolean;
  declare services: string[];
  declare sites: string[];
  declare updatedAt: Date;
}

export class Contact extends Model {
  declare id: number;
  declare name: string;
  declare email: string;
  declare organisation: string;
  declare everything: boolean;
  declare services: string[];
  declare sites: string[];
  declare createdAt: Date;
  declare updatedAt: Date;
}

export type NoticeStatus = 'waiting' | 'sent' | 'failed';

export class Notice extends Model {
  declare id: number;
  declare eventKey: string;
  declare eventKind: string;
  declare eventCode: string;
  declare address: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string;
  declare status: NoticeStatus;
  declare attempts: number;
  declare lastError: string | null;
  declare messageId: string | null;
  declare createdAt: Date;
  declare sentAt: Date | null;
}

// a fresh object per attribute: Sequelize writes into attribute definitions, so two columns must never share one
const codes = () => ({ type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] });

export function defineNotices(sequelize: Sequelize) {
  Subscription.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      userId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      everything: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      services: codes(),
      sites: codes(),
    },
    { sequelize, tableName: 'subscriptions' },
  );
  Contact.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.TEXT, allowNull: false },
      email: { type: DataTypes.TEXT, allowNull: false },
      organisation: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      everything: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      services: codes(),
      sites: codes(),
    },
    { sequelize, tableName: 'contacts' },
  );
  Notice.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      eventKey: { type: DataTypes.TEXT, allowNull: false },
      eventKind: { type: DataTypes.TEXT, allowNull: false },
      eventCode: { type: DataTypes.TEXT, allowNull: false },
      address: { type: DataTypes.TEXT, allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false },
      htmlBody: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'waiting' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      messageId: { type: DataTypes.TEXT, allowNull: true },
      sentAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: 'notices', updatedAt: false },
  );
}
