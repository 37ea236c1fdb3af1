/** Document metadata; the bytes are in the object store (migration 0005; server/documents/README.md). */
import { DataTypes, Model, type Sequelize } from 'sequelize';

export class DocumentRow extends Model {
  declare id: number;
  declare ownerKind: string;
  declare ownerCode: string;
  declare name: string;
  declare type: string;
  declare size: number;
  declare sha256: string;
  declare objectKey: string;
  declare previewKey: string | null;
  declare createdBy: string;
  declare createdAt: Date;
}

export function defineDocuments(sequelize: Sequelize) {
  DocumentRow.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      ownerKind: { type: DataTypes.TEXT, allowNull: false },
      ownerCode: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      type: { type: DataTypes.TEXT, allowNull: false },
      size: { type: DataTypes.BIGINT, allowNull: false },
      sha256: { type: DataTypes.TEXT, allowNull: false },
      objectKey: { type: DataTypes.TEXT, allowNull: false, unique: true },
      previewKey: { type: DataTypes.TEXT, allowNull: true },
      createdBy: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    },
    { sequelize, tableName: 'documents', updatedAt: false },
  );
}
