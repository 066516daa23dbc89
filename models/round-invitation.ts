import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** A reviewer invited to a round: when, whether they submitted, or why the round closed without them. */
export class RoundInvitation extends Model<InferAttributes<RoundInvitation>, InferCreationAttributes<RoundInvitation>> {
  declare id: CreationOptional<number>;
  declare roundId: number;
  declare reviewerId: number;
  declare invitedAt: Date;
  declare submittedAt: CreationOptional<Date | null>;
  declare closedWithoutReason: CreationOptional<string | null>;
  declare remindedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

RoundInvitation.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    roundId: { type: DataTypes.INTEGER, allowNull: false },
    reviewerId: { type: DataTypes.INTEGER, allowNull: false },
    invitedAt: { type: DataTypes.DATE, allowNull: false },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    closedWithoutReason: { type: DataTypes.TEXT, allowNull: true },
    remindedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'RoundInvitation', tableName: 'round_invitations' },
);
