/** How far each running import is, by the id its client chose (migration 0010; server/services/import/progress.ts). */
import { DataTypes, Model, type Sequelize } from 'sequelize';
import type { ImportStage } from '@/shared/schemas/import';

export class ImportProgressRow extends Model {
  declare id: string;
  declare stage: ImportStage;
  declare done: number;
  declare total: number;
  declare updatedAt: Date;
}

export function defineImportProgress(sequelize: Sequelize) {
  ImportProgressRow.init(
    {
      id: { type: DataTypes.TEXT, primaryKey: true },
      stage: { type: DataTypes.TEXT, allowNull: false },
      done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    },
    { sequelize, tableName: 'import_progress', createdAt: false },
  );
}
