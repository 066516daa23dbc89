import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';
import { perDomain, type DowngradeDomain } from '@/lib/scoring/appraisal-vocabulary';

/**
 * One study appraised against one mechanism of a review, or against the claimed outcome itself
 * (mechanismId null): its direction and the GRADE domains (README, "How the work flows", step 4). Certainty and
 * applicability are not stored: the scoring engine derives them on every read, so a change to a
 * study's design or population shows up everywhere at once.
 */
// eslint-disable-next-line @typescript-eslint/no-unsafe-declaration-merging -- the domain columns, below
export class Appraisal extends Model<InferAttributes<Appraisal>, InferCreationAttributes<Appraisal>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare studyId: number;
  declare mechanismId: number | null;
  declare direction: string;
  declare largeEffect: CreationOptional<number>;
  declare doseResponse: CreationOptional<boolean>;
  declare confoundingWouldReduce: CreationOptional<boolean>;
  declare applicabilityOverride: number | null;
  declare overrideReason: string | null;
  declare notes: CreationOptional<string>;
  /** Why the coach's direction differs from the one the study's effect suggests (docs/scoring.md §10). */
  declare directionReason: CreationOptional<string | null>;
  /** Saved before each domain had its own column: a coach must check and save it again. */
  declare needsCheck: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

// The domain columns (one per downgrade domain of the scoring model's vocabulary), declared here.
// eslint-disable-next-line @typescript-eslint/no-empty-object-type, @typescript-eslint/no-unsafe-declaration-merging
export interface Appraisal extends Record<DowngradeDomain, CreationOptional<string>> {}

// A fresh definition per column: Sequelize writes each column's name into the object it is given,
// so one object shared by the five domains mapped all of them onto the first column.
const concern = () => ({ type: DataTypes.STRING(16), allowNull: false, defaultValue: 'none' });

Appraisal.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reviewId: { type: DataTypes.INTEGER, allowNull: false },
    studyId: { type: DataTypes.INTEGER, allowNull: false },
    mechanismId: { type: DataTypes.INTEGER, allowNull: true },
    direction: { type: DataTypes.STRING(16), allowNull: false },
    ...perDomain(concern),
    largeEffect: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    doseResponse: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    confoundingWouldReduce: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    applicabilityOverride: { type: DataTypes.FLOAT, allowNull: true },
    overrideReason: { type: DataTypes.TEXT, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    directionReason: { type: DataTypes.TEXT, allowNull: true },
    needsCheck: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Appraisal', tableName: 'appraisals' },
);
