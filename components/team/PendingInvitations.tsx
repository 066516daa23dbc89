'use client';

import { useActionState } from 'react';
import { inviteAction } from '@/app/(app)/team/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import type { Role } from '@/models/roles';
import { RoleBadge } from './RoleBadge';

export interface InvitationRow {
  id: number;
  email: string;
  role: Role;
  expires: string;
}

/** Open invitations; sending again replaces the old link with a fresh 7-day one. */
export function PendingInvitations({ teamId, invitations }: { teamId: number; invitations: InvitationRow[] }) {
  const [state, action] = useActionState(inviteAction, {});
  return (
    <div className="space-y-3">
      <FormMessage state={state} className="empty:hidden" />
      <ul className="divide-line border-line divide-y rounded-md border">
        {invitations.map((invitation) => (
          <li key={invitation.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3 text-sm">
            <div className="min-w-0">
              <p className="flex flex-wrap items-center gap-2">
                <span className="text-ink font-semibold break-all">{invitation.email}</span>
                <RoleBadge role={invitation.role} />
              </p>
              <p className="text-ink-muted">Link valid until {invitation.expires}</p>
            </div>
            <form action={action}>
              <input type="hidden" name="teamId" value={teamId} />
              <input type="hidden" name="email" value={invitation.email} />
              <input type="hidden" name="role" value={invitation.role} />
              <SubmitButton variant="ghost" size="sm" aria-label={`Send again to ${invitation.email}`}>
                Send again
              </SubmitButton>
            </form>
          </li>
        ))}
      </ul>
    </div>
  );
}
