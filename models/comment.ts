import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** A threaded comment on a review, anchored to one mechanism or (mechanismId null) the whole review. */
export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare roundId: number | null;
  declare mechanismId: number | null;
  declare authorId: number | null;
  declare parentId: number | null;
  declare body: string;
  declare resolved: CreationOptional<boolean>;
  declare resolvedById: CreationOptional<number | null>;
  declare resolvedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Comment.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reviewId: { type: DataTypes.INTEGER, allowNull: false },
    roundId: { type: DataTypes.INTEGER, allowNull: true },
    mechanismId: { type: DataTypes.INTEGER, allowNull: true },
    authorId: { type: DataTypes.INTEGER, allowNull: true },
    parentId: { type: DataTypes.INTEGER, allowNull: true },
    body: { type: DataTypes.TEXT, allowNull: false },
    resolved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    resolvedById: { type: DataTypes.INTEGER, allowNull: true },
    resolvedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Comment', tableName: 'review_comments' },
);
