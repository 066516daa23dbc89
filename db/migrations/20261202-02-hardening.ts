import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Hardening of sessions and sign-in:
 * - `users.sessionGeneration`: every session cookie carries the generation it was issued under;
 *   signing out or a password reset bumps it, which ends every session of that person on every
 *   device at once (a copied cookie dies too).
 * - `sign_in_throttles`: failed sign-ins per e-mail and per client address, in the database so
 *   that several server processes count the same tries (see DEVELOPERS.md, "Sign-in throttling").
 */
export async function up({ context: q }: { context: QueryInterface }) {
  await q.addColumn('users', 'sessionGeneration', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await q.createTable('sign_in_throttles', {
    // `email:<address>` or `addr:<client address>`.
    key: { type: DataTypes.STRING(300), primaryKey: true, allowNull: false },
    failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    firstFailureAt: { type: DataTypes.DATE, allowNull: false },
    lastFailureAt: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.dropTable('sign_in_throttles');
  await q.removeColumn('users', 'sessionGeneration');
}
