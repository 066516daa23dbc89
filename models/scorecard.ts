import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** One mechanism's rating on a scorecard, as stored (lib/validation/rounds.ts checks it on the way in). */
export interface StoredRating {
  mechanismId: number;
  band: number | null;
  contribution: string | null;
  comment: string;
}

/** A reviewer's blind scores in one round: a draft until `submittedAt` is set, then final. */
export class Scorecard extends Model<InferAttributes<Scorecard>, InferCreationAttributes<Scorecard>> {
  declare id: CreationOptional<number>;
  declare roundId: number;
  declare reviewerId: number;
  declare ratings: StoredRating[];
  declare overallComment: CreationOptional<string>;
  declare signOff: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Scorecard.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    roundId: { type: DataTypes.INTEGER, allowNull: false },
    reviewerId: { type: DataTypes.INTEGER, allowNull: false },
    ratings: { type: DataTypes.JSON, allowNull: false },
    overallComment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    signOff: { type: DataTypes.STRING(24), allowNull: true },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Scorecard', tableName: 'scorecards' },
);
