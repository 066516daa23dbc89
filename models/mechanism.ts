import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** A candidate mechanism that could explain a claim's result (README, "How the work flows", step 2). */
export class Mechanism extends Model<InferAttributes<Mechanism>, InferCreationAttributes<Mechanism>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare name: string;
  declare kind: CreationOptional<string>;
  declare summary: CreationOptional<string>;
  /** Least intensity (fraction of maximum, 0…1) the mechanism needs, if any. */
  declare minIntensity: number | null;
  declare minEffort: string | null;
  declare prior: CreationOptional<number>;
  declare magnitude: CreationOptional<string>;
  /** The claim names this mechanism as the reason it works. */
  declare stated: CreationOptional<boolean>;
  /** Which way this mechanism's measure is desirable (docs/scoring.md §10). */
  declare desirable: CreationOptional<string>;
  declare position: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Mechanism.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reviewId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'physiological' },
    summary: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    minIntensity: { type: DataTypes.FLOAT, allowNull: true },
    minEffort: { type: DataTypes.STRING(16), allowNull: true },
    prior: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0.5 },
    magnitude: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'moderate' },
    stated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    desirable: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'higher' },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Mechanism', tableName: 'mechanisms' },
);
