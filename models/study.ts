import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';
import type { EvidenceNotice } from '@/lib/watch/notices';

/**
 * One entry of a team's evidence library: the reference as CSL-JSON plus what the appraisal
 * needs (design, population, dose, effect data). Columns copied out of the CSL (doi, title,
 * year, journal, citation) exist for sorting, searching and the duplicate check.
 */
export class Study extends Model<InferAttributes<Study>, InferCreationAttributes<Study>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare createdById: number | null;
  declare csl: Record<string, unknown>;
  declare doi: string | null;
  declare title: string;
  declare fingerprint: string;
  declare year: number | null;
  declare journal: string | null;
  /** Author–year form, e.g. "Holt & Wren, 2024". */
  declare citation: string;
  declare design: string | null;
  declare population: string | null;
  declare injured: CreationOptional<boolean>;
  declare n: number | null;
  declare intensity: number | null;
  declare durationWeeks: number | null;
  declare outcome: string | null;
  declare effect: Record<string, unknown> | null;
  declare tags: string[];
  /** Storage key of the uploaded PDF (lib/storage), never a path the client sees. */
  declare pdfKey: string | null;
  /** The most serious update notice the evidence watch found (retraction, correction …), or null. */
  declare evidenceNotice: CreationOptional<EvidenceNotice | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Study.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    createdById: { type: DataTypes.INTEGER, allowNull: true },
    csl: { type: DataTypes.JSON, allowNull: false },
    doi: { type: DataTypes.STRING(300), allowNull: true },
    title: { type: DataTypes.STRING(1000), allowNull: false },
    fingerprint: { type: DataTypes.STRING(300), allowNull: false },
    year: { type: DataTypes.INTEGER, allowNull: true },
    journal: { type: DataTypes.STRING(500), allowNull: true },
    citation: { type: DataTypes.STRING(300), allowNull: false },
    design: { type: DataTypes.STRING(24), allowNull: true },
    population: { type: DataTypes.STRING(16), allowNull: true },
    injured: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    n: { type: DataTypes.INTEGER, allowNull: true },
    intensity: { type: DataTypes.FLOAT, allowNull: true },
    durationWeeks: { type: DataTypes.FLOAT, allowNull: true },
    outcome: { type: DataTypes.STRING(500), allowNull: true },
    effect: { type: DataTypes.JSON, allowNull: true },
    tags: { type: DataTypes.JSON, allowNull: false },
    pdfKey: { type: DataTypes.STRING(300), allowNull: true },
    evidenceNotice: { type: DataTypes.JSON, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Study', tableName: 'studies' },
);
