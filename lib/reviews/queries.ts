import { Op } from 'sequelize';
import { decide, type Actor } from '@/lib/auth/policy';
import { badRequest, notFound } from '@/lib/api/errors';
import { toStudyDTO } from '@/lib/library/dto';
import { appraisalCounts } from '@/lib/library/studies';
import { bodyReferences } from '@/lib/validation/reviews';
import { Appraisal, Mechanism, Review, Study, User } from '@/models';
import type { Desirable } from '@/lib/scoring/direction';
import { MEASURE_LABEL, metaAnalyze, poolableTargets } from './meta';
import { toAppraisalDTO, toMechanismDTO, toReviewDTO, toSummaryDTO } from './rows';
import { deriveAll, loadReviewData } from './verdict';
import type {
  EffectMeasure,
  MetaAnalysisDTO,
  ReviewDTO,
  ReviewStatus,
  ReviewSummaryDTO,
  VerdictKey,
  WorkbenchDTO,
} from './types';

/** The facts the policy needs about a review (team and author), or a 404. */
export async function reviewAccess(reviewId: number): Promise<{ teamId: number; authorId: number }> {
  const review = await Review.findByPk(reviewId, { attributes: ['id', 'teamId', 'authorId'] });
  if (!review) throw notFound('That review');
  return { teamId: review.teamId, authorId: review.authorId };
}

async function authorNames(ids: number[]): Promise<Map<number, string>> {
  const users = await User.findAll({ where: { id: { [Op.in]: [...new Set(ids)] } }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}

export async function reviewDTO(review: Review): Promise<ReviewDTO> {
  const names = await authorNames([review.authorId]);
  return toReviewDTO(review, names.get(review.authorId) ?? 'Former member');
}

/** The review row and its DTO, the author's name read in the same query. */
export async function reviewWithAuthor(reviewId: number): Promise<{ row: Review; dto: ReviewDTO } | null> {
  const row = await Review.findByPk(reviewId, {
    include: [{ model: User, as: 'author', attributes: ['id', 'name'], required: false }],
  });
  if (!row) return null;
  const author = (row as Review & { author?: User | null }).author;
  return { row, dto: toReviewDTO(row, author?.name ?? 'Former member') };
}

export async function getReviewDTO(reviewId: number): Promise<ReviewDTO> {
  const review = await Review.findByPk(reviewId);
  if (!review) throw notFound('That review');
  return reviewDTO(review);
}

/**
 * The reviews of the teams where the caller may list them (the policy decides per team), newest
 * change first, filtered by status, cached verdict and tag.
 */
export async function listReviews(
  actor: Actor,
  filters: { teamId?: number; status?: ReviewStatus; verdict?: VerdictKey; tag?: string },
): Promise<ReviewSummaryDTO[]> {
  const teamIds =
    filters.teamId !== undefined
      ? [filters.teamId]
      : [...actor.roles.keys()].filter((teamId) => decide(actor, 'review.list', { teamId }) === 'allow');
  if (!teamIds.length) return [];
  const where: Record<string, unknown> = { teamId: { [Op.in]: teamIds } };
  if (filters.status) where.status = filters.status;
  if (filters.verdict) where.verdict = filters.verdict;
  const reviews = await Review.findAll({
    where,
    attributes: { exclude: ['body', 'protocol', 'recommendations'] },
    order: [
      ['updatedAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  // Tags are a small JSON list per review; filtering here keeps the query portable.
  const tagged = filters.tag ? reviews.filter((r) => (r.tags ?? []).includes(filters.tag!)) : reviews;
  const names = await authorNames(tagged.map((r) => r.authorId));
  return tagged.map((r) => toSummaryDTO(r, names.get(r.authorId) ?? 'Former member'));
}

/** GET /api/reviews/:id — the review with its mechanisms, appraisals (with derived certainty and applicability) and studies. */
export async function getWorkbench(reviewId: number): Promise<WorkbenchDTO> {
  const data = await loadReviewData(reviewId);
  if (!data) throw notFound('That review');
  const derived = deriveAll(data);
  const cited = bodyReferences(data.review.body).studyIds;
  const citedStudies = cited.length
    ? await Study.findAll({ where: { id: { [Op.in]: cited }, teamId: data.review.teamId } })
    : [];
  const counts = await appraisalCounts([...data.studies.keys(), ...citedStudies.map((s) => s.id)]);
  return {
    review: await reviewDTO(data.review),
    mechanisms: data.mechanisms.map(toMechanismDTO),
    appraisals: data.appraisals.filter((a) => derived.has(a.id)).map((a) => toAppraisalDTO(a, derived.get(a.id)!)),
    studies: [...data.studies.values()].sort((a, b) => a.id - b.id).map((s) => toStudyDTO(s, counts.get(s.id))),
    citedStudies: citedStudies.map((s) => toStudyDTO(s, counts.get(s.id))),
    poolable: poolableTargets(data.appraisals, data.studies),
  };
}

export async function mechanismOf(reviewId: number, mechanismId: number): Promise<Mechanism> {
  const mechanism = await Mechanism.findOne({ where: { id: mechanismId, reviewId } });
  if (!mechanism) throw notFound('That mechanism');
  return mechanism;
}

export async function reviewRow(reviewId: number): Promise<Review> {
  const review = await Review.findByPk(reviewId);
  if (!review) throw notFound('That review');
  return review;
}

export async function appraisalOf(reviewId: number, appraisalId: number): Promise<Appraisal> {
  const appraisal = await Appraisal.findOne({ where: { id: appraisalId, reviewId } });
  if (!appraisal) throw notFound('That appraisal');
  return appraisal;
}

/** GET /api/reviews/:id/meta-analysis: pools one target's compatible effect sizes; 400 with fewer than two. */
export async function reviewMetaAnalysis(
  reviewId: number,
  target: number | 'outcome',
  measure?: EffectMeasure,
): Promise<MetaAnalysisDTO> {
  const data = await loadReviewData(reviewId);
  if (!data) throw notFound('That review');
  const mechanism = target === 'outcome' ? null : (data.mechanisms.find((m) => m.id === target) ?? null);
  if (target !== 'outcome' && !mechanism) throw notFound('That mechanism');
  const outcome = metaAnalyze({
    mechanism,
    appraisals: data.appraisals,
    studies: data.studies,
    measure,
    outcomeDesirable: data.review.outcomeDesirable as Desirable,
  });
  if (!outcome.ok) {
    const what = mechanism ? `“${mechanism.name}”` : 'the claimed outcome';
    throw badRequest(
      `A meta-analysis needs at least two appraisals of ${what} whose studies carry compatible effect sizes (${MEASURE_LABEL[outcome.measure].toLowerCase()}); found ${outcome.found}.`,
      [
        {
          path: 'mechanism',
          message: `Only ${outcome.found} compatible effect size${outcome.found === 1 ? '' : 's'}.`,
        },
      ],
    );
  }
  return outcome.result;
}
