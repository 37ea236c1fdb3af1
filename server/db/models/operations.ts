/** Planned works, incidents and incident steps (migration 0004-operations). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Element } from '@/shared/schemas/analysis';
import type { FrozenReach, WorkState } from '@/shared/schemas/operations';

export class PlannedWork extends Model<InferAttributes<PlannedWork>, InferCreationAttributes<PlannedWork>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare title: string;
  declare elements: Element[];
  declare startAt: Date;
  declare endAt: Date;
  declare notes: CreationOptional<string>;
  declare state: WorkState;
  declare requestedBy: number | null;
  declare requestedByEmail: string | null;
  declare approvedBy: CreationOptional<number | null>;
  declare approvedByEmail: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class Incident extends Model<InferAttributes<Incident>, InferCreationAttributes<Incident>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare title: string;
  declare elements: Element[];
  declare startedAt: Date;
  declare endedAt: CreationOptional<Date | null>;
  declare householdMinutes: CreationOptional<number | null>;
  declare carriageMinutes: CreationOptional<Record<string, number> | null>;
  declare openedBy: number | null;
  declare openedByEmail: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class IncidentStep extends Model<InferAttributes<IncidentStep>, InferCreationAttributes<IncidentStep>> {
  declare id: CreationOptional<number>;
  declare incidentId: number;
  declare idx: number;
  declare at: Date;
  declare note: CreationOptional<string>;
  declare added: CreationOptional<Element[]>;
  declare restored: CreationOptional<Element[]>;
  declare elements: Element[];
  declare networkVersion: number;
  declare reach: FrozenReach;
  declare byUserId: number | null;
  declare byEmail: string | null;
}

export function defineOperations(sequelize: Sequelize) {
  const who = (field: string) => ({ type: DataTypes.INTEGER, allowNull: true, field });
  const text = (field: string) => ({ type: DataTypes.TEXT, allowNull: true, field });
  PlannedWork.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      code: { type: DataTypes.TEXT, allowNull: false },
      title: { type: DataTypes.TEXT, allowNull: false },
      elements: { type: DataTypes.JSONB, allowNull: false },
      startAt: { type: DataTypes.DATE, allowNull: false, field: 'start_at' },
      endAt: { type: DataTypes.DATE, allowNull: false, field: 'end_at' },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      state: { type: DataTypes.TEXT, allowNull: false },
      requestedBy: who('requested_by'),
      requestedByEmail: text('requested_by_email'),
      approvedBy: who('approved_by'),
      approvedByEmail: text('approved_by_email'),
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'planned_works', modelName: 'PlannedWork' },
  );
  Incident.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      code: { type: DataTypes.TEXT, allowNull: false },
      title: { type: DataTypes.TEXT, allowNull: false },
      elements: { type: DataTypes.JSONB, allowNull: false },
      startedAt: { type: DataTypes.DATE, allowNull: false, field: 'started_at' },
      endedAt: { type: DataTypes.DATE, allowNull: true, field: 'ended_at' },
      householdMinutes: { type: DataTypes.BIGINT, allowNull: true, field: 'household_minutes' },
      carriageMinutes: { type: DataTypes.JSONB, allowNull: true, field: 'carriage_minutes' },
      openedBy: who('opened_by'),
      openedByEmail: text('opened_by_email'),
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'incidents', modelName: 'Incident' },
  );
  IncidentStep.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      incidentId: { type: DataTypes.INTEGER, allowNull: false, field: 'incident_id' },
      idx: { type: DataTypes.INTEGER, allowNull: false },
      at: { type: DataTypes.DATE, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      added: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      restored: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      elements: { type: DataTypes.JSONB, allowNull: false },
      networkVersion: { type: DataTypes.BIGINT, allowNull: false, field: 'network_version' },
      reach: { type: DataTypes.JSONB, allowNull: false },
      byUserId: who('by_user_id'),
      byEmail: text('by_email'),
    },
    { sequelize, tableName: 'incident_steps', modelName: 'IncidentStep', timestamps: false },
  );
}
