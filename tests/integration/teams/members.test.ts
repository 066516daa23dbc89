import { beforeAll, describe, expect, it } from 'vitest';
import * as accept from '@/app/api/invitations/[token]/accept/route';
import * as invitation from '@/app/api/invitations/[token]/route';
import * as me from '@/app/api/me/route';
import * as member from '@/app/api/teams/[teamId]/members/[membershipId]/route';
import * as members from '@/app/api/teams/[teamId]/members/route';
import { AuditEvent, Membership } from '@/models';
import { Client, linkIn, useTestApp, signUpConfirmed } from '../../helpers/app';

const app = useTestApp();
const owner = new Client();
const outsider = new Client('10.0.0.9');
let teamId: string;
let otherTeamId: string;

async function inviteAndReadToken(email: string, role: string): Promise<string> {
  const res = await owner.call(members.POST, { params: { teamId }, json: { email, role } });
  expect(res.status).toBe(201);
  const mail = await app.smtp().waitFor((m) => m.to.includes(email) && /invited you/.test(m.subject));
  expect(mail.subject).toMatch(/invited you to Crux Lab/);
  expect(mail.html).toContain('href="http://app.test/invitations/');
  return decodeURIComponent(linkIn(mail.text, 'http://app.test/invitations/').split('/').pop()!);
}

beforeAll(async () => {
  teamId = String((await signUpConfirmed(owner, { name: 'Olga Owner', email: 'olga@example.test', password: 'owner-password-1', teamName: 'Crux Lab' })).body.team.id);
  otherTeamId = String((await signUpConfirmed(outsider, { name: 'Otto Other', email: 'otto@example.test', password: 'other-password-1', teamName: 'Other Lab' })).body.team.id);
});

describe('invitations', () => {
  it('invites by e-mail; a new person creates an account from the link and joins with the role', async () => {
    const token = await inviteAndReadToken('cora@example.test', 'coach');
    const view = await new Client().call(invitation.GET, { params: { token } });
    expect(view.body.invitation).toEqual({ teamId: Number(teamId), teamName: 'Crux Lab', email: 'cora@example.test', role: 'coach', accountExists: false });

    const cora = new Client();
    const joined = await cora.call(accept.POST, { params: { token }, json: { name: 'Cora Coach', password: 'coach-password-1' } });
    expect(joined.status).toBe(200);
    const who = await cora.call(me.GET);
    expect(who.body.teams).toEqual([expect.objectContaining({ name: 'Crux Lab', role: 'coach' })]);

    const reused = await new Client().call(accept.POST, { params: { token }, json: { name: 'X', password: 'another-password' } });
    expect(reused.status).toBe(409);
  });

  it('an existing account accepts while signed in', async () => {
    const token = await inviteAndReadToken('otto@example.test', 'reviewer');
    const joined = await outsider.call(accept.POST, { params: { token }, json: {} });
    expect(joined.status).toBe(200);
    const who = await outsider.call(me.GET);
    expect(who.body.teams.map((t: { role: string }) => t.role).sort()).toEqual(['owner', 'reviewer']);
  });

  it('a signed-out visitor whose e-mail has an account is told to sign in, and nothing changes', async () => {
    await signUpConfirmed(new Client(), { name: 'Dana Dup', email: 'dana@example.test', password: 'dana-password-1', teamName: 'Dana Lab' });
    const token = await inviteAndReadToken('dana@example.test', 'athlete');
    const before = await Membership.count();
    const res = await new Client().call(accept.POST, { params: { token }, json: { name: 'Dana Again', password: 'dana-password-2' } });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/Sign in/);
    expect(await Membership.count()).toBe(before);
  });

  it('refuses to invite someone who is already in the team', async () => {
    const res = await owner.call(members.POST, { params: { teamId }, json: { email: 'cora@example.test', role: 'athlete' } });
    expect(res.status).toBe(400);
    expect(res.body.issues).toEqual([{ path: 'email', message: 'Already a member.' }]);
  });
});

describe('members', () => {
  it('the owner lists members; a coach cannot (403); another team cannot see it (404)', async () => {
    const list = await owner.call(members.GET, { params: { teamId } });
    expect(list.status).toBe(200);
    expect(list.body.members.map((m: { name: string }) => m.name)).toEqual(['Olga Owner', 'Cora Coach', 'Otto Other']);

    const cora = new Client();
    await cora.call((await import('@/app/api/auth/sign-in/route')).POST, { json: { email: 'cora@example.test', password: 'coach-password-1' } });
    expect((await cora.call(members.GET, { params: { teamId } })).status).toBe(403);
    expect((await cora.call(members.POST, { params: { teamId }, json: { email: 'z@example.test', role: 'coach' } })).status).toBe(403);

    const stranger = new Client();
    await signUpConfirmed(stranger, { name: 'Sam Stranger', email: 'sam@example.test', password: 'stranger-password', teamName: 'Far Away' });
    expect((await stranger.call(members.GET, { params: { teamId } })).status).toBe(404);
    expect((await new Client().call(members.GET, { params: { teamId } })).status).toBe(401);
  });

  it('changes a role and records it in the audit log', async () => {
    const list = await owner.call(members.GET, { params: { teamId } });
    const cora = list.body.members.find((m: { name: string }) => m.name === 'Cora Coach');
    const res = await owner.call(member.PATCH, { params: { teamId, membershipId: String(cora.membershipId) }, json: { role: 'reviewer' } });
    expect(res.status).toBe(200);
    expect(res.body.member.role).toBe('reviewer');
    expect(await AuditEvent.count({ where: { action: 'member.role_changed', teamId: Number(teamId) } })).toBe(1);
  });

  it('keeps the last owner: demoting or removing them is 409', async () => {
    const list = await owner.call(members.GET, { params: { teamId } });
    const olga = list.body.members.find((m: { name: string }) => m.name === 'Olga Owner');
    const params = { teamId, membershipId: String(olga.membershipId) };
    expect((await owner.call(member.PATCH, { params, json: { role: 'coach' } })).status).toBe(409);
    expect((await owner.call(member.DELETE, { method: 'DELETE', params })).status).toBe(409);
  });

  it('removes a member; a membership of another team is 404', async () => {
    const list = await owner.call(members.GET, { params: { teamId } });
    const otto = list.body.members.find((m: { name: string }) => m.name === 'Otto Other');
    const res = await owner.call(member.DELETE, { method: 'DELETE', params: { teamId, membershipId: String(otto.membershipId) } });
    expect(res.status).toBe(200);
    expect(await Membership.count({ where: { teamId: Number(teamId) } })).toBe(2);

    const ottoOwn = await Membership.findOne({ where: { teamId: Number(otherTeamId) } });
    const cross = await owner.call(member.DELETE, { method: 'DELETE', params: { teamId, membershipId: String(ottoOwn!.id) } });
    expect(cross.status).toBe(404);
  });
});
