import { Op, type Transaction } from 'sequelize';
import { badRequest, conflict, notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { db } from '@/lib/db';
import { uniqueSlug } from '@/lib/teams/slug';
import { overrideIssue, type AppraisalInput, type AppraisalUpdateInput } from '@/lib/validation/appraisals';
import {
  EMPTY_BODY,
  type CreateReviewInput,
  type MechanismInput,
  type MechanismUpdateInput,
  type UpdateReviewInput,
} from '@/lib/validation/reviews';
import { Appraisal, Mechanism, Review, Study } from '@/models';
import { deriveAppraisal } from './derive';
import { directionReasonIssue, suggestedDirectionFor } from './direction-check';
import { targetDesirable } from './meta';
import { reviewDTO, reviewWithAuthor } from './queries';
import { appraisalFacts, targetFacts, toAppraisalDTO, toMechanismDTO } from './rows';
import type { AppraisalDTO, MechanismDTO, ReviewDTO } from './types';
import { uniqueOrConflict, writeTransaction } from './transaction';
import { refreshVerdict, studyFacts } from './verdict';

/**
 * Every write of the workbench. The route has already asked the policy; these check what only
 * the data can tell (the study is in the team's library, the mechanism belongs to the review,
 * the version is current) and keep the cached verdict in step.
 */

// ---------------------------------------------------------------------------------------------
// Reviews
// ---------------------------------------------------------------------------------------------

function titleFromClaim(claim: string): string {
  const clean = claim.replace(/\s+/g, ' ').trim();
  return clean.length <= 120 ? clean : `${clean.slice(0, 117).replace(/\s+\S*$/, '')}…`;
}

export async function createReview(authorId: number, input: CreateReviewInput): Promise<ReviewDTO> {
  const title = input.title ?? titleFromClaim(input.claim);
  const review = await uniqueOrConflict(
    'Another review with this title was created at the same moment; try again.',
    () =>
      writeTransaction(async (transaction) => {
        // The slug is fixed at creation: published verdict pages link to it.
        const slug = await uniqueSlug(
          title,
          async (s) => (await Review.count({ where: { teamId: input.teamId, slug: s }, transaction })) > 0,
        );
        const created = await Review.create(
          {
            teamId: input.teamId,
            authorId,
            title,
            slug,
            claim: input.claim,
            claimSource: input.claimSource,
            claimUrl: input.claimUrl,
            protocol: input.protocol,
            populationStatus: input.population.status,
            populationInjured: input.population.injured,
            outcomeDesirable: input.outcomeDesirable,
            body: { ...EMPTY_BODY, content: [] },
            recommendations: { whoMightTry: '', whoShouldNot: '', whatInstead: '' },
            tags: input.tags,
            verdict: null,
          },
          { transaction },
        );
        await refreshVerdict(created.id, { transaction });
        await recordEvent(
          {
            teamId: input.teamId,
            actorId: authorId,
            action: 'review.created',
            subjectType: 'review',
            subjectId: created.id,
          },
          transaction,
        );
        return created;
      }),
  );
  await review.reload();
  return reviewDTO(review);
}

export type UpdateOutcome = { ok: true; review: ReviewDTO; row: Review } | { ok: false; current: ReviewDTO };

/**
 * Optimistic locking: the update applies only where the stored version equals the one the
 * editor read (one UPDATE … WHERE version = ?, so two saves cannot both win), and bumps it.
 * A stale version changes nothing and returns the current review for the editor to offer.
 *
 * An autosave of text (title, claim, body, recommendations, tags) is that one conditional
 * UPDATE and nothing else: a single statement is atomic on both engines, so it takes no
 * transaction and no lock, and saves of different reviews never wait for each other. A change
 * of protocol or population (the verdict is recomputed from it) or of status (an audit event)
 * runs in a write transaction scoped to the review (lib/reviews/transaction.ts).
 */
export async function updateReview(
  reviewId: number,
  actorId: number,
  input: UpdateReviewInput,
): Promise<UpdateOutcome> {
  const { version, population, ...rest } = input;
  const values: Record<string, unknown> = { ...rest };
  if (population) {
    values.populationStatus = population.status;
    values.populationInjured = population.injured;
  }
  const conditional = (transaction?: Transaction) =>
    Review.update(
      { ...values, version: db().literal('version + 1') as unknown as number },
      { where: { id: reviewId, version }, transaction },
    );
  const changed =
    !input.protocol && !population && !input.status
      ? (await conditional())[0] > 0
      : await writeTransaction(
          async (transaction) => {
            const [count] = await conditional(transaction);
            if (count === 0) return false;
            // Protocol and population change every appraisal's applicability, hence the verdict.
            if (input.protocol || population) await refreshVerdict(reviewId, { transaction });
            if (input.status) {
              const teamId = (await Review.findByPk(reviewId, { attributes: ['teamId'], transaction }))?.teamId ?? null;
              await recordEvent(
                {
                  teamId,
                  actorId,
                  action: 'review.status_changed',
                  subjectType: 'review',
                  subjectId: reviewId,
                  data: { status: input.status },
                },
                transaction,
              );
            }
            return true;
          },
          { reviewId },
        );
  const current = await reviewWithAuthor(reviewId);
  // Deleted between the policy check and the update.
  if (!current) throw notFound('That review');
  return changed ? { ok: true, review: current.dto, row: current.row } : { ok: false, current: current.dto };
}

export async function deleteReview(reviewId: number, actorId: number): Promise<void> {
  await writeTransaction(async (transaction) => {
    const review = await Review.findByPk(reviewId, { transaction });
    if (!review) return;
    // The foreign keys cascade too; deleting explicitly keeps this correct with them off.
    await Appraisal.destroy({ where: { reviewId }, transaction });
    await Mechanism.destroy({ where: { reviewId }, transaction });
    await review.destroy({ transaction });
    await recordEvent(
      {
        teamId: review.teamId,
        actorId,
        action: 'review.deleted',
        subjectType: 'review',
        subjectId: reviewId,
        data: { title: review.title },
      },
      transaction,
    );
  });
}

// ---------------------------------------------------------------------------------------------
// Mechanisms
// ---------------------------------------------------------------------------------------------

/** Makes room at `position` by moving the mechanisms at or after it down one. */
async function shiftFrom(reviewId: number, position: number, transaction: Transaction, exceptId?: number) {
  await Mechanism.increment('position', {
    by: 1,
    where: { reviewId, position: { [Op.gte]: position }, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) },
    transaction,
  });
}

