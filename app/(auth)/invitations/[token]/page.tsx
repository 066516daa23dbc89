import type { Metadata } from 'next';
import { InvitationGone, InvitationPanel } from '@/components/auth/InvitationPanel';
import { AppError } from '@/lib/api/errors';
import { findUser } from '@/lib/auth/accounts';
import { currentActor } from '@/lib/auth/current';
import { viewInvitation, type InvitationView } from '@/lib/teams/invitations';

export const metadata: Metadata = { title: 'Team invitation', robots: { index: false } };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let invitation: InvitationView;
  try {
    invitation = await viewInvitation(token);
  } catch (error) {
    if (error instanceof AppError) return <InvitationGone />;
    throw error;
  }
  const actor = await currentActor();
  const user = actor ? await findUser(actor.userId) : null;
  return (
    <InvitationPanel
      token={token}
      invitation={invitation}
      user={user}
      alreadyMember={Boolean(actor?.roles.has(invitation.teamId))}
    />
  );
}
