import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisalOne from '@/app/api/reviews/[id]/appraisals/[appraisalId]/route';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as publish from '@/app/api/reviews/[id]/publish/route';
import * as verdict from '@/app/api/reviews/[id]/verdict/route';
import * as reviews from '@/app/api/reviews/route';
import * as studies from '@/app/api/studies/route';
import { verdictPage } from '@/lib/publishing/queries';
import type { RobustnessDTO, VerdictDTO } from '@/lib/reviews/types';
import { Review } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from './helpers';

// The robustness of GET /api/reviews/:id/verdict (docs/scoring.md §9) through the real routes:
// rows' ids and citations, and a leave-one-out prediction that the review really takes when the
// study's appraisals are deleted.

useTestApp();
let t: TeamFixture;
let reviewId: number;
let mechanismId: number;
const ids: Record<string, number> = {};
const params = () => ({ id: String(reviewId) });

const addStudy = async (title: string, family: string) => {
  const res = await t.coach.call(studies.POST, {
    json: {
      teamId: t.teamId,
      title,
      authors: [{ family }],
      year: 2021,
      design: 'randomized',
      population: 'recreational',
      intensity: 0.8,
    },
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.studies[0] as { id: number; citation: string };
};
const appraise = async (studyId: number, mechanism: number | null, direction = 'supports') => {
  const res = await t.coach.call(appraisals.POST, {
    params: params(),
    json: { studyId, mechanismId: mechanism, direction },
  });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return res.body.appraisal.id as number;
};
const getVerdict = async (): Promise<VerdictDTO> => {
  const res = await t.coach.call(verdict.GET, { params: params() });
  expect(res.status).toBe(200);
  return res.body;
};

let citations: Record<string, string>;
let keyAppraisals: number[];

beforeAll(async () => {
  t = await makeTeam('robust');
  reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
  mechanismId = (
    await t.coach.call(mechanisms.POST, { params: params(), json: { name: 'Tendon stiffness', stated: true } })
  ).body.mechanism.id;
  const key = await addStudy('A large hang trial', 'Hale');
  const small = await addStudy('A small hang trial', 'Osei');
  ids.key = key.id;
  ids.small = small.id;
  citations = { key: key.citation, small: small.citation };
  // The key study speaks to the outcome and to the stated mechanism; the small one to the outcome.
  keyAppraisals = [await appraise(key.id, null), await appraise(key.id, mechanismId)];
  await appraise(small.id, null);
});

describe('GET /api/reviews/:id/verdict → robustness', () => {
  let r: RobustnessDTO;
  let v: VerdictDTO;
  beforeAll(async () => {
    v = await getVerdict();
    r = v.robustness;
  });

  it('lists every appraised study by its row id and citation, in study order', () => {
    expect(r.leaveOneOut.map((row) => row.studyId)).toEqual([ids.key, ids.small]);
    expect(r.leaveOneOut.map((row) => row.citation)).toEqual([citations.key, citations.small]);
    expect(r.mechanismPriors).toEqual([expect.objectContaining({ mechanismId, prior: 0.5 })]);
    expect(r.outcomePrior.prior).toBe(0.5);
    expect(r.outcomePrior.low).toBeLessThanOrEqual(0.5);
    expect(r.outcomePrior.high).toBeGreaterThanOrEqual(0.5);
  });

  it('names the study the verdict cannot lose', () => {
    const keyRow = r.leaveOneOut.find((row) => row.studyId === ids.key)!;
    expect(keyRow.changed).toBe(true);
    expect(r.pivotal).toContain(ids.key);
    expect(r.fragility).toBe(1);
    for (const d of r.decidingCertainty) {
      expect([...keyAppraisals, ...v.appraisals.map((a) => a.id)]).toContain(d.appraisalId);
      expect(d.down !== v.verdict || d.up !== v.verdict).toBe(true);
    }
  });

  it('predicts the verdict the review takes once that study’s appraisals are deleted', async () => {
    const predicted = r.leaveOneOut.find((row) => row.studyId === ids.key)!;
    for (const appraisalId of keyAppraisals) {
      const res = await t.coach.call(appraisalOne.DELETE, {
        method: 'DELETE',
        params: { ...params(), appraisalId: String(appraisalId) },
      });
      expect(res.status).toBe(200);
    }
    const after = await getVerdict();
    expect(after.verdict).toBe(predicted.verdict);
    expect(after.outcome.probability).toBe(predicted.outcomeProbability);
    // Put them back for the next test.
    keyAppraisals = [await appraise(ids.key, null), await appraise(ids.key, mechanismId)];
    expect((await getVerdict()).verdict).toBe(v.verdict);
  });

  it('is kept in words for athletes in the published version', async () => {
    await Review.update({ status: 'approved' }, { where: { id: reviewId } });
    const res = await t.owner.call(publish.POST, { params: params(), json: { visibility: 'public' } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const page = await verdictPage(res.body.slug, null);
    const words = page!.snapshot.robustness!;
    expect(words.restsOn).toBe(`This verdict rests on one study above all: ${citations.key}.`);
    expect(words.wouldChange).toMatch(/^It would change if that study were set aside/);
    expect(words.pivotal).toEqual([{ studyId: ids.key, citation: citations.key }]);
  });
});
