import { DataTypes, Model, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { db } from '@/lib/db';

/** Account mails asked for under one key (`mail-addr:…` or `mail-to:…`) in the current window; see lib/auth/mail-limit.ts. */
export class MailRequest extends Model<InferAttributes<MailRequest>, InferCreationAttributes<MailRequest>> {
  declare key: string;
  declare count: number;
  declare windowStartedAt: Date;
}

MailRequest.init(
  {
    key: { type: DataTypes.STRING(300), primaryKey: true, allowNull: false },
    count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    windowStartedAt: { type: DataTypes.DATE, allowNull: false },
  },
  { sequelize: db(), modelName: 'MailRequest', tableName: 'mail_requests', timestamps: false },
);
