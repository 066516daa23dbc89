import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Sign-up confirmed by e-mail (docs/api/README.md, "Accounts and teams"): a sign-up waits here,
 * its password already hashed, until the link mailed to the address is opened. Only the link's
 * SHA-256 is stored. Written with the query interface only, so it runs on SQLite and PostgreSQL.
 */
export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('pending_sign_ups', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    teamName: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await q.addIndex('pending_sign_ups', ['email'], { name: 'pending_sign_ups_email' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('pending_sign_ups');
}
