import { beforeAll, describe, expect, it } from 'vitest';
import * as metaRoute from '@/app/api/reviews/[id]/meta-analysis/route';
import * as verdictRoute from '@/app/api/reviews/[id]/verdict/route';
import * as workbenchRoute from '@/app/api/reviews/[id]/route';
import * as reviewsRoute from '@/app/api/reviews/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import { seed } from '@/db/migrate';
import { DEMO_REVIEWS } from '@/db/seeders/20261201-0002-demo-reviews-data';
import { DEMO_PASSWORD } from '@/db/seeders/demo-accounts';
import { bodyReferences } from '@/lib/validation/reviews';
import { db } from '@/lib/db';
import { Study } from '@/models';
import { Client, useTestApp } from '../../helpers/app';

useTestApp();
const owner = new Client('10.20.0.1');

beforeAll(async () => {
  await seed(db());
  expect(
    (await owner.call(signIn.POST, { json: { email: 'owner@granite-hollow.test', password: DEMO_PASSWORD } })).status,
  ).toBe(200);
});

describe('demo seed: the three invented demo reviews', () => {
  it('seeds three complete reviews whose verdicts, recomputed by the verdict route, differ as the story says', async () => {
    const list = await owner.call(reviewsRoute.GET);
    expect(list.status).toBe(200);
    expect(list.body.reviews).toHaveLength(3);
    const verdicts: string[] = [];
    for (const demo of DEMO_REVIEWS) {
      const summary = list.body.reviews.find((r: { title: string }) => r.title === demo.title);
      expect(summary, demo.title).toBeDefined();
      const verdict = await owner.call(verdictRoute.GET, { params: { id: String(summary.id) } });
      expect(verdict.status).toBe(200);
      expect(verdict.body.verdict, demo.title).toBe(demo.expectedVerdict);
      // The cached verdict the dashboard lists is the one the engine gives now.
      expect(summary.verdict).toBe(verdict.body.verdict);
      verdicts.push(verdict.body.verdict);
    }
    expect(new Set(verdicts).size).toBe(3);
    expect(verdicts).toContain('other-reasons');
  });

  it('gives every review 4–7 mechanisms with a stated one, a body whose blocks and citations point at real rows, and recommendations', async () => {
    const list = await owner.call(reviewsRoute.GET);
    for (const summary of list.body.reviews) {
      const { body } = await owner.call(workbenchRoute.GET, { params: { id: String(summary.id) } });
      expect(body.mechanisms.length).toBeGreaterThanOrEqual(4);
      expect(body.mechanisms.length).toBeLessThanOrEqual(7);
      expect(body.mechanisms.some((m: { stated: boolean }) => m.stated)).toBe(true);
      const refs = bodyReferences(body.review.body);
      expect(refs.mechanismIds.sort()).toEqual(body.mechanisms.map((m: { id: number }) => m.id).sort());
      expect(refs.studyIds.length).toBeGreaterThanOrEqual(1);
      expect(body.citedStudies.map((s: { id: number }) => s.id).sort()).toEqual([...refs.studyIds].sort());
      expect(body.review.recommendations.whoShouldNot.length).toBeGreaterThan(10);
      expect(body.appraisals.length).toBeGreaterThan(0);
    }
  });

  it('uses 8+ invented studies with 10.5555 DOIs in a made-up journal', async () => {
    const studies = await Study.findAll();
    expect(studies.length).toBeGreaterThanOrEqual(8);
    for (const s of studies) {
      expect(s.doi).toMatch(/^10\.5555\//);
      expect(s.journal).toBe('Hollowridge Journal of Training Science');
    }
  });

  it('has effect sizes enough for a forest plot on each claimed outcome', async () => {
    const list = await owner.call(reviewsRoute.GET);
    for (const summary of list.body.reviews) {
      const { body } = await owner.call(workbenchRoute.GET, { params: { id: String(summary.id) } });
      expect(body.poolable.some((p: { mechanismId: number | null }) => p.mechanismId === null)).toBe(true);
      const meta = await owner.call(metaRoute.GET, {
        params: { id: String(summary.id) },
        path: '/api/x?mechanism=outcome',
      });
      expect(meta.status).toBe(200);
      expect(meta.body.k).toBeGreaterThanOrEqual(2);
    }
  });
});
