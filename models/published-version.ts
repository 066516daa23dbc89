import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/**
 * A published review: its global address (/v/<slug>), who may read it ('team' = signed-in
 * members, athletes included; 'public' = anyone), and whether it was withdrawn and why. The
 * versions under it are never changed or deleted; withdrawing only marks this row.
 */
export class Publication extends Model<InferAttributes<Publication>, InferCreationAttributes<Publication>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare teamId: number;
  declare slug: string;
  declare visibility: string;
  declare latestNumber: number;
  declare lastPublishedAt: Date;
  declare withdrawnAt: Date | null;
  declare withdrawnReason: string | null;
  declare withdrawnById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Publication.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reviewId: { type: DataTypes.INTEGER, allowNull: false },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    slug: { type: DataTypes.STRING(100), allowNull: false },
    visibility: { type: DataTypes.STRING(8), allowNull: false },
    latestNumber: { type: DataTypes.INTEGER, allowNull: false },
    lastPublishedAt: { type: DataTypes.DATE, allowNull: false },
    withdrawnAt: { type: DataTypes.DATE, allowNull: true },
    withdrawnReason: { type: DataTypes.TEXT, allowNull: true },
    withdrawnById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Publication', tableName: 'publications' },
);

/**
 * One immutable version: number, date, publisher, the "what changed" note (required from
 * version 2 on) and the snapshot the verdict page renders (lib/publishing/snapshot.ts). There is
 * no updatedAt: nothing ever updates a version.
 */
export class PublishedVersion extends Model<
  InferAttributes<PublishedVersion>,
  InferCreationAttributes<PublishedVersion>
> {
  declare id: CreationOptional<number>;
  declare publicationId: number;
  declare number: number;
  declare publishedById: number | null;
  declare changeNote: string | null;
  declare snapshot: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
}

PublishedVersion.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    publicationId: { type: DataTypes.INTEGER, allowNull: false },
    number: { type: DataTypes.INTEGER, allowNull: false },
    publishedById: { type: DataTypes.INTEGER, allowNull: true },
    changeNote: { type: DataTypes.TEXT, allowNull: true },
    snapshot: { type: DataTypes.JSON, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  {
    sequelize: db(),
    modelName: 'PublishedVersion',
    tableName: 'published_versions',
    updatedAt: false,
    // A version is written once; refusing updates here backs the rule up in code.
    hooks: {
      beforeUpdate: () => {
        throw new Error('A published version is immutable.');
      },
      beforeBulkUpdate: () => {
        throw new Error('A published version is immutable.');
      },
    },
  },
);
