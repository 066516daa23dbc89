import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';
import type { DryRunDTO } from '@/lib/watch/types';

/**
 * "Evidence changed" on one published version: a study it cites received a notice. Stands until
 * a later version is published (lib/watch/flags.ts).
 */
export class EvidenceFlag extends Model<InferAttributes<EvidenceFlag>, InferCreationAttributes<EvidenceFlag>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare publicationId: number;
  declare versionNumber: number;
  declare studyId: number;
  declare kind: string;
  declare noticeDoi: string;
  declare noticeDate: string | null;
  declare reason: string;
  declare dryRun: DryRunDTO | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

EvidenceFlag.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    publicationId: { type: DataTypes.INTEGER, allowNull: false },
    versionNumber: { type: DataTypes.INTEGER, allowNull: false },
    studyId: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    noticeDoi: { type: DataTypes.STRING(300), allowNull: false },
    noticeDate: { type: DataTypes.STRING(10), allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: false },
    dryRun: { type: DataTypes.JSON, allowNull: true },
    createdAt: { type: DataTypes.DATE },
    updatedAt: { type: DataTypes.DATE },
  },
  { sequelize: db(), modelName: 'EvidenceFlag', tableName: 'evidence_flags' },
);
