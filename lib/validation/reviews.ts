import { z } from 'zod';
import { DESIRABLE_DIRECTIONS } from '@/lib/scoring/direction';
import { idField, idParam } from './ids';
import { BODYWEIGHT_UNITS, convertLoad, PERCENT_UNITS } from '@/lib/reviews/protocol';
import {
  EFFORTS,
  LOAD_UNITS,
  MAGNITUDES,
  MECHANISM_KINDS,
  REVIEW_STATUSES,
  TRAINING_STATUSES,
} from '@/lib/reviews/types';

/**
 * Schemas of the review workbench, shared by the forms (inline errors, with the same messages)
 * and the route handlers (400s). Create schemas fill defaults; update schemas are the same
 * fields, all optional and without defaults, so a PATCH never resets what it does not mention.
 */

export { idField, idParam } from './ids';
export const reviewParams = z.object({ id: idParam });
export const mechanismParams = z.object({ id: idParam, mechanismId: idParam });

const nullableNumber = (schema: z.ZodNumber) => schema.nullable().default(null);

const number = (what: string) => z.number({ error: `${what} must be a number.` });
const wholeNumber = (what: string) => number(what).int({ error: `${what} must be a whole number.` });

// ---------------------------------------------------------------------------------------------
// Protocol: the claim's dose (README, "How the work flows", step 1)
// ---------------------------------------------------------------------------------------------

export const protocolFields = {
  exercise: z
    .string({ error: 'Name the exercise.' })
    .trim()
    .min(1, { error: 'Name the exercise.' })
    .max(200, { error: 'Keep the exercise under 200 characters.' }),
  loadValue: nullableNumber(number('The load').finite()),
  loadUnit: z
    .enum(LOAD_UNITS, { error: `Unit must be one of: ${LOAD_UNITS.join(', ')}.` })
    .nullable()
    .default(null),
  referenceBodyweightKg: nullableNumber(
    number('Body weight')
      .positive({ error: 'Body weight must be above 0 kg.' })
      .max(300, { error: 'Body weight must be at most 300 kg.' }),
  ),
  referenceMaxAddedKg: nullableNumber(
    number('Maximum added load')
      .min(-300, { error: 'Maximum added load must be at least −300 kg.' })
      .max(500, { error: 'Maximum added load must be at most 500 kg.' }),
  ),
  secondsPerSet: nullableNumber(
    number('Seconds under load')
      .positive({ error: 'Seconds under load must be above 0.' })
      .max(3600, { error: 'Seconds under load per set must be at most 3600.' }),
  ),
  setsPerSession: nullableNumber(
    wholeNumber('Sets').min(1, { error: 'At least one set.' }).max(100, { error: 'At most 100 sets per session.' }),
  ),
  sessionsPerDay: nullableNumber(
    wholeNumber('Sessions per day')
      .min(1, { error: 'At least one session a day.' })
      .max(24, { error: 'At most 24 sessions a day.' }),
  ),
  daysPerWeek: nullableNumber(
    wholeNumber('Days per week')
      .min(1, { error: 'At least one day a week.' })
      .max(7, { error: 'At most 7 days a week.' }),
  ),
  minHoursBetween: nullableNumber(
    number('Hours between sessions')
      .min(0, { error: 'Hours between sessions cannot be negative.' })
      .max(168, { error: 'At most 168 hours (a week) between sessions.' }),
  ),
  weeks: nullableNumber(
    number('Weeks').positive({ error: 'Weeks must be above 0.' }).max(104, { error: 'At most 104 weeks.' }),
  ),
  effort: z
    .enum(EFFORTS, { error: `Effort must be one of: ${EFFORTS.join(', ')}.` })
    .nullable()
    .default(null),
};

/**
 * The protocol as the coach enters it. Cross-field rules: a load needs its unit and the other
 * way round; percentages are 0–100 (body weight up to 300 %); a body-weight unit needs the
 * reference athlete; and the load may not exceed the reference athlete's maximum, so the
 * converted intensity (lib/reviews/protocol.ts) is always a fraction 0…1.
 */
