import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';
import type { WatchSummaryDTO } from '@/lib/watch/types';

/** One run of the evidence watch over a team's library: progress while it runs, the summary after. */
export class WatchRun extends Model<InferAttributes<WatchRun>, InferCreationAttributes<WatchRun>> {
  declare id: CreationOptional<number>;
  declare teamId: number | null;
  /** 'schedule' (npm run evidence:watch) or 'member' (the button). */
  declare trigger: string;
  declare startedById: number | null;
  /** 'running', 'done' or 'failed'. */
  declare status: string;
  declare total: CreationOptional<number>;
  declare checked: CreationOptional<number>;
  declare error: string | null;
  declare summary: WatchSummaryDTO | null;
  declare finishedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

WatchRun.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    teamId: { type: DataTypes.INTEGER, allowNull: true },
    trigger: { type: DataTypes.STRING(16), allowNull: false },
    startedById: { type: DataTypes.INTEGER, allowNull: true },
    status: { type: DataTypes.STRING(16), allowNull: false },
    total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    checked: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    summary: { type: DataTypes.JSON, allowNull: true },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE },
    updatedAt: { type: DataTypes.DATE },
  },
  { sequelize: db(), modelName: 'WatchRun', tableName: 'watch_runs' },
);
