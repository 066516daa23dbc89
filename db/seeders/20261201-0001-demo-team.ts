import bcrypt from 'bcryptjs';
import type { Sequelize } from 'sequelize';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_TEAM } from './demo-accounts';

// Seeders write rows with the query interface, not the models, so they keep working when later
// migrations add columns the models then require.
export async function up({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  const now = new Date();
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await q.bulkInsert('teams', [{ ...DEMO_TEAM, createdAt: now, updatedAt: now }]);
  const [[team]] = (await sequelize.query('SELECT id FROM teams WHERE slug = ?', {
    replacements: [DEMO_TEAM.slug],
  })) as [{ id: number }[], unknown];
  for (const account of DEMO_ACCOUNTS) {
    await q.bulkInsert('users', [
      { name: account.name, email: account.email, passwordHash, createdAt: now, updatedAt: now },
    ]);
    const [[user]] = (await sequelize.query('SELECT id FROM users WHERE email = ?', {
      replacements: [account.email],
    })) as [{ id: number }[], unknown];
    await q.bulkInsert('memberships', [
      { teamId: team.id, userId: user.id, role: account.role, createdAt: now, updatedAt: now },
    ]);
  }
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  await q.bulkDelete('users', { email: DEMO_ACCOUNTS.map((a) => a.email) });
  await q.bulkDelete('teams', { slug: DEMO_TEAM.slug });
}
