'use server';

import { revalidatePath } from 'next/cache';
import { formAction } from '@/lib/auth/action';
import { recordEvent } from '@/lib/audit/record';
import { updateTeamSettings } from '@/lib/publishing/settings';
import { changeRole, removeMember } from '@/lib/teams/members';
import { inviteMember } from '@/lib/teams/invitations';
import {
  inviteFormSchema,
  removeMemberFormSchema,
  roleChangeFormSchema,
  teamSettingsFormSchema,
} from '@/lib/validation/team-forms';
import { ROLE_INFO } from '@/components/team/roles';

export const inviteAction = formAction(inviteFormSchema, async ({ teamId, email, role }, { authorize, signedIn }) => {
  authorize('team.members.invite', { teamId }, 'That team');
  await inviteMember(signedIn().userId, teamId, { email, role });
  revalidatePath('/team');
  return {
    ok: true,
    message: `Invitation sent to ${email} as ${ROLE_INFO[role].label.toLowerCase()}. The link works for 7 days.`,
  };
});

export const changeRoleAction = formAction(
  roleChangeFormSchema,
  async ({ teamId, membershipId, role }, { authorize, signedIn }) => {
    authorize('team.members.update', { teamId }, 'That team');
    const member = await changeRole(signedIn().userId, teamId, membershipId, role);
    revalidatePath('/team');
    revalidatePath('/dashboard');
    return { ok: true, message: `${member.name} is now ${ROLE_INFO[role].label.toLowerCase()}.` };
  },
);

export const removeMemberAction = formAction(
  removeMemberFormSchema,
  async ({ teamId, membershipId }, { authorize, signedIn }) => {
    authorize('team.members.remove', { teamId }, 'That team');
    await removeMember(signedIn().userId, teamId, membershipId);
    revalidatePath('/team');
    revalidatePath('/dashboard');
    return { ok: true, message: 'Removed from the team.' };
  },
);

export const updateSettingsAction = formAction(
  teamSettingsFormSchema,
  async ({ teamId, requirePeerReview, coachesMayPublish }, { authorize, signedIn }) => {
    authorize('team.settings.update', { teamId }, 'That team');
    await updateTeamSettings(teamId, { requirePeerReview, coachesMayPublish });
    await recordEvent({
      teamId,
      actorId: signedIn().userId,
      action: 'team.settings_changed',
      subjectType: 'team',
      subjectId: teamId,
      data: { requirePeerReview, coachesMayPublish },
    });
    revalidatePath('/team');
    return { ok: true, message: 'Publishing rules saved.' };
  },
);
