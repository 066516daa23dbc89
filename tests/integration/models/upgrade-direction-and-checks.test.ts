import { afterAll, describe, expect, it } from 'vitest';
import { SequelizeStorage, Umzug } from 'umzug';
import type { QueryInterface } from 'sequelize';
import { migrations } from '@/db/migrations';
import { db } from '@/lib/db';

/**
 * Upgrading a database that already holds appraisals and ready effect sizes: the appraisals are
 * marked as needing a check, and { yi, vi } becomes { effectSize, variance }.
 */

afterAll(async () => {
  await db().close();
});

describe('migration 20261202-01-direction-and-checks', () => {
  it('marks earlier appraisals as needing a check and renames the effect-size fields', async () => {
    const q = db().getQueryInterface();
    const umzug = new Umzug<QueryInterface>({
      migrations,
      context: q,
      storage: new SequelizeStorage({ sequelize: db(), tableName: 'schema_migrations' }),
      logger: undefined,
    });
    await umzug.up({ to: '20261201-0004-publishing' });
    await db().query('PRAGMA foreign_keys = OFF');
    const now = new Date();
    const stamp = { createdAt: now, updatedAt: now };
    await q.bulkInsert('studies', [
      {
        id: 1,
        teamId: 1,
        csl: JSON.stringify({}),
        title: 'A ready effect',
        fingerprint: 'a',
        citation: 'A 2024',
        tags: '[]',
        effect: JSON.stringify({ kind: 'ready', yi: 0.31, vi: 0.02, measure: 'smd' }),
        ...stamp,
      },
      {
        id: 2,
        teamId: 1,
        csl: JSON.stringify({}),
        title: 'Means',
        fingerprint: 'b',
        citation: 'B 2024',
        tags: '[]',
        effect: JSON.stringify({ kind: 't', t: 2, n1: 10, n2: 10 }),
        ...stamp,
      },
    ]);
    await q.bulkInsert('appraisals', [
      { id: 1, reviewId: 1, studyId: 1, mechanismId: null, direction: 'supports', ...stamp },
    ]);

    await umzug.up();

    const [appraisals] = (await db().query('SELECT needsCheck, directionReason FROM appraisals')) as [
      { needsCheck: number; directionReason: string | null }[],
      unknown,
    ];
    expect(appraisals).toEqual([{ needsCheck: 1, directionReason: null }]);
    const [studies] = (await db().query('SELECT id, effect FROM studies ORDER BY id')) as [
      { id: number; effect: string }[],
      unknown,
    ];
    expect(JSON.parse(studies[0].effect)).toEqual({ kind: 'ready', effectSize: 0.31, variance: 0.02, measure: 'smd' });
    expect(JSON.parse(studies[1].effect)).toEqual({ kind: 't', t: 2, n1: 10, n2: 10 });
    const [[review]] = (await db().query(
      "SELECT dflt_value FROM pragma_table_info('reviews') WHERE name = 'outcomeDesirable'",
    )) as [{ dflt_value: string }[], unknown];
    expect(review.dflt_value).toContain('higher');
  });
});
