import { badRequest, notFound } from '@/lib/api/errors';
import { assertReviewEditable } from '@/lib/rounds/freeze';
import { onReviewChanged } from '@/lib/search/index-store';
import { writeTransaction } from './transaction';
import { refreshVerdict } from './verdict';
import { pickDomains } from '@/lib/scoring/appraisal-vocabulary';
import { Appraisal, Mechanism, Review } from '@/models';

/**
 * Copies a mechanism from a past review into another review of the same team, with its
 * appraisals as new rows that point at the same library studies (the evidence is shared, the
 * judgement is copied and can then be changed without touching the past review). Applicability
 * is re-suggested for the new review's protocol, except where the coach had overridden it.
 * The caller checked `review.update` on the target and `review.read` on the source. The target
 * must not be frozen by an open peer-review round (409), checked inside the write transaction so
 * a round opened at the same moment cannot slip in between.
 */
export async function copyMechanism(
  sourceMechanismId: number,
  targetReviewId: number,
): Promise<{ mechanismId: number; appraisals: number }> {
  const source = await Mechanism.findByPk(sourceMechanismId);
  if (!source) throw notFound('That mechanism');
  const [from, to] = await Promise.all([Review.findByPk(source.reviewId), Review.findByPk(targetReviewId)]);
  if (!from || !to) throw notFound('That review');
  if (from.teamId !== to.teamId) throw notFound('That mechanism');
  if (from.id === to.id)
    throw badRequest('The mechanism is already part of this review.', [
      { path: 'mechanismId', message: 'Pick a mechanism of another review.' },
    ]);
  const result = await writeTransaction(async (transaction) => {
    await assertReviewEditable(to.id);
    const last = (await Mechanism.max('position', { where: { reviewId: to.id }, transaction })) as number | null;
    const copy = await Mechanism.create(
      {
        reviewId: to.id,
        name: source.name,
        kind: source.kind,
        summary: source.summary,
        minIntensity: source.minIntensity,
        minEffort: source.minEffort,
        prior: source.prior,
        magnitude: source.magnitude,
        // Whether the claim states this mechanism belongs to the new claim, not the old one.
        stated: false,
        position: last === null ? 0 : last + 1,
      },
      { transaction },
    );
    const appraisals = await Appraisal.findAll({ where: { mechanismId: source.id }, transaction });
    for (const a of appraisals) {
      await Appraisal.create(
        {
          reviewId: to.id,
          studyId: a.studyId,
          mechanismId: copy.id,
          direction: a.direction,
          ...pickDomains(a),
          largeEffect: a.largeEffect,
          doseResponse: a.doseResponse,
          confoundingWouldReduce: a.confoundingWouldReduce,
          applicabilityOverride: a.applicabilityOverride,
          overrideReason: a.overrideReason,
          notes: a.notes ? `${a.notes} (copied from “${from.title}”)` : `Copied from “${from.title}”.`,
        },
        { transaction },
      );
    }
    await refreshVerdict(to.id, { transaction, touch: true });
    return { mechanismId: copy.id, appraisals: appraisals.length };
  });
  await onReviewChanged(to.id);
  return result;
}
