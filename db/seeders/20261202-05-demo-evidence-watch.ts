import type { Sequelize } from 'sequelize';
import { DEMO_NOTICES } from '../../lib/citations/fake-crossref-server';
import { flagCandidates, flagRow } from '../../lib/watch/flags';
import type { EvidenceNotice } from '../../lib/watch/notices';
import { DEMO_TEAM } from './demo-accounts';

/**
 * The evidence watch as if it had run once against the local registry fake
 * (lib/citations/fake-crossref-server.ts): the demo study 10.5555/hjts.2022.0333, which the fake
 * says is retracted, carries the retraction, and the public "cold plunges" verdict that cites it
 * is flagged "evidence changed" with the dry run without it. The fake's other notice (a
 * correction of 10.5555/hjts.2020.0421, cited by the pull-up ladder verdict) is left for the
 * first run of the watch to find. Rows are written with the query interface; the flag's reason
 * and dry run come from the watch's own code, as a run would write them.
 */

const RETRACTED = DEMO_NOTICES.find((n) => n.kind === 'retraction')!;

export async function up({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  const [[team]] = (await sequelize.query('SELECT id FROM teams WHERE slug = ?', {
    replacements: [DEMO_TEAM.slug],
  })) as [{ id: number }[], unknown];
  const [[study]] = (await sequelize.query('SELECT id FROM studies WHERE "teamId" = ? AND doi = ?', {
    replacements: [team.id, RETRACTED.doi],
  })) as [{ id: number }[], unknown];
  if (!study) throw new Error(`Demo seed: no study ${RETRACTED.doi}`);
  const [y, m, d] = RETRACTED.date;
  const notice: EvidenceNotice = {
    kind: RETRACTED.kind,
    noticeDoi: RETRACTED.noticeDoi,
    date: `${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`,
  };
  const now = new Date();
  await q.bulkInsert('doi_checks', [
    {
      doi: RETRACTED.doi,
      found: true,
      notices: JSON.stringify([notice]),
      checkedAt: now,
      createdAt: now,
      updatedAt: now,
    },
  ]);
  await q.bulkUpdate('studies', { evidenceNotice: JSON.stringify(notice) }, { id: study.id });

  const flags = await flagCandidates(team.id, new Map([[study.id, notice]]));
  if (!flags.length) throw new Error('Demo seed: no published verdict cites the retracted demo study');
  await q.bulkInsert(
    'evidence_flags',
    flags.map((f) => ({ ...flagRow(f), dryRun: JSON.stringify(f.dryRun), createdAt: now, updatedAt: now })),
  );
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  await q.bulkDelete('evidence_flags', { noticeDoi: RETRACTED.noticeDoi });
  await q.bulkUpdate('studies', { evidenceNotice: null }, { doi: RETRACTED.doi });
  await q.bulkDelete('doi_checks', { doi: RETRACTED.doi });
}
