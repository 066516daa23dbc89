import { beforeAll, describe, expect, it } from 'vitest';
import * as accept from '@/app/api/invitations/[token]/accept/route';
import * as member from '@/app/api/teams/[teamId]/members/[membershipId]/route';
import { newToken } from '@/lib/auth/tokens';
import { Invitation, Membership } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';

// Racing duplicates: one success, the others a clear 409, and the team's rules still hold.
useTestApp();
let t: TeamFixture;

beforeAll(async () => {
  t = await makeTeam('race');
});

/** An open invitation to the other team, as its owner would send it; answers the link's token. */
async function inviteToOtherTeam(email: string): Promise<string> {
  const { token, hash } = newToken();
  await Invitation.create({
    teamId: t.otherTeamId,
    email,
    role: 'coach',
    tokenHash: hash,
    invitedById: t.userIds.outsider,
    expiresAt: new Date(Date.now() + 3_600_000),
  });
  return token;
}

describe('racing writes', () => {
  it('two owners demoting each other at the same moment leave the team with an owner', async () => {
    await Membership.update({ role: 'owner' }, { where: { teamId: t.teamId, userId: t.userIds.coach } });
    const ownerRow = (await Membership.findOne({ where: { teamId: t.teamId, userId: t.userIds.owner } }))!;
    const coachRow = (await Membership.findOne({ where: { teamId: t.teamId, userId: t.userIds.coach } }))!;
    const [a, b] = await Promise.all([
      t.owner.call(member.PATCH, {
        params: { teamId: String(t.teamId), membershipId: String(coachRow.id) },
        json: { role: 'coach' },
      }),
      t.coach.call(member.PATCH, {
        params: { teamId: String(t.teamId), membershipId: String(ownerRow.id) },
        json: { role: 'coach' },
      }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect(await Membership.count({ where: { teamId: t.teamId, role: 'owner' } })).toBe(1);
  });

  it('one invitation accepted by two people at once: one joins, the other gets 409', async () => {
    const token = await inviteToOtherTeam('shared-link@example.test');
    const [a, b] = await Promise.all([
      t.reviewer.call(accept.POST, { params: { token }, json: {} }),
      t.athlete.call(accept.POST, { params: { token }, json: {} }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect(await Membership.count({ where: { teamId: t.otherTeamId } })).toBe(2);
  });

  // The loser of the race above may read the invitation after the winner has committed: it is
  // told the link was used (409), as if they had arrived together, not that it never existed.
  it('an invitation accepted a moment after someone else gets 409, not 404', async () => {
    const token = await inviteToOtherTeam('late-link@example.test');
    const first = await t.coach.call(accept.POST, { params: { token }, json: {} });
    const second = await t.owner.call(accept.POST, { params: { token }, json: {} });
    expect([first.status, second.status]).toEqual([200, 409]);
    expect(second.body.error).toMatch(/already used/);
  });
});
