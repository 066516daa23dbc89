import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** Who did what, when: an append-only log the owner can read. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare teamId: number | null;
  declare actorId: number | null;
  declare action: string;
  declare subjectType: string | null;
  declare subjectId: number | null;
  declare data: CreationOptional<Record<string, unknown> | null>;
  declare createdAt: CreationOptional<Date>;
}

AuditEvent.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: true },
    actorId: { type: DataTypes.INTEGER, allowNull: true },
    action: { type: DataTypes.STRING(64), allowNull: false },
    subjectType: { type: DataTypes.STRING(32), allowNull: true },
    subjectId: { type: DataTypes.INTEGER, allowNull: true },
    data: { type: DataTypes.JSON, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize: db(), modelName: 'AuditEvent', tableName: 'audit_events', updatedAt: false },
);