export const protocolSchema = z.object(protocolFields).superRefine((p, ctx) => {
  if (p.loadValue !== null && p.loadUnit === null) {
    ctx.addIssue({ code: 'custom', path: ['loadUnit'], message: 'Choose the unit of the load.' });
    return;
  }
  if (p.loadUnit !== null && p.loadValue === null) {
    ctx.addIssue({ code: 'custom', path: ['loadValue'], message: 'Enter the load for that unit.' });
    return;
  }
  if (p.loadValue === null || p.loadUnit === null) return;
  if (PERCENT_UNITS.includes(p.loadUnit) && (p.loadValue <= 0 || p.loadValue > 100)) {
    ctx.addIssue({
      code: 'custom',
      path: ['loadValue'],
      message: 'A percentage of maximum is above 0 and at most 100.',
    });
    return;
  }
  if (p.loadUnit === 'percent-bodyweight' && (p.loadValue <= 0 || p.loadValue > 300)) {
    ctx.addIssue({
      code: 'custom',
      path: ['loadValue'],
      message: 'A percentage of body weight is above 0 and at most 300.',
    });
    return;
  }
  if (BODYWEIGHT_UNITS.includes(p.loadUnit)) {
    let missing = false;
    if (p.referenceBodyweightKg === null) {
      ctx.addIssue({
        code: 'custom',
        path: ['referenceBodyweightKg'],
        message: 'A body-weight load needs the reference athlete’s body weight.',
      });
      missing = true;
    }
    if (p.referenceMaxAddedKg === null) {
      ctx.addIssue({
        code: 'custom',
        path: ['referenceMaxAddedKg'],
        message: 'A body-weight load needs the reference athlete’s maximum added load.',
      });
      missing = true;
    }
    if (missing) return;
    if (p.referenceBodyweightKg! + p.referenceMaxAddedKg! <= 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['referenceMaxAddedKg'],
        message: 'Body weight plus maximum added load must be above 0 kg.',
      });
      return;
    }
    const { problem } = convertLoad(p);
    if (problem === 'below-zero') {
      ctx.addIssue({
        code: 'custom',
        path: ['loadValue'],
        message: 'The assistance is more than the athlete’s body weight.',
      });
    } else if (problem === 'above-maximum') {
      ctx.addIssue({
        code: 'custom',
        path: ['loadValue'],
        message:
          'That load is above the reference athlete’s maximum; raise their maximum added load or lower the load.',
      });
    }
  }
});

export type ProtocolInput = z.output<typeof protocolSchema>;

export const populationSchema = z.object({
  status: z
    .enum(TRAINING_STATUSES, { error: `Training status must be one of: ${TRAINING_STATUSES.join(', ')}.` })
    .nullable()
    .default(null),
  injured: z.boolean({ error: 'Injured must be true or false.' }).default(false),
});

const recommendationText = z
  .string({ error: 'Must be text.' })
  .trim()
  .max(4000, { error: 'Keep it under 4000 characters.' })
  .default('');
export const recommendationsSchema = z.object({
  whoMightTry: recommendationText,
  whoShouldNot: recommendationText,
  whatInstead: recommendationText,
});

export const tagsSchema = z
  .array(
    z
      .string({ error: 'A tag is text.' })
      .trim()
      .toLowerCase()
      .min(1, { error: 'A tag cannot be empty.' })
      .max(40, { error: 'Keep a tag under 40 characters.' }),
    { error: 'Tags are a list of words.' },
  )
  .max(20, { error: 'At most 20 tags.' })
  .transform((tags) => [...new Set(tags)]);

// ---------------------------------------------------------------------------------------------
// Body: the Tiptap (ProseMirror) document
// ---------------------------------------------------------------------------------------------

export interface TiptapNode {
  type: string;
  attrs?: Record<string, unknown>;
  content?: TiptapNode[];
  marks?: { type: string; attrs?: Record<string, unknown> }[];
  text?: string;
}

/** Deep enough for any document a person writes; shallow enough that a crafted one cannot exhaust the stack. */
export const BODY_MAX_DEPTH = 64;
export const BODY_MAX_CHARS = 1_000_000;

const optionalId = z.number({ error: 'Must be a number.' }).int().positive().nullable();
const markSchema = z.object({ type: z.string().min(1).max(64), attrs: z.record(z.string(), z.unknown()).optional() });
const nodeSchema: z.ZodType<TiptapNode> = z.lazy(() =>
  z
    .object({
      type: z.string({ error: 'Every node needs a type.' }).min(1).max(64),
      attrs: z.record(z.string(), z.unknown()).optional(),
      content: z.array(nodeSchema).optional(),
      marks: z.array(markSchema).optional(),
      text: z.string().optional(),
    })
    .superRefine((node, ctx) => {
      // Our two custom nodes point at rows by id; a wrong type here would break the editor on reload.
      if (node.type === 'mechanismBlock' && !optionalId.safeParse(node.attrs?.mechanismId ?? null).success) {
        ctx.addIssue({
          code: 'custom',
          path: ['attrs', 'mechanismId'],
          message: 'A mechanism block needs a mechanism id.',
        });
      }
      if (node.type === 'citation' && !optionalId.safeParse(node.attrs?.studyId ?? null).success) {
        ctx.addIssue({ code: 'custom', path: ['attrs', 'studyId'], message: 'A citation needs a study id.' });
      }
    }),
);

