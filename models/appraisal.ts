import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/**
 * One study appraised against one mechanism of a review, or against the claimed outcome itself
 * (mechanismId null): its direction and the GRADE domains (PRODUCT.md step 4). Certainty and
 * applicability are not stored: the scoring engine derives them on every read, so a change to a
 * study's design or population shows up everywhere at once.
 */
export class Appraisal extends Model<InferAttributes<Appraisal>, InferCreationAttributes<Appraisal>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare studyId: number;
  declare mechanismId: number | null;
  declare direction: string;
  declare riskOfBias: CreationOptional<string>;
  declare inconsistency: CreationOptional<string>;
  declare indirectness: CreationOptional<string>;
  declare imprecision: CreationOptional<string>;
  declare publicationBias: CreationOptional<string>;
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

/**
 * A fresh definition per attribute: Sequelize writes the column name into the object it is
 * given, so one object shared by five attributes maps all five onto the last one's column.
 */
const concern = () => ({ type: DataTypes.STRING(16), allowNull: false, defaultValue: 'none' });

Appraisal.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reviewId: { type: DataTypes.INTEGER, allowNull: false },
    studyId: { type: DataTypes.INTEGER, allowNull: false },
    mechanismId: { type: DataTypes.INTEGER, allowNull: true },
    direction: { type: DataTypes.STRING(16), allowNull: false },
    riskOfBias: concern(),
    inconsistency: concern(),
    indirectness: concern(),
    imprecision: concern(),
    publicationBias: concern(),
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
