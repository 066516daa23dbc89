import { z } from 'zod';
import { idParam, inviteSchema, memberParams, roleChangeSchema } from './auth';

/**
 * The team page's forms: the shared API schemas plus the ids a form carries in hidden fields
 * (a route handler gets those from its URL instead).
 */

export const inviteFormSchema = inviteSchema.extend({ teamId: idParam });

export const roleChangeFormSchema = roleChangeSchema.extend(memberParams.shape);

export const removeMemberFormSchema = memberParams;

/** `?team=<id>` on /team: which of the person's teams to show; anything else means "the first". */
export const teamQuerySchema = z.object({ team: idParam.optional().catch(undefined) });

/** A checkbox posts "on" when ticked and nothing when not. */
const checkbox = z
  .literal('on', { error: 'Tick the box or leave it empty.' })
  .optional()
  .transform((value) => value === 'on');

export const teamSettingsFormSchema = z.object({
  teamId: idParam,
  requirePeerReview: checkbox,
  coachesMayPublish: checkbox,
});
