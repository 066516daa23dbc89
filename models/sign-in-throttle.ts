import { DataTypes, Model, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** Recent failed sign-ins under one key (`email:…` or `addr:…`); see lib/auth/rate-limit.ts. */
export class SignInThrottle extends Model<InferAttributes<SignInThrottle>, InferCreationAttributes<SignInThrottle>> {
  declare key: string;
  declare failures: number;
  declare firstFailureAt: Date;
  declare lastFailureAt: Date;
}

SignInThrottle.init(
  {
    key: { type: DataTypes.STRING(300), primaryKey: true, allowNull: false },
    failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    firstFailureAt: { type: DataTypes.DATE, allowNull: false },
    lastFailureAt: { type: DataTypes.DATE, allowNull: false },
  },
  { sequelize: db(), modelName: 'SignInThrottle', tableName: 'sign_in_throttles', timestamps: false },
);