function depthOf(value: unknown, depth = 0): number {
  if (depth > BODY_MAX_DEPTH) return depth;
  if (typeof value !== 'object' || value === null) return depth;
  const content = (value as { content?: unknown }).content;
  if (!Array.isArray(content)) return depth;
  let max = depth;
  for (const child of content) max = Math.max(max, depthOf(child, depth + 1));
  return max;
}

export const bodySchema = z
  .unknown()
  .superRefine((value, ctx) => {
    if (depthOf(value) > BODY_MAX_DEPTH) {
      ctx.addIssue({ code: 'custom', message: `The document is nested deeper than ${BODY_MAX_DEPTH} levels.` });
    } else if (JSON.stringify(value ?? null).length > BODY_MAX_CHARS) {
      ctx.addIssue({ code: 'custom', message: 'The document is over 1 MB; split the review.' });
    }
  })
  .pipe(
    z.object({
      type: z.literal('doc', { error: 'The body must be a Tiptap document (type "doc").' }),
      content: z.array(nodeSchema).optional(),
    }),
  );

export const EMPTY_BODY = { type: 'doc', content: [] } as const;

/** The ids a body points at, for loading cited studies and checking mechanism blocks. */
export function bodyReferences(body: unknown): { mechanismIds: number[]; studyIds: number[] } {
  const mechanismIds = new Set<number>();
  const studyIds = new Set<number>();
  const visit = (node: unknown, depth: number) => {
    if (depth > BODY_MAX_DEPTH || typeof node !== 'object' || node === null) return;
    const { type, attrs, content } = node as TiptapNode;
    if (type === 'mechanismBlock' && Number.isInteger(attrs?.mechanismId))
      mechanismIds.add(attrs!.mechanismId as number);
    if (type === 'citation' && Number.isInteger(attrs?.studyId)) studyIds.add(attrs!.studyId as number);
    if (Array.isArray(content)) for (const child of content) visit(child, depth + 1);
  };
  visit(body, 0);
  return { mechanismIds: [...mechanismIds], studyIds: [...studyIds] };
}

// ---------------------------------------------------------------------------------------------
// Reviews
// ---------------------------------------------------------------------------------------------

const title = z
  .string({ error: 'The title is text.' })
  .trim()
  .min(3, { error: 'Give the review a title (3 characters or more).' })
  .max(200, { error: 'Keep the title under 200 characters.' });
const claim = z
  .string({ error: 'State the claim in one sentence.' })
  .trim()
  .min(5, { error: 'State the claim in one sentence (5 characters or more).' })
  .max(500, { error: 'Keep the claim under 500 characters.' });
const claimSource = z
  .string({ error: 'Say who made the claim and where.' })
  .trim()
  .min(1, { error: 'Say who made the claim and where.' })
  .max(300, { error: 'Keep the source under 300 characters.' });
const claimUrl = z
  .url({ protocol: /^https?$/, error: 'Enter a web address starting with http:// or https://.' })
  .max(2000, { error: 'Keep the link under 2000 characters.' })
  .nullable();
const status = z.enum(REVIEW_STATUSES, { error: `Status must be one of: ${REVIEW_STATUSES.join(', ')}.` });

/** Which way the claimed outcome's (or a mechanism's) measure is desirable (docs/scoring.md §10). */
export const desirableField = z.enum(DESIRABLE_DIRECTIONS, {
  error: 'Say whether more or less of the measure is the benefit (higher or lower).',
});

export const createReviewSchema = z.object({
  teamId: idField,
  title: title.optional(),
  claim,
  claimSource,
  claimUrl: claimUrl.optional().default(null),
  protocol: protocolSchema,
  population: populationSchema,
  outcomeDesirable: desirableField.optional().default('higher'),
  tags: tagsSchema.optional().default([]),
});
export type CreateReviewInput = z.output<typeof createReviewSchema>;

