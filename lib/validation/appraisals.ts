import { z } from 'zod';
import { CONCERNS, DIRECTIONS } from '@/lib/reviews/types';
import { LARGE_EFFECTS, perDomain } from '@/lib/scoring/appraisal-vocabulary';
import { idParam } from './reviews';

/**
 * The appraisal form (README, "How the work flows", step 4): one study against one mechanism, or against the
 * claimed outcome itself (mechanismId null). Shared by the form and the route handlers.
 */

export const appraisalParams = z.object({ id: idParam, appraisalId: idParam });

const concern = z.enum(CONCERNS, { error: `Must be one of: ${CONCERNS.join(', ')}.` });

export const appraisalFields = {
  studyId: z
    .number({ error: 'Pick a study from the library.' })
    .int()
    .positive({ error: 'Pick a study from the library.' }),
  mechanismId: z.number({ error: 'Pick a mechanism, or null for the claimed outcome.' }).int().positive().nullable(),
  direction: z.enum(DIRECTIONS, { error: `Direction must be one of: ${DIRECTIONS.join(', ')}.` }),
  ...perDomain(() => concern),
  largeEffect: z.literal(LARGE_EFFECTS, { error: `Large effect is ${LARGE_EFFECTS.join(', ')}.` }),
  doseResponse: z.boolean({ error: 'Dose–response must be true or false.' }),
  confoundingWouldReduce: z.boolean({ error: 'Must be true or false.' }),
  applicabilityOverride: z
    .number({ error: 'Applicability must be a number.' })
    .min(0, { error: 'Applicability is a fraction, 0 to 1.' })
    .max(1, { error: 'Applicability is a fraction, 0 to 1.' })
    .nullable(),
  overrideReason: z
    .string({ error: 'The reason is text.' })
    .trim()
    .max(2000, { error: 'Keep the reason under 2000 characters.' })
    .nullable(),
  directionReason: z
    .string({ error: 'The reason is text.' })
    .trim()
    .max(2000, { error: 'Keep the reason under 2000 characters.' })
    .nullable(),
  notes: z.string({ error: 'Notes are text.' }).trim().max(10000, { error: 'Keep the notes under 10,000 characters.' }),
};

/** An override of the suggested applicability must say why (docs/scoring.md §2: "with a written reason"). */
export function overrideIssue(value: { applicabilityOverride?: number | null; overrideReason?: string | null }) {
  if (value.applicabilityOverride === null || value.applicabilityOverride === undefined) return null;
  if ((value.overrideReason ?? '').trim().length >= 3) return null;
  return { path: 'overrideReason', message: 'Say why you override the suggested applicability.' };
}

export const appraisalSchema = z
  .object({
    studyId: appraisalFields.studyId,
    mechanismId: appraisalFields.mechanismId.default(null),
    direction: appraisalFields.direction,
    ...perDomain(() => concern.default('none')),
    largeEffect: appraisalFields.largeEffect.default(0),
    doseResponse: appraisalFields.doseResponse.default(false),
    confoundingWouldReduce: appraisalFields.confoundingWouldReduce.default(false),
    applicabilityOverride: appraisalFields.applicabilityOverride.default(null),
    overrideReason: appraisalFields.overrideReason.default(null),
    notes: appraisalFields.notes.default(''),
    directionReason: appraisalFields.directionReason.default(null),
  })
  .superRefine((value, ctx) => {
    const issue = overrideIssue(value);
    if (issue) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message });
  });
export type AppraisalInput = z.output<typeof appraisalSchema>;

/**
 * Any subset of the fields. The override/reason rule is checked again after merging with the
 * stored appraisal (lib/reviews/commands.ts), since either half may arrive alone.
 */
export const appraisalUpdateSchema = z
  .object(appraisalFields)
  .partial()
  .refine((value) => Object.keys(value).length > 0, { message: 'Nothing to change.', path: [] });
export type AppraisalUpdateInput = z.output<typeof appraisalUpdateSchema>;
