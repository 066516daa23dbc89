import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';
import type { EvidenceNotice } from '@/lib/watch/notices';

/** What the bibliographic registry last said about one DOI, and when it was asked (lib/watch). */
export class DoiCheck extends Model<InferAttributes<DoiCheck>, InferCreationAttributes<DoiCheck>> {
  declare id: CreationOptional<number>;
  declare doi: string;
  /** False when the registry has no record of the DOI. */
  declare found: boolean;
  declare notices: EvidenceNotice[];
  declare checkedAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

DoiCheck.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    doi: { type: DataTypes.STRING(300), allowNull: false },
    found: { type: DataTypes.BOOLEAN, allowNull: false },
    notices: { type: DataTypes.JSON, allowNull: false },
    checkedAt: { type: DataTypes.DATE, allowNull: false },
    createdAt: { type: DataTypes.DATE },
    updatedAt: { type: DataTypes.DATE },
  },
  { sequelize: db(), modelName: 'DoiCheck', tableName: 'doi_checks' },
);
