'use client';

import { useActionState } from 'react';
import { changeRoleAction, removeMemberAction } from '@/app/(app)/team/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';
import type { FormState } from '@/lib/auth/action';
import type { Role } from '@/models/roles';
import { RoleBadge } from './RoleBadge';
import { ROLE_OPTIONS } from './roles';

export interface MemberView {
  membershipId: number;
  name: string;
  email: string;
  role: Role;
  joined: string;
  isYou: boolean;
}

/**
 * The owner's members table. A removed row disappears, so the outcome of a removal is shown
 * above the table rather than in the row.
 */
export function MembersTable({
  teamId,
  teamName,
  members,
}: {
  teamId: number;
  teamName: string;
  members: MemberView[];
}) {
  const [removeState, removeAction] = useActionState(removeMemberAction, {});
  return (
    <div className="space-y-3">
      <FormMessage state={removeState} className="px-5 pt-4 empty:hidden" />
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Members of {teamName}</caption>
        <thead className="border-line text-ink-muted hidden border-b text-xs tracking-wide uppercase md:table-header-group">
          <tr>
            <th scope="col" className="px-5 py-2 font-semibold">
              Member
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Joined
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Role
            </th>
            <th scope="col" className="px-5 py-2 text-right font-semibold">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-line divide-y">
          {members.map((member) => (
            <MemberRow key={member.membershipId} teamId={teamId} member={member} removeAction={removeAction} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

function MemberRow({
  teamId,
  member,
  removeAction,
}: {
  teamId: number;
  member: MemberView;
  removeAction: (form: FormData) => void;
}) {
  const [state, action] = useActionState(changeRoleAction, {} as FormState);
  const selectId = `role-${member.membershipId}`;
  return (
    <tr className="block px-5 py-4 md:table-row md:p-0" data-testid={`member-${member.email}`}>
      <th scope="row" className="block text-left font-normal md:table-cell md:px-5 md:py-3">
        <span className="flex flex-wrap items-center gap-2">
          <span className="text-ink font-semibold">{member.name}</span>
          {member.isYou && <span className="text-ink-muted text-xs">(you)</span>}
          <span className="md:hidden">
            <RoleBadge role={member.role} />
          </span>
        </span>
        <span className="text-ink-muted block break-all">{member.email}</span>
      </th>
      <td className="text-ink-muted block pt-1 md:table-cell md:px-3 md:py-3 md:whitespace-nowrap">
        <span className="md:hidden">Joined </span>
        {member.joined}
      </td>
      <td className="block pt-3 md:table-cell md:px-3 md:py-3">
        <form action={action} className="flex items-center gap-2">
          <input type="hidden" name="teamId" value={teamId} />
          <input type="hidden" name="membershipId" value={member.membershipId} />
          <label htmlFor={selectId} className="sr-only">
            Role of {member.name}
          </label>
          <select
            id={selectId}
            name="role"
            defaultValue={member.role}
            key={member.role}
            className="border-line-strong bg-paper-raised text-ink hover:border-chalk-400 min-h-9 rounded-md border px-2 text-sm"
          >
            {ROLE_OPTIONS.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
          <SubmitButton variant="secondary" size="sm" aria-label={`Change role of ${member.name}`}>
            Change
          </SubmitButton>
        </form>
        <FormMessage state={state} className="mt-2 empty:hidden" />
      </td>
      <td className="block pt-3 md:table-cell md:px-5 md:py-3 md:text-right">
        <details className="group inline-block text-left">
          <summary className="text-danger-700 hover:bg-danger-50 inline-flex min-h-9 cursor-pointer list-none items-center rounded-md px-3 text-sm font-semibold [&::-webkit-details-marker]:hidden">
            Remove…
          </summary>
          <form
            action={removeAction}
            className="border-danger-100 bg-danger-50 mt-2 max-w-xs space-y-2 rounded-md border p-3 text-sm"
          >
            <input type="hidden" name="teamId" value={teamId} />
            <input type="hidden" name="membershipId" value={member.membershipId} />
            <p className="text-danger-800">
              {member.name} loses access to this team&apos;s reviews and verdicts. You can invite them again later.
            </p>
            <SubmitButton variant="danger" size="sm">
              Remove {member.name}
            </SubmitButton>
          </form>
        </details>
      </td>
    </tr>
  );
}
