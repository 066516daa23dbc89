import { describe, expect, it } from 'vitest';
import * as me from '@/app/api/me/route';
import { Membership } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam } from '../reviews/helpers';

useTestApp();

describe('GET /api/me', () => {
  it('counts the members of each of the person’s teams', async () => {
    const t = await makeTeam('summaries');
    // The owner also joins the other team, which has one member (its owner) so far.
    await Membership.create({ teamId: t.otherTeamId, userId: t.userIds.owner, role: 'coach' });
    const res = await t.owner.call(me.GET);
    expect(res.status).toBe(200);
    const counts = Object.fromEntries(
      (res.body.teams as Array<{ id: number; memberCount: number }>).map((team) => [team.id, team.memberCount]),
    );
    expect(counts).toEqual({
      [t.teamId]: await Membership.count({ where: { teamId: t.teamId } }),
      [t.otherTeamId]: 2,
    });
    expect(counts[t.teamId]).toBeGreaterThan(2);
  });
});