export async function createMechanism(reviewId: number, input: MechanismInput): Promise<MechanismDTO> {
  return writeTransaction(
    async (transaction) => {
      const last = (await Mechanism.max('position', { where: { reviewId }, transaction })) as number | null;
      const end = last === null ? 0 : last + 1;
      const position = input.position === undefined ? end : Math.min(input.position, end);
      if (position < end) await shiftFrom(reviewId, position, transaction);
      const mechanism = await Mechanism.create({ ...input, reviewId, position }, { transaction });
      await refreshVerdict(reviewId, { transaction, touch: true });
      return toMechanismDTO(mechanism);
    },
    { reviewId },
  );
}

export async function updateMechanism(mechanism: Mechanism, input: MechanismUpdateInput): Promise<MechanismDTO> {
  return writeTransaction(
    async (transaction) => {
      if (input.position !== undefined && input.position !== mechanism.position) {
        await shiftFrom(mechanism.reviewId, input.position, transaction, mechanism.id);
      }
      await mechanism.update(input, { transaction });
      await refreshVerdict(mechanism.reviewId, { transaction, touch: true });
      return toMechanismDTO(mechanism);
    },
    { reviewId: mechanism.reviewId },
  );
}

/** Deletes the mechanism and its appraisals (the body's mechanism block is the editor's to remove). */
export async function deleteMechanism(
  mechanism: Mechanism,
): Promise<{ mechanism: MechanismDTO; deletedAppraisals: number }> {
  return writeTransaction(
    async (transaction) => {
      const deletedAppraisals = await Appraisal.destroy({ where: { mechanismId: mechanism.id }, transaction });
      const dto = toMechanismDTO(mechanism);
      await mechanism.destroy({ transaction });
      await refreshVerdict(mechanism.reviewId, { transaction, touch: true });
      return { mechanism: dto, deletedAppraisals };
    },
    { reviewId: mechanism.reviewId },
  );
}

// ---------------------------------------------------------------------------------------------
// Appraisals
// ---------------------------------------------------------------------------------------------

/** The references an appraisal makes, checked against the data: 400 with the field at fault. */
async function checkReferences(
  review: Review,
  studyId: number,
  mechanismId: number | null,
  transaction: Transaction,
): Promise<Study> {
  // Another team's study answers exactly like a missing one: its existence is not confirmed.
  const study = await Study.findOne({ where: { id: studyId, teamId: review.teamId }, transaction });
  if (!study)
    throw badRequest('That study is not in this team’s library.', [
      { path: 'studyId', message: 'Pick a study from the team’s library.' },
    ]);
  if (study.design === null) {
    throw badRequest('Record the study’s design in the library first: certainty starts from it.', [
      { path: 'studyId', message: 'The study has no design recorded.' },
    ]);
  }
  if (
    mechanismId !== null &&
    !(await Mechanism.count({ where: { id: mechanismId, reviewId: review.id }, transaction }))
  ) {
    throw badRequest('That mechanism is not part of this review.', [
      { path: 'mechanismId', message: 'Pick a mechanism of this review, or null for the claimed outcome.' },
    ]);
  }
  return study;
}

