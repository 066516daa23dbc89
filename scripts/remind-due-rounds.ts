import { loadLocalEnv } from './boot';

/**
 * `npm run rounds:remind`: mails every invited reviewer whose round is due within 24 hours and
 * who has not submitted, once per invitation. Safe to run as often as you like (hourly from
 * cron, a systemd timer or the host's scheduler): a reminder already sent is recorded and never
 * repeated. Uses the same DATABASE_URL and SMTP settings as the app (.env / .env.local).
 *
 *   0 * * * *  cd /srv/loadbearing && npm run rounds:remind
 */
loadLocalEnv();

async function main() {
  const { db } = await import('../lib/db');
  const { remindDueRounds } = await import('../lib/rounds/reminders');
  const { reminded, failed } = await remindDueRounds();
  console.log(`Reminders sent: ${reminded.length}${reminded.length ? ` (${reminded.join(', ')})` : ''}`);
  if (failed.length) console.error(`Reminders that the mail relay refused (retried next run): ${failed.join(', ')}`);
  await db().close();
  if (failed.length) process.exitCode = 1;
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
