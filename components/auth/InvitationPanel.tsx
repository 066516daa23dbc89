import Link from 'next/link';
import { RoleBadge } from '@/components/team/RoleBadge';
import { ROLE_INFO } from '@/components/team/roles';
import { LinkButton } from '@/components/ui/Button';
import type { InvitationView } from '@/lib/teams/invitations';
import { AuthCard } from './AuthCard';
import { JoinAsMemberForm, JoinWithAccountForm } from './JoinTeamForm';

interface Props {
  token: string;
  invitation: InvitationView;
  /** The signed-in person, if any. */
  user: { name: string; email: string } | null;
  alreadyMember: boolean;
}

/** One invitation, answered the way that fits who opened it (see acceptInvitation). */
export function InvitationPanel({ token, invitation, user, alreadyMember }: Props) {
  const here = `/invitations/${encodeURIComponent(token)}`;
  const summary = (showEmail = true) => (
    <dl className="border-line bg-paper-sunken mb-6 grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded-lg border px-4 py-3 text-sm">
      <dt className="text-ink-muted">Team</dt>
      <dd className="text-ink font-semibold" data-testid="invitation-team">
        {invitation.teamName}
      </dd>
      <dt className="text-ink-muted">Role</dt>
      <dd className="flex flex-wrap items-center gap-2">
        <RoleBadge role={invitation.role} />
        <span className="text-ink-muted">{ROLE_INFO[invitation.role].summary}</span>
      </dd>
      {showEmail && (
        <>
          <dt className="text-ink-muted">Sent to</dt>
          <dd className="text-ink break-all">{invitation.email}</dd>
        </>
      )}
    </dl>
  );

  if (user && alreadyMember) {
    return (
      <AuthCard title="You are already in this team" intro={`Signed in as ${user.email}.`}>
        {summary()}
        <LinkButton href="/dashboard" variant="primary" className="w-full">
          Go to dashboard
        </LinkButton>
      </AuthCard>
    );
  }

  if (user) {
    const otherAddress = user.email !== invitation.email;
    return (
      <AuthCard title={`Join ${invitation.teamName}`} intro={`You are signed in as ${user.name}.`}>
        {summary()}
        {otherAddress && (
          <p className="text-ink-muted mb-4 text-sm">
            The invitation went to {invitation.email}; you will join with the account you are signed in with (
            {user.email}).
          </p>
        )}
        <JoinAsMemberForm token={token} />
      </AuthCard>
    );
  }

  if (invitation.accountExists) {
    return (
      <AuthCard
        title={`Join ${invitation.teamName}`}
        intro="An account with this address exists. Sign in first; you come back here to join."
      >
        {summary()}
        <LinkButton href={`/sign-in?next=${encodeURIComponent(here)}`} variant="primary" className="w-full">
          Sign in first
        </LinkButton>
      </AuthCard>
    );
  }

  return (
    <AuthCard
      title={`Join ${invitation.teamName}`}
      intro="Create your account to accept. Already have one under another address? Sign in with it, then open this link again."
      footer={
        <p>
          <Link href={`/sign-in?next=${encodeURIComponent(here)}`} className="prose-link font-semibold">
            Sign in with another account
          </Link>
        </p>
      }
    >
      {summary(false)}
      <JoinWithAccountForm token={token} email={invitation.email} />
    </AuthCard>
  );
}

export function InvitationGone() {
  return (
    <AuthCard
      title="This invitation cannot be used"
      intro="It has expired (links work for 7 days), was already accepted, or the link is incomplete. Ask the team owner to send a new one."
    >
      <div className="flex flex-col gap-2 sm:flex-row">
        <LinkButton href="/sign-in" variant="primary" className="flex-1">
          Sign in
        </LinkButton>
        <LinkButton href="/" className="flex-1">
          About Loadbearing
        </LinkButton>
      </div>
    </AuthCard>
  );
}
