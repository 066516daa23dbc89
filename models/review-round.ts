import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** One settled disagreement: what the author did about a flagged mechanism (lib/rounds validates it). */
export interface StoredResolution {
  mechanismId: number;
  kind: string;
  reason: string;
  byId: number;
  at: string;
}

/** A peer-review round of a review: who opened it, when it is due, open or closed. */
export class ReviewRound extends Model<InferAttributes<ReviewRound>, InferCreationAttributes<ReviewRound>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare teamId: number;
  declare openedById: number | null;
  declare openedAt: Date;
  declare dueAt: Date;
  declare status: CreationOptional<string>;
  declare closedAt: CreationOptional<Date | null>;
  declare closedById: CreationOptional<number | null>;
  declare outcome: CreationOptional<string | null>;
  declare resolutions: CreationOptional<StoredResolution[]>;
  declare note: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

ReviewRound.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reviewId: { type: DataTypes.INTEGER, allowNull: false },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    openedById: { type: DataTypes.INTEGER, allowNull: true },
    openedAt: { type: DataTypes.DATE, allowNull: false },
    dueAt: { type: DataTypes.DATE, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'open' },
    closedAt: { type: DataTypes.DATE, allowNull: true },
    closedById: { type: DataTypes.INTEGER, allowNull: true },
    outcome: { type: DataTypes.STRING(16), allowNull: true },
    resolutions: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'ReviewRound', tableName: 'review_rounds' },
);
