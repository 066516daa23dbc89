import { beforeAll, describe, expect, it } from 'vitest';
import { seed } from '@/db/migrate';
import { db } from '@/lib/db';
import { suggestedDirectionFor } from '@/lib/reviews/direction-check';
import { targetDesirable } from '@/lib/reviews/meta';
import { loadReviewData, reviewVerdict } from '@/lib/reviews/verdict';
import { DEMO_REVIEWS } from '@/db/seeders/20261201-0002-demo-reviews-data';
import { Review } from '@/models';
import { useTestApp } from '../../helpers/app';

/**
 * The demo keeps the rules a coach's appraisals keep (docs/scoring.md §10): a direction the
 * study's effect does not suggest carries a reason, no verdict contradicts its pooled effect,
 * and each review still reaches the verdict its story intends when read through the models.
 */

useTestApp();
beforeAll(async () => {
  await seed(db());
});

describe('demo reviews and the direction of their effects', () => {
  it('gives a reason wherever a demo direction differs from the effect’s suggestion', async () => {
    const missing: string[] = [];
    for (const review of await Review.findAll()) {
      const data = (await loadReviewData(review.id))!;
      for (const a of data.appraisals) {
        const mechanism = data.mechanisms.find((m) => m.id === a.mechanismId) ?? null;
        const suggested = suggestedDirectionFor(
          data.studies.get(a.studyId)!.effect,
          targetDesirable(mechanism, review.outcomeDesirable),
        );
        if (suggested && suggested !== a.direction && !(a.directionReason ?? '').trim()) {
          missing.push(`${review.title} / ${mechanism?.name ?? 'outcome'}: ${a.direction} vs ${suggested}`);
        }
      }
    }
    expect(missing).toEqual([]);
  });

  it('reaches each intended verdict with no conflict between the pooled effect and the outcome probability', async () => {
    for (const demo of DEMO_REVIEWS) {
      const review = (await Review.findOne({ where: { title: demo.title } }))!;
      const verdict = (await reviewVerdict(review.id))!;
      expect(verdict.verdict, demo.title).toBe(demo.expectedVerdict);
      expect(verdict.effectCheck, demo.title).not.toBeNull();
      expect(verdict.effectCheck!.conflict, demo.title).toBe(false);
    }
  });

  it('reads back through the models the certainty domains the seed wrote', async () => {
    const [rows] = (await db().query(
      // Quoted: PostgreSQL folds unquoted names to lower case.
      'SELECT id, "riskOfBias", inconsistency, indirectness, imprecision, "publicationBias" FROM appraisals ORDER BY id',
    )) as [Record<string, unknown>[], unknown];
    const { Appraisal } = await import('@/models');
    const models = await Appraisal.findAll({
      attributes: ['id', 'riskOfBias', 'inconsistency', 'indirectness', 'imprecision', 'publicationBias'],
      order: [['id', 'ASC']],
      raw: true,
    });
    expect(models).toEqual(rows);
    expect(rows.some((r) => r.riskOfBias !== r.publicationBias)).toBe(true);
  });
});