export const updateReviewSchema = z
  .object({
    version: z.number({ error: 'Send the version you edited (a number).' }).int().positive(),
    title: title.optional(),
    claim: claim.optional(),
    claimSource: claimSource.optional(),
    claimUrl: claimUrl.optional(),
    protocol: protocolSchema.optional(),
    population: populationSchema.optional(),
    outcomeDesirable: desirableField.optional(),
    body: bodySchema.optional(),
    recommendations: recommendationsSchema.optional(),
    tags: tagsSchema.optional(),
    // Only these by hand: a round sets "in review" and "approved", publishing sets "published".
    status: z
      .enum(['draft', 'archived'], {
        error:
          'Status can be set to draft or archived here; a review round approves a review and publishing publishes it.',
      })
      .optional(),
  })
  .refine((value) => Object.keys(value).some((key) => key !== 'version'), {
    message: 'Nothing to change: send at least one field besides the version.',
    path: [],
  });
export type UpdateReviewInput = z.output<typeof updateReviewSchema>;

export const reviewListQuery = z.object({
  teamId: idParam.optional(),
  status: status.optional(),
  verdict: z
    .enum(['insufficient', 'not-supported', 'uncertain', 'supported', 'other-reasons'], { error: 'Unknown verdict.' })
    .optional(),
  tag: z.string().trim().toLowerCase().min(1).max(40).optional(),
});

// ---------------------------------------------------------------------------------------------
// Mechanisms (README, "How the work flows", step 2)
// ---------------------------------------------------------------------------------------------

export const mechanismFields = {
  name: z
    .string({ error: 'Name the mechanism.' })
    .trim()
    .min(2, { error: 'Name the mechanism (2 characters or more).' })
    .max(160, { error: 'Keep the name under 160 characters.' }),
  kind: z.enum(MECHANISM_KINDS, { error: `Kind must be one of: ${MECHANISM_KINDS.join(', ')}.` }),
  summary: z
    .string({ error: 'The summary is text.' })
    .trim()
    .max(4000, { error: 'Keep the summary under 4000 characters.' }),
  minIntensity: z
    .number({ error: 'Minimum intensity must be a number.' })
    .min(0, { error: 'Minimum intensity is a fraction of maximum, 0 to 1.' })
    .max(1, { error: 'Minimum intensity is a fraction of maximum, 0 to 1.' })
    .nullable(),
  minEffort: z.enum(EFFORTS, { error: `Minimum effort must be one of: ${EFFORTS.join(', ')}.` }).nullable(),
  // Strictly inside (0, 1): the model works on log-odds (docs/scoring.md §8: a prior
  // outside (0, 1) is an error).
  prior: z
    .number({ error: 'The prior must be a number.' })
    .gt(0, { error: 'The prior is a probability above 0 and below 1.' })
    .lt(1, { error: 'The prior is a probability above 0 and below 1.' }),
  magnitude: z.enum(MAGNITUDES, { error: `Magnitude must be one of: ${MAGNITUDES.join(', ')}.` }),
  stated: z.boolean({ error: 'Stated must be true or false.' }),
  desirable: desirableField,
  position: z.number({ error: 'Position must be a number.' }).int().min(0),
};

export const mechanismSchema = z.object({
  name: mechanismFields.name,
  kind: mechanismFields.kind.default('physiological'),
  summary: mechanismFields.summary.default(''),
  minIntensity: mechanismFields.minIntensity.default(null),
  minEffort: mechanismFields.minEffort.default(null),
  prior: mechanismFields.prior.default(0.5),
  magnitude: mechanismFields.magnitude.default('moderate'),
  stated: mechanismFields.stated.default(false),
  desirable: mechanismFields.desirable.default('higher'),
  /** Omitted: after the last mechanism. */
  position: mechanismFields.position.optional(),
});
export type MechanismInput = z.output<typeof mechanismSchema>;

export const mechanismUpdateSchema = z
  .object(mechanismFields)
  .partial()
  .refine((value) => Object.keys(value).length > 0, { message: 'Nothing to change.', path: [] });
export type MechanismUpdateInput = z.output<typeof mechanismUpdateSchema>;

/** GET /api/reviews/:id/meta-analysis?mechanism=<id>|outcome[&measure=smd|log-risk-ratio] */
export const metaAnalysisQuery = z.object({
  mechanism: z.string({ error: 'Say which mechanism to pool: its id, or "outcome".' }).transform((value, ctx) => {
    if (value === 'outcome') return 'outcome' as const;
    const id = Number(value);
    if (Number.isInteger(id) && id > 0) return id;
    ctx.addIssue({ code: 'custom', message: 'Use a mechanism id or "outcome".' });
    return z.NEVER;
  }),
  measure: z.enum(['smd', 'log-risk-ratio'], { error: 'Measure is smd or log-risk-ratio.' }).optional(),
});
