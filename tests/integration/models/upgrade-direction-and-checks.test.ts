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
    const now = new Date();
    const stamp = { createdAt: now, updatedAt: now };
    // The rows the appraisal and studies point at, as that schema had them.
    await q.bulkInsert('users', [{ id: 1, name: 'A coach', email: 'coach@example.test', passwordHash: 'x', ...stamp }]);
    await q.bulkInsert('teams', [{ id: 1, name: 'A team', slug: 'a-team', ...stamp }]);
    await q.bulkInsert('reviews', [
      {
        id: 1,
        teamId: 1,
        authorId: 1,
        title: 'A review',
        slug: 'a-review',
        claim: 'A claim',
        protocol: JSON.stringify({}),
        body: JSON.stringify({ type: 'doc', content: [] }),
        recommendations: JSON.stringify({}),
        tags: '[]',
        ...stamp,
      },
    ]);
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

    const [appraisals] = (await db().query('SELECT "needsCheck", "directionReason" FROM appraisals')) as [
      { needsCheck: number | boolean; directionReason: string | null }[],
      unknown,
    ];
    expect(appraisals.map((a) => ({ ...a, needsCheck: Boolean(a.needsCheck) }))).toEqual([
      { needsCheck: true, directionReason: null },
    ]);
    const [studies] = (await db().query('SELECT id, effect FROM studies ORDER BY id')) as [
      { id: number; effect: string | object }[],
      unknown,
    ];
    // SQLite hands JSON back as text, PostgreSQL parsed.
    const effect = (value: string | object) => (typeof value === 'string' ? JSON.parse(value) : value);
    expect(effect(studies[0].effect)).toEqual({ kind: 'ready', effectSize: 0.31, variance: 0.02, measure: 'smd' });
    expect(effect(studies[1].effect)).toEqual({ kind: 't', t: 2, n1: 10, n2: 10 });
    const [[review]] = (await db().query(
      db().getDialect() === 'postgres'
        ? "SELECT column_default AS dflt_value FROM information_schema.columns WHERE table_name = 'reviews' AND column_name = 'outcomeDesirable'"
        : "SELECT dflt_value FROM pragma_table_info('reviews') WHERE name = 'outcomeDesirable'",
    )) as [{ dflt_value: string }[], unknown];
    expect(review.dflt_value).toContain('higher');
  });
});
