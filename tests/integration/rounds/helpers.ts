import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as reviews from '@/app/api/reviews/route';
import { db } from '@/lib/db';
import type { Client } from '../../helpers/app';
import { newReview, type TeamFixture } from '../reviews/helpers';

/** A review by the fixture's first coach with three mechanisms, ready for a round. */
export async function reviewWithMechanisms(
  t: TeamFixture,
  title: string,
): Promise<{ reviewId: number; mechanismIds: number[] }> {
  const created = await t.coach.call(reviews.POST, { json: newReview(t.teamId, { title }) });
  if (created.status !== 201) throw new Error(`review: ${JSON.stringify(created.body)}`);
  const reviewId: number = created.body.review.id;
  const mechanismIds: number[] = [];
  for (const [name, prior] of [
    ['Neural drive to the finger flexors', 0.6],
    ['Tendon stiffening', 0.3],
    ['Learning the test', 0.5],
  ] as const) {
    const res = await t.coach.call(mechanisms.POST, { params: { id: String(reviewId) }, json: { name, prior } });
    if (res.status !== 201) throw new Error(`mechanism: ${JSON.stringify(res.body)}`);
    mechanismIds.push(res.body.mechanism.id);
  }
  return { reviewId, mechanismIds };
}

export const inDays = (days: number) => new Date(Date.now() + days * 24 * 60 * 60 * 1000).toISOString();

/** Every row of the peer-review tables and the review statuses: equal snapshots mean nothing changed. */
export async function roundSnapshot(): Promise<Record<string, unknown>> {
  const out: Record<string, unknown> = {};
  for (const table of ['review_rounds', 'round_invitations', 'scorecards', 'review_comments']) {
    const [rows] = await db().query(`SELECT * FROM ${table} ORDER BY id`);
    out[table] = rows;
  }
  const [statuses] = await db().query('SELECT id, status, version FROM reviews ORDER BY id');
  out.reviews = statuses;
  const [[audit]] = (await db().query('SELECT COUNT(*) AS n FROM audit_events')) as [{ n: number }[], unknown];
  out.audit = audit.n;
  return out;
}

export type { Client };
