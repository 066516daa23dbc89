import { z } from 'zod';
import { normalizeDoi } from '@/lib/citations/doi';
import { STUDY_DESIGNS, TRAINING_STATUSES } from '@/lib/reviews/types';
import { idField, idParam, tagsSchema } from './reviews';

/**
 * The evidence library (README, "How the work flows", step 3): a study comes in by pasted source (DOI, BibTeX, RIS
 * or CSL-JSON) or by hand, and carries what the appraisal needs. Shared by the library forms
 * and the route handlers.
 */

export const studyParams = z.object({ id: idParam });

/** Largest pasted or uploaded library text: a 2,000-entry BibTeX file is about 1 MB. */
export const MAX_SOURCE_CHARS = 10_000_000;

const count = (what: string) =>
  z.number({ error: `${what} must be a number.` }).int({ error: `${what} must be a whole number.` });
const positiveCount = (what: string) => count(what).min(1, { error: `${what} must be at least 1.` });
const finite = (what: string) => z.number({ error: `${what} must be a number.` }).finite();
const groupSize = (what: string) => count(what).min(2, { error: `${what} must be at least 2 per group.` });

/**
 * Effect data as a study reports it; lib/reviews/meta.ts turns it into a comparable effect size.
 * Means need SD > 0 and at least 2 per group (a variance needs two observations); a 2×2 table
 * needs someone in each arm; a ready effect size needs a positive variance.
 */
export const effectSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({
      kind: z.literal('means'),
      m1: finite('Mean 1'),
      sd1: finite('SD 1').positive({ error: 'SD 1 must be above 0.' }),
      n1: groupSize('n1'),
      m2: finite('Mean 2'),
      sd2: finite('SD 2').positive({ error: 'SD 2 must be above 0.' }),
      n2: groupSize('n2'),
    }),
    z.object({ kind: z.literal('t'), t: finite('t'), n1: groupSize('n1'), n2: groupSize('n2') }),
    z
      .object({
        kind: z.literal('two-by-two'),
        a: count('a').min(0, { error: 'Counts cannot be negative.' }),
        b: count('b').min(0, { error: 'Counts cannot be negative.' }),
        c: count('c').min(0, { error: 'Counts cannot be negative.' }),
        d: count('d').min(0, { error: 'Counts cannot be negative.' }),
        measure: z.enum(['risk-ratio', 'odds-ratio'], { error: 'Measure is risk-ratio or odds-ratio.' }),
      })
      .superRefine((t, ctx) => {
        if (t.a + t.b === 0)
          ctx.addIssue({ code: 'custom', path: ['a'], message: 'The first group (a + b) has nobody in it.' });
        if (t.c + t.d === 0)
          ctx.addIssue({ code: 'custom', path: ['c'], message: 'The second group (c + d) has nobody in it.' });
      }),
    z.object({
      kind: z.literal('ready'),
      effectSize: finite('The effect size'),
      variance: finite('The variance').positive({ error: 'The variance must be above 0.' }),
      measure: z.enum(['smd', 'log-risk-ratio', 'log-odds-ratio'], {
        error: 'Measure is smd, log-risk-ratio or log-odds-ratio.',
      }),
    }),
  ],
  { error: 'Effect data kind is one of: means, t, two-by-two, ready.' },
);
export type EffectInput = z.output<typeof effectSchema>;

/** What the appraisal needs from a study, beyond the reference. */
export const studyMetaFields = {
  design: z.enum(STUDY_DESIGNS, { error: `Design must be one of: ${STUDY_DESIGNS.join(', ')}.` }).nullable(),
  population: z
    .enum(TRAINING_STATUSES, { error: `Population must be one of: ${TRAINING_STATUSES.join(', ')}.` })
    .nullable(),
  injured: z.boolean({ error: 'Injured must be true or false.' }),
  n: positiveCount('n').max(10_000_000).nullable(),
  intensity: z
    .number({ error: 'Intensity must be a number.' })
    .min(0, { error: 'Intensity is a fraction of maximum, 0 to 1.' })
    .max(1, { error: 'Intensity is a fraction of maximum, 0 to 1.' })
    .nullable(),
  durationWeeks: z
    .number({ error: 'Duration must be a number.' })
    .positive({ error: 'Duration must be above 0 weeks.' })
    .max(1000)
    .nullable(),
  outcome: z
    .string({ error: 'The outcome is text.' })
    .trim()
    .max(500, { error: 'Keep the outcome under 500 characters.' })
    .nullable(),
  effect: effectSchema.nullable(),
  tags: tagsSchema,
};

export const doiSchema = z.string({ error: 'The DOI is text.' }).transform((value, ctx) => {
  const doi = normalizeDoi(value);
  if (!doi) {
    ctx.addIssue({ code: 'custom', message: 'That is not a DOI (it looks like 10.1234/something).' });
    return z.NEVER;
  }
  return doi;
});

const personSchema = z.union(
  [
    z.object({
      family: z.string().trim().min(1, { error: 'Family name is required.' }).max(200),
      given: z.string().trim().max(200).optional(),
    }),
    z.object({ literal: z.string().trim().min(1).max(300) }),
  ],
  { error: 'Each author is {family, given} or {literal} (a group author).' },
);

