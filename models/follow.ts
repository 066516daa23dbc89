import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** Someone who gets an e-mail when the team publishes a new verdict or a new version. */
export class Follow extends Model<InferAttributes<Follow>, InferCreationAttributes<Follow>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare userId: number;
  /** Random per follow; lib/follows signs unsubscribe links with it, so unfollowing voids them. */
  declare tokenSalt: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Follow.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: false },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    tokenSalt: { type: DataTypes.STRING(32), allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'Follow', tableName: 'follows' },
);
