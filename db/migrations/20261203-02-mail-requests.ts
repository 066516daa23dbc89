import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * `mail_requests`: how many account mails (sign-up links, their resends, password resets) were
 * asked for per client address and per recipient in the current window (lib/auth/mail-limit.ts).
 * In the database so that several server processes count the same requests. Written with the
 * query interface only, so it runs on SQLite and PostgreSQL.
 */
export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('mail_requests', {
    // `mail-addr:<client address>` or `mail-to:<e-mail address>`.
    key: { type: DataTypes.STRING(300), primaryKey: true, allowNull: false },
    count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    windowStartedAt: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('mail_requests');
}
