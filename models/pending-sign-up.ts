import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/**
 * A sign-up waiting for its e-mailed link (lib/auth/sign-up.ts). The password is stored hashed
 * as it will be on the account; only the link's SHA-256 is stored; spent once, within a day.
 */
export class PendingSignUp extends Model<InferAttributes<PendingSignUp>, InferCreationAttributes<PendingSignUp>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare teamName: string;
  declare passwordHash: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

PendingSignUp.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    teamName: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'PendingSignUp', tableName: 'pending_sign_ups' },
);