async function assertNotAppraisedTwice(
  reviewId: number,
  studyId: number,
  mechanismId: number | null,
  transaction: Transaction,
  exceptId?: number,
) {
  const twin = await Appraisal.findOne({ where: { reviewId, studyId, mechanismId }, transaction });
  if (twin && twin.id !== exceptId) {
    throw conflict(
      `This study is already appraised for ${mechanismId === null ? 'the claimed outcome' : 'that mechanism'}; edit that appraisal instead.`,
    );
  }
}

function appraisalDTO(review: Review, appraisal: Appraisal, study: Study): AppraisalDTO {
  return toAppraisalDTO(appraisal, deriveAppraisal(appraisalFacts(appraisal), studyFacts(study), targetFacts(review)));
}

/** 400 when the direction differs from the one the study's effect suggests and no reason is given. */
async function checkDirectionReason(
  review: Review,
  study: Study,
  value: { direction: string; directionReason: string | null | undefined; mechanismId: number | null },
  transaction: Transaction,
) {
  const mechanism =
    value.mechanismId === null
      ? null
      : await Mechanism.findByPk(value.mechanismId, { transaction, attributes: ['desirable'] });
  const suggested = suggestedDirectionFor(study.effect, targetDesirable(mechanism, review.outcomeDesirable));
  const issue = directionReasonIssue({ ...value, suggested });
  if (issue) throw badRequest(issue.message, [issue]);
}

/** The written appraisal as the verdict's refresh graded it, so a write grades it once. */
async function refreshAndDescribe(
  review: Review,
  appraisal: Appraisal,
  transaction: Transaction,
): Promise<AppraisalDTO> {
  const scored = await refreshVerdict(review.id, { transaction, touch: true });
  const derived = scored?.derived.get(appraisal.id);
  if (!derived) throw new Error(`Appraisal ${appraisal.id} was not graded with its review.`);
  return toAppraisalDTO(appraisal, derived);
}

export async function createAppraisal(review: Review, input: AppraisalInput): Promise<AppraisalDTO> {
  return writeTransaction(
    async (transaction) => {
      const study = await checkReferences(review, input.studyId, input.mechanismId, transaction);
      await checkDirectionReason(review, study, input, transaction);
      await assertNotAppraisedTwice(review.id, input.studyId, input.mechanismId, transaction);
      const appraisal = await Appraisal.create({ ...input, reviewId: review.id }, { transaction });
      return refreshAndDescribe(review, appraisal, transaction);
    },
    { reviewId: review.id },
  );
}

export async function updateAppraisal(
  review: Review,
  appraisal: Appraisal,
  input: AppraisalUpdateInput,
): Promise<AppraisalDTO> {
  const merged = {
    applicabilityOverride:
      input.applicabilityOverride !== undefined ? input.applicabilityOverride : appraisal.applicabilityOverride,
    overrideReason: input.overrideReason !== undefined ? input.overrideReason : appraisal.overrideReason,
  };
  const issue = overrideIssue(merged);
  if (issue) throw badRequest(issue.message, [issue]);
  const studyId = input.studyId ?? appraisal.studyId;
  const mechanismId = input.mechanismId !== undefined ? input.mechanismId : appraisal.mechanismId;
  return writeTransaction(
    async (transaction) => {
      const study = await checkReferences(review, studyId, mechanismId, transaction);
      await assertNotAppraisedTwice(review.id, studyId, mechanismId, transaction, appraisal.id);
      await checkDirectionReason(
        review,
        study,
        {
          direction: input.direction ?? appraisal.direction,
          directionReason: input.directionReason !== undefined ? input.directionReason : appraisal.directionReason,
          mechanismId,
        },
        transaction,
      );
      // Clearing the override clears its reason with it; a save by a coach is the check an
      // appraisal stored before the domains' fix was waiting for.
      await appraisal.update(
        { ...input, needsCheck: false, ...(merged.applicabilityOverride === null ? { overrideReason: null } : {}) },
        { transaction },
      );
      return refreshAndDescribe(review, appraisal, transaction);
    },
    { reviewId: review.id },
  );
}

export async function deleteAppraisal(review: Review, appraisal: Appraisal): Promise<AppraisalDTO> {
  const study = await Study.findByPk(appraisal.studyId);
  const dto = study ? appraisalDTO(review, appraisal, study) : null;
  await writeTransaction(
    async (transaction) => {
      await appraisal.destroy({ transaction });
      await refreshVerdict(review.id, { transaction, touch: true });
    },
    { reviewId: review.id },
  );
  return dto!;
}
