import { loadLocalEnv } from './boot';

/**
 * `npm run evidence:watch`: for every team, asks the bibliographic registry (CROSSREF_BASE_URL)
 * about each DOI of its library not checked in the last 20 hours — one request at a time, with
 * back-off on 429 — marks retracted and corrected studies, flags the published verdicts that
 * cite them "evidence changed" and mails their authors and the team's owners, and offers new
 * library studies to verdicts' authors. Run it daily (cron, a systemd timer or the host's
 * scheduler); a run the registry cannot answer changes nothing and says so (exit code 1).
 *
 *   30 4 * * *  cd /srv/loadbearing && npm run evidence:watch
 */
loadLocalEnv();

async function main() {
  const { db } = await import('../lib/db');
  const { Team } = await import('../models');
  const { runWatch } = await import('../lib/watch/run');
  const teams = await Team.findAll({ attributes: ['id', 'name'], order: [['id', 'ASC']] });
  let failed = 0;
  for (const team of teams) {
    const run = await runWatch(team.id, { trigger: 'schedule' });
    const s = run.summary;
    if (run.status === 'failed') {
      failed += 1;
      console.error(`${team.name}: stopped, nothing changed — ${run.error}`);
      continue;
    }
    console.log(
      `${team.name}: ${s?.asked ?? 0} DOIs asked, ${s?.cached ?? 0} fresh in the cache, ` +
        `${s?.newNotices.length ?? 0} new notices, ${s?.flagged.length ?? 0} verdicts flagged, ` +
        `${s?.mailed ?? 0} mails, ${s?.suggestions ?? 0} new-evidence offers` +
        (s?.backoffs ? `, waited ${s.backoffs} times when the registry asked` : ''),
    );
  }
  await db().close();
  if (failed) process.exitCode = 1;
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
