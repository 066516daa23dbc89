import { randomBytes } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { buildSnapshot } from '../../lib/publishing/snapshot';
import { DEMO_TEAM } from './demo-accounts';

/**
 * Two published demo verdicts and a follower:
 * - "cold plunges" (approved in the workbench seed): public, at version 2 — version 1 as it was,
 *   then the coach's "what to do instead" advice added, with the "what changed" note;
 * - "weighted pull-up ladder" (approved by the closed round of the 0003 seed): team members only;
 * - the demo athlete Jonah Vale follows the team.
 * Snapshots come from the app's own snapshot code (lib/publishing), as a publish would make them;
 * rows are written with the query interface like the other seeders.
 */

type Q = ReturnType<Sequelize['getQueryInterface']>;

async function one<T>(sequelize: Sequelize, sql: string, replacements: unknown[]): Promise<T> {
  const [[row]] = (await sequelize.query(sql, { replacements })) as [T[], unknown];
  if (!row) throw new Error(`Demo seed: no row for ${sql} ${JSON.stringify(replacements)}`);
  return row;
}

async function publish(
  sequelize: Sequelize,
  q: Q,
  opts: {
    teamId: number;
    reviewSlug: string;
    visibility: 'team' | 'public';
    publisherId: number;
    versions: { at: Date; note: string | null; before?: () => Promise<unknown> }[];
    markPublished: boolean;
  },
) {
  const review = await one<{ id: number }>(sequelize, 'SELECT id FROM reviews WHERE "teamId" = ? AND slug = ?', [
    opts.teamId,
    opts.reviewSlug,
  ]);
  const last = opts.versions[opts.versions.length - 1].at;
  await q.bulkInsert('publications', [
    {
      reviewId: review.id,
      teamId: opts.teamId,
      slug: opts.reviewSlug,
      visibility: opts.visibility,
      latestNumber: opts.versions.length,
      lastPublishedAt: last,
      withdrawnAt: null,
      withdrawnReason: null,
      withdrawnById: null,
      createdAt: opts.versions[0].at,
      updatedAt: last,
    },
  ]);
  const pub = await one<{ id: number }>(sequelize, 'SELECT id FROM publications WHERE "reviewId" = ?', [review.id]);
  for (const [i, v] of opts.versions.entries()) {
    await v.before?.();
    const snapshot = await buildSnapshot(review.id);
    if (!snapshot) throw new Error(`Demo seed: could not snapshot ${opts.reviewSlug}`);
    await q.bulkInsert('published_versions', [
      {
        publicationId: pub.id,
        number: i + 1,
        publishedById: opts.publisherId,
        changeNote: v.note,
        snapshot: JSON.stringify(snapshot),
        createdAt: v.at,
      },
    ]);
  }
  if (opts.markPublished) await q.bulkUpdate('reviews', { status: 'published' }, { id: review.id });
}

export async function up({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  const team = await one<{ id: number }>(sequelize, 'SELECT id FROM teams WHERE slug = ?', [DEMO_TEAM.slug]);
  const owner = await one<{ id: number }>(sequelize, 'SELECT id FROM users WHERE email = ?', [
    'owner@granite-hollow.test',
  ]);
  const athlete = await one<{ id: number }>(sequelize, 'SELECT id FROM users WHERE email = ?', [
    'athlete@granite-hollow.test',
  ]);
  const day = 24 * 3600 * 1000;
  const now = Date.now();

  const cold = await one<{ id: number; recommendations: string | Record<string, string> }>(
    sequelize,
    'SELECT id, recommendations FROM reviews WHERE "teamId" = ? AND slug = ?',
    [team.id, 'cold-plunges-after-strength'],
  );
  // A JSON column reads back as text on SQLite and as an object on PostgreSQL.
  const finalAdvice = (
    typeof cold.recommendations === 'string' ? JSON.parse(cold.recommendations) : cold.recommendations
  ) as Record<string, string>;
  await publish(sequelize, q, {
    teamId: team.id,
    reviewSlug: 'cold-plunges-after-strength',
    visibility: 'public',
    publisherId: owner.id,
    markPublished: true,
    versions: [
      {
        at: new Date(now - 20 * day),
        note: null,
        // Version 1 went out before the coach wrote the "what to do instead" advice.
        before: () =>
          q.bulkUpdate(
            'reviews',
            { recommendations: JSON.stringify({ ...finalAdvice, whatInstead: '' }) },
            { id: cold.id },
          ),
      },
      {
        at: new Date(now - 6 * day),
        note: 'Added what to do instead after athletes asked how to recover between sessions.',
        before: () => q.bulkUpdate('reviews', { recommendations: JSON.stringify(finalAdvice) }, { id: cold.id }),
      },
    ],
  });
  await publish(sequelize, q, {
    teamId: team.id,
    reviewSlug: 'weighted-pull-up-ladder',
    visibility: 'team',
    publisherId: owner.id,
    // The peer-review seed's checks (tests/integration/rounds) expect this review to stay "approved"
    // after seeding; its publication is what the verdict page reads.
    markPublished: false,
    versions: [{ at: new Date(now - 2 * day), note: null }],
  });
  await q.bulkInsert('follows', [
    {
      teamId: team.id,
      userId: athlete.id,
      tokenSalt: randomBytes(16).toString('hex'),
      createdAt: new Date(now - 30 * day),
      updatedAt: new Date(now - 30 * day),
    },
  ]);
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const team = await one<{ id: number }>(sequelize, 'SELECT id FROM teams WHERE slug = ?', [DEMO_TEAM.slug]);
  const q = sequelize.getQueryInterface();
  // Versions go with their publications (foreign keys cascade).
  await q.bulkDelete('publications', { teamId: team.id });
  await q.bulkDelete('follows', { teamId: team.id });
  await q.bulkUpdate('reviews', { status: 'approved' }, { teamId: team.id, status: 'published' });
}
