import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/**
 * A claim review: the claim, its protocol and population, the written analysis and its status.
 * Enumerations and JSON shapes are plain here (models never import lib/<domain>); lib/reviews
 * validates them on the way in with zod and narrows them on the way out.
 */
export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare authorId: number;
  declare title: string;
  declare slug: string;
  declare claim: string;
  declare claimSource: CreationOptional<string>;
  declare claimUrl: string | null;
  /** The dose as entered; the one intensity scale is derived on read (lib/reviews/protocol.ts). */
  declare protocol: Record<string, unknown>;
  declare populationStatus: string | null;
  declare populationInjured: CreationOptional<boolean>;
  /** Which way the claimed outcome's measure is desirable (docs/scoring.md §10). */
  declare outcomeDesirable: CreationOptional<string>;
  declare status: CreationOptional<string>;
  /** Tiptap (ProseMirror) JSON document. */
  declare body: Record<string, unknown>;
  declare recommendations: Record<string, string>;
  declare tags: string[];
  /** Cached verdict key, recomputed by lib/reviews after every write that can change it. */
  declare verdict: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Review.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    authorId: { type: DataTypes.INTEGER, allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    slug: { type: DataTypes.STRING(80), allowNull: false },
    claim: { type: DataTypes.STRING(500), allowNull: false },
    claimSource: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    claimUrl: { type: DataTypes.STRING(2000), allowNull: true },
    protocol: { type: DataTypes.JSON, allowNull: false },
    populationStatus: { type: DataTypes.STRING(16), allowNull: true },
    populationInjured: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    outcomeDesirable: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'higher' },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'draft' },
    body: { type: DataTypes.JSON, allowNull: false },
    recommendations: { type: DataTypes.JSON, allowNull: false },
    tags: { type: DataTypes.JSON, allowNull: false },
    verdict: { type: DataTypes.STRING(16), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Review', tableName: 'reviews' },
);
