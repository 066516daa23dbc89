import { z } from 'zod';
import { idParam } from '@/lib/validation/reviews';

/** Schemas of publishing, following and search, shared by the forms and the route handlers. */

export const VISIBILITIES = ['team', 'public'] as const;
export type Visibility = (typeof VISIBILITIES)[number];

export const publishParams = z.object({ id: idParam });
export const teamParams = z.object({ teamId: idParam });

export const publishBody = z.object({
  visibility: z.enum(VISIBILITIES, { error: 'Visibility is "team" or "public".' }),
  // Required from version 2 on; lib/publishing checks that, since only the data knows the number.
  changeNote: z
    .string({ error: 'The note is text.' })
    .trim()
    .max(2000, { error: 'Keep the note under 2,000 characters.' })
    .optional()
    .transform((v) => (v ? v : undefined)),
});
export type PublishInput = z.infer<typeof publishBody>;

export const unpublishBody = z.object({
  reason: z
    .string({ error: 'Say why the verdict is withdrawn.' })
    .trim()
    .min(10, { error: 'Say why the verdict is withdrawn (10 characters or more): readers see it.' })
    .max(2000, { error: 'Keep the reason under 2,000 characters.' }),
});

const q = z
  .string({ error: 'The search is text.' })
  .trim()
  .max(200, { error: 'Keep the search under 200 characters.' });

export const verdictQuery = z.object({
  q: q.optional(),
  teamId: idParam.optional(),
  limit: z.coerce.number().int().min(1).max(100).optional(),
});

/** The unsubscribe button's form: the signed token of the mail's link (checked in lib/follows/follows.ts). */
export const unsubscribeForm = z.object({ token: z.string().trim().min(1, 'The link is incomplete.').max(100) });

export const SEARCH_KINDS = ['review', 'mechanism', 'study'] as const;

export const searchQuery = z.object({
  q: q.min(1, { error: 'Type something to search for.' }),
  teamId: idParam.optional(),
  kind: z.enum(SEARCH_KINDS, { error: 'Kind is review, mechanism or study.' }).optional(),
  status: z.enum(['draft', 'in-review', 'approved', 'published', 'archived'], { error: 'Unknown status.' }).optional(),
  verdict: z
    .enum(['insufficient', 'not-supported', 'uncertain', 'supported', 'other-reasons'], { error: 'Unknown verdict.' })
    .optional(),
  tag: z.string().trim().max(60).optional(),
  limit: z.coerce.number().int().min(1).max(100).optional(),
});
export type SearchQuery = z.infer<typeof searchQuery>;

export const similarQuery = z.object({
  teamId: idParam,
  claim: q.min(3, { error: 'Type a few words of the claim.' }),
});