/** The reference typed by hand, in the words of the form; stored as CSL-JSON. */
export const referenceFields = {
  title: z
    .string({ error: 'The title is text.' })
    .trim()
    .min(3, { error: 'Enter the title (3 characters or more).' })
    .max(1000, { error: 'Keep the title under 1000 characters.' }),
  authors: z.array(personSchema, { error: 'Authors are a list.' }).max(500, { error: 'At most 500 authors.' }),
  year: count('The year')
    .min(1800, { error: 'The year must be 1800 or later.' })
    .max(2100, { error: 'The year must be 2100 or earlier.' })
    .nullable(),
  journal: z.string({ error: 'The journal is text.' }).trim().max(500).nullable(),
  volume: z.string({ error: 'The volume is text.' }).trim().max(50).nullable(),
  issue: z.string({ error: 'The issue is text.' }).trim().max(50).nullable(),
  pages: z.string({ error: 'Pages are text, e.g. 101–115.' }).trim().max(50).nullable(),
  doi: doiSchema.nullable(),
  url: z.url({ protocol: /^https?$/, error: 'Enter a web address starting with http:// or https://.' }).nullable(),
};

const sourceField = z
  .string({ error: 'Paste a DOI, BibTeX, RIS or CSL-JSON.' })
  .min(1, { error: 'Paste a DOI, BibTeX, RIS or CSL-JSON.' })
  .max(MAX_SOURCE_CHARS, { error: 'The pasted text is over 10 MB; upload it as a file in parts.' })
  .refine((s) => s.trim().length > 0, { error: 'Paste a DOI, BibTeX, RIS or CSL-JSON.' });

/**
 * POST /api/studies: either `{teamId, source}` (parsed and looked up; the optional appraisal
 * fields are applied to every entry it yields) or `{teamId, title, authors?, year?, …}` by hand.
 * One object schema with a cross-field rule, rather than a union, so a form gets one clear
 * message per field instead of a union's nested ones.
 */
export const createStudySchema = z
  .object({
    teamId: idField,
    source: sourceField.optional(),
    ...(Object.fromEntries(Object.entries(referenceFields).map(([k, v]) => [k, v.optional()])) as {
      [K in keyof typeof referenceFields]: z.ZodOptional<(typeof referenceFields)[K]>;
    }),
    ...(Object.fromEntries(Object.entries(studyMetaFields).map(([k, v]) => [k, v.optional()])) as {
      [K in keyof typeof studyMetaFields]: z.ZodOptional<(typeof studyMetaFields)[K]>;
    }),
  })
  .superRefine((value, ctx) => {
    const typed = (Object.keys(referenceFields) as (keyof typeof referenceFields)[]).filter(
      (k) => value[k] !== undefined,
    );
    if (value.source !== undefined && typed.length) {
      ctx.addIssue({
        code: 'custom',
        path: [typed[0]],
        message: 'Give either pasted text to import or the reference typed by hand, not both.',
      });
    }
    if (value.source === undefined && value.title === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['source'],
        message: 'Paste a DOI, BibTeX, RIS or CSL-JSON, or type the reference (at least its title).',
      });
    }
  });
export type CreateStudyInput = z.output<typeof createStudySchema>;
export type StudyMetaInput = Partial<{ [K in keyof typeof studyMetaFields]: z.output<(typeof studyMetaFields)[K]> }>;
export type ReferenceInput = Partial<{ [K in keyof typeof referenceFields]: z.output<(typeof referenceFields)[K]> }>;

export const updateStudySchema = z
  .object({ ...referenceFields, ...studyMetaFields })
  .partial()
  .refine((value) => Object.keys(value).length > 0, { message: 'Nothing to change.', path: [] });
export type UpdateStudyInput = z.output<typeof updateStudySchema>;

export const STUDY_SORTS = [
  'added',
  '-added',
  'title',
  '-title',
  'year',
  '-year',
  'citation',
  '-citation',
  'design',
  '-design',
] as const;

export const studyListQuery = z.object({
  teamId: idParam.optional(),
  q: z.string().trim().max(200, { error: 'Keep the search under 200 characters.' }).optional(),
  design: z.enum(STUDY_DESIGNS, { error: `Design must be one of: ${STUDY_DESIGNS.join(', ')}.` }).optional(),
  tag: z.string().trim().toLowerCase().min(1).max(40).optional(),
  sort: z.enum(STUDY_SORTS, { error: `Sort by one of: ${STUDY_SORTS.join(', ')}.` }).default('-added'),
  page: z.coerce
    .number({ error: 'Page must be a number.' })
    .int()
    .min(1, { error: 'Pages start at 1.' })
    .max(100_000)
    .default(1),
  pageSize: z.coerce
    .number({ error: 'Page size must be a number.' })
    .int()
    .min(1, { error: 'At least 1 per page.' })
    .max(200, { error: 'At most 200 per page.' })
    .default(25),
});
export type StudyListQuery = z.output<typeof studyListQuery>;

export const CITATION_FORMATS = ['apa', 'bibtex', 'ris', 'csl'] as const;
export const citationQuery = z.object({
  format: z.enum(CITATION_FORMATS, { error: `Format is one of: ${CITATION_FORMATS.join(', ')}.` }).default('apa'),
  /** "1": send the file itself (with a file name) instead of the JSON envelope. */
  download: z.enum(['0', '1'], { error: 'download is 0 or 1.' }).optional(),
});

export const deleteStudyQuery = z.object({
  force: z.enum(['0', '1'], { error: 'force is 0 or 1.' }).optional(),
});

/** The multipart import form's text field. */
export const importFormSchema = z.object({ teamId: idParam });
