import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as one from '@/app/api/reviews/[id]/route';
import * as verdict from '@/app/api/reviews/[id]/verdict/route';
import * as reviews from '@/app/api/reviews/route';
import * as studies from '@/app/api/studies/route';
import { Appraisal } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from '../reviews/helpers';

// SQLite has one writer: writes that arrive together queue in the process (lib/sqlite-writer.ts)
// instead of racing for the file lock and failing with SQLITE_BUSY as 500s.
useTestApp();
let t: TeamFixture;
let reviewId: number;
const studyIds: number[] = [];

beforeAll(async () => {
  t = await makeTeam('cw');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
  for (let i = 0; i < 50; i++) {
    const res = await t.coach.call(studies.POST, {
      json: { teamId: t.teamId, title: `Concurrent study ${i}`, year: 2000 + (i % 25), design: 'cohort' },
    });
    studyIds.push(res.body.studies[0].id);
  }
});

describe('writes at the same moment', () => {
  it('50 appraisals created at once: every one answers 201 and is in the database', async () => {
    const results = await Promise.all(
      studyIds.map((studyId) =>
        t.coach.call(appraisals.POST, {
          params: { id: String(reviewId) },
          json: { studyId, mechanismId: null, direction: 'supports' },
        }),
      ),
    );
    expect(results.map((r) => r.status).filter((s) => s !== 201)).toEqual([]);
    const stored = await Appraisal.count({ where: { reviewId } });
    expect(stored).toBe(50);
  });

  it('20 saves of one review from the same stale version: exactly one wins, the rest are 409', async () => {
    const current = await t.coach.call(one.GET, { params: { id: String(reviewId) } });
    const version = current.body.review.version;
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        t.coach.call(one.PATCH, { params: { id: String(reviewId) }, json: { version, title: `Save ${i}` } }),
      ),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
  });

  it('20 stale saves that change the protocol (a write transaction, not one UPDATE): exactly one wins', async () => {
    const current = await t.coach.call(one.GET, { params: { id: String(reviewId) } });
    const { version, protocol } = current.body.review;
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        t.coach.call(one.PATCH, {
          params: { id: String(reviewId) },
          json: { version, protocol: { ...protocol, weeks: 2 + i } },
        }),
      ),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    const after = await t.coach.call(one.GET, { params: { id: String(reviewId) } });
    const winner = results.find((r) => r.status === 200)!.body.review;
    expect(after.body.review.version).toBe(version + 1);
    expect(after.body.review.protocol.weeks).toBe(winner.protocol.weeks);
  });

  it('saves of two reviews and appraisals of both at the same moment: every write lands, each verdict matches its rows', async () => {
    const other = (
      await t.coach.call(reviews.POST, { json: newReview(t.teamId, { claim: 'A second claim at once.' }) })
    ).body.review;
    const targets = [reviewId, other.id as number];
    const versions = new Map<number, number>();
    for (const id of targets)
      versions.set(id, (await t.coach.call(one.GET, { params: { id: String(id) } })).body.review.version);
    const fresh = studyIds.slice(0, 10);
    const results = await Promise.all([
      ...targets.map((id) =>
        t.coach.call(one.PATCH, {
          params: { id: String(id) },
          json: { version: versions.get(id), claimSource: `Saved beside appraisals ${id}` },
        }),
      ),
      ...fresh.map((studyId) =>
        t.coach.call(appraisals.POST, {
          params: { id: String(other.id) },
          json: { studyId, mechanismId: null, direction: 'supports' },
        }),
      ),
    ]);
    expect(results.map((r) => r.status).filter((s) => s !== 200 && s !== 201)).toEqual([]);
    expect(await Appraisal.count({ where: { reviewId: other.id } })).toBe(fresh.length);
    for (const id of targets) {
      const read = await t.coach.call(one.GET, { params: { id: String(id) } });
      expect(read.body.review.claimSource).toBe(`Saved beside appraisals ${id}`);
      // The cached verdict (what lists filter by) is the one the rows give now.
      const scored = await t.coach.call(verdict.GET, { params: { id: String(id) } });
      expect(read.body.review.verdict).toBe(scored.body.verdict);
    }
  });
});
