import { z } from 'zod';
import { CONTRIBUTIONS, RESOLUTION_KINDS, SIGN_OFFS } from '@/lib/rounds/types';
import { idField, idParam } from './reviews';

/**
 * Schemas of peer review, shared by the round pages and the route handlers (a bad body is a 400
 * in the error shape of docs/api/README.md and changes nothing).
 */

export const roundParams = z.object({ id: idParam, roundId: idParam });
export const commentParams = z.object({ id: idParam, commentId: idParam });

const MAX_REVIEWERS = 12;
const DAY = 24 * 60 * 60 * 1000;

export const openRoundSchema = z.object({
  reviewerIds: z
    .array(idField, { error: 'Choose the reviewers as a list of people.' })
    .min(1, { error: 'Choose at least one reviewer.' })
    .max(MAX_REVIEWERS, { error: `Invite at most ${MAX_REVIEWERS} reviewers to one round.` })
    .refine((ids) => new Set(ids).size === ids.length, { error: 'A reviewer is listed twice.' }),
  // An ISO date-time (the page sends the reviewer-local choice as UTC); a bare date is midnight UTC.
  dueAt: z.iso
    .datetime({ offset: true, error: 'Give the due date as a date and time.' })
    .or(z.iso.date({ error: 'Give the due date as a date and time.' }))
    .transform((value) => new Date(value))
    .refine((date) => date.getTime() > Date.now() + 60 * 60 * 1000, {
      error: 'The due date must be at least an hour from now.',
    })
    .refine((date) => date.getTime() < Date.now() + 120 * DAY, { error: 'The due date must be within 120 days.' }),
  note: z.string().trim().max(2000, { error: 'Keep the note to the reviewers under 2,000 characters.' }).default(''),
});
export type OpenRoundInput = z.infer<typeof openRoundSchema>;

const band = z
  .number({ error: 'A likelihood band is a number from 0 to 6.' })
  .int({ error: 'A likelihood band is a whole number from 0 to 6.' })
  .min(0, { error: 'A likelihood band is from 0 to 6.' })
  .max(6, { error: 'A likelihood band is from 0 to 6.' });

export const ratingSchema = z.object({
  mechanismId: idField,
  band: band.nullable().default(null),
  contribution: z
    .enum(CONTRIBUTIONS, { error: 'Contribution is none, small, moderate or large.' })
    .nullable()
    .default(null),
  comment: z.string().trim().max(4000, { error: 'Keep a comment under 4,000 characters.' }).default(''),
});

/** PUT …/scorecard: the whole draft each time (autosave), `submit: true` to make it final. */
export const scorecardSchema = z.object({
  ratings: z.array(ratingSchema).max(200, { error: 'Too many ratings.' }),
  overallComment: z
    .string()
    .trim()
    .max(8000, { error: 'Keep the overall comment under 8,000 characters.' })
    .default(''),
  signOff: z
    .enum(SIGN_OFFS, { error: 'Sign off with approve, approve with changes or do not publish.' })
    .nullable()
    .default(null),
  submit: z.boolean().default(false),
});
export type ScorecardInput = z.infer<typeof scorecardSchema>;

/** PATCH …/scorecard after submitting: only the sign-off may change (after the discussion). */
export const signOffSchema = z.object({
  signOff: z.enum(SIGN_OFFS, { error: 'Sign off with approve, approve with changes or do not publish.' }),
});

export const resolutionSchema = z
  .object({
    mechanismId: idField,
    kind: z.enum(RESOLUTION_KINDS, { error: 'Choose what happens to this mechanism.' }),
    reason: z.string().trim().max(4000, { error: 'Keep the reason under 4,000 characters.' }).default(''),
  })
  .superRefine((value, ctx) => {
    if (value.reason.length < 10) {
      ctx.addIssue({
        code: 'custom',
        path: ['reason'],
        message:
          value.kind === 'keep'
            ? 'Write why the mechanism stays as it is (at least 10 characters).'
            : 'Write what will change and why (at least 10 characters).',
      });
    }
  });
export type ResolutionInput = z.infer<typeof resolutionSchema>;

export const closeRoundSchema = z.object({
  /** Reviewers the round closes without, each with a reason. */
  closedWithout: z
    .array(
      z.object({
        reviewerId: idField,
        reason: z
          .string()
          .trim()
          .min(5, { error: 'Say why the round closes without this reviewer (at least 5 characters).' })
          .max(1000, { error: 'Keep the reason under 1,000 characters.' }),
      }),
    )
    .max(20)
    .default([]),
});
export type CloseRoundInput = z.infer<typeof closeRoundSchema>;

export const commentSchema = z.object({
  body: z
    .string({ error: 'Write the comment.' })
    .trim()
    .min(1, { error: 'Write the comment.' })
    .max(4000, { error: 'Keep a comment under 4,000 characters.' }),
  mechanismId: idField.nullable().default(null),
  parentId: idField.nullable().default(null),
  roundId: idField.nullable().default(null),
});
export type CommentInput = z.infer<typeof commentSchema>;

export const commentResolveSchema = z.object({ resolved: z.boolean({ error: 'resolved is true or false.' }) });

export const commentsQuery = z.object({ roundId: idParam.optional() });
