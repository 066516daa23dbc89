import { beforeAll, describe, expect, it } from 'vitest';
import * as accept from '@/app/api/invitations/[token]/accept/route';
import * as reset from '@/app/api/auth/password-reset/route';
import * as confirm from '@/app/api/auth/password-reset/confirm/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as signUp from '@/app/api/auth/sign-up/route';
import * as member from '@/app/api/teams/[teamId]/members/[membershipId]/route';
import * as members from '@/app/api/teams/[teamId]/members/route';
import { db } from '@/lib/db';
import { Client, useTestApp, signUpConfirmed } from '../../helpers/app';

useTestApp();
const owner = new Client();
const params: Record<string, string> = {};

beforeAll(async () => {
  const res = await signUpConfirmed(owner, { name: 'Val Idator', email: 'val@example.test', password: 'valid-password-1', teamName: 'Checks' });
  params.teamId = String(res.body.team.id);
  const list = await owner.call(members.GET, { params: { teamId: params.teamId } });
  params.membershipId = String(list.body.members[0].membershipId);
  params.token = 'x'.repeat(43);
});

/** Row counts of every table, to prove a refused request changed nothing. */
async function snapshot(): Promise<Record<string, number>> {
  const tables = ['users', 'teams', 'memberships', 'invitations', 'password_reset_tokens', 'audit_events'];
  const out: Record<string, number> = {};
  for (const t of tables) {
    const [[row]] = (await db().query(`SELECT COUNT(*) AS n FROM ${t}`)) as [{ n: number }[], unknown];
    out[t] = row.n;
  }
  return out;
}

type Handler = Parameters<Client['call']>[0];
const ROUTES: { name: string; handler: Handler; method: string; signedIn: boolean; missing: object; wrongTypes: object }[] = [
  { name: 'POST /api/auth/sign-up', handler: signUp.POST, method: 'POST', signedIn: false, missing: { email: 'a@b.test' }, wrongTypes: { name: 1, email: true, password: [], teamName: {} } },
  { name: 'POST /api/auth/sign-in', handler: signIn.POST, method: 'POST', signedIn: false, missing: {}, wrongTypes: { email: 42, password: false } },
  { name: 'POST /api/auth/password-reset', handler: reset.POST, method: 'POST', signedIn: false, missing: {}, wrongTypes: { email: ['x'] } },
  { name: 'POST /api/auth/password-reset/confirm', handler: confirm.POST, method: 'POST', signedIn: false, missing: { token: 'abcdefghijkl' }, wrongTypes: { token: 5, password: 5 } },
  { name: 'POST /api/teams/:teamId/members', handler: members.POST, method: 'POST', signedIn: true, missing: { email: 'x@y.test' }, wrongTypes: { email: 'not-an-email', role: 'captain' } },
  { name: 'PATCH /api/teams/:teamId/members/:membershipId', handler: member.PATCH, method: 'PATCH', signedIn: true, missing: {}, wrongTypes: { role: 7 } },
  { name: 'POST /api/invitations/:token/accept', handler: accept.POST, method: 'POST', signedIn: false, missing: { name: 'Only Name' }, wrongTypes: { name: 3, password: 4 } },
];

describe('bad input is a 400 in the error shape of docs/api/README.md and changes nothing', () => {
  for (const route of ROUTES) {
    const client = () => (route.signedIn ? owner : new Client());
    const cases: [string, { rawBody?: string; json?: unknown }][] = [
      ['malformed JSON', { rawBody: '{"email": "a@b.test",' }],
      ['an empty body', { rawBody: '' }],
      ['missing fields', { json: route.missing }],
      ['wrong types', { json: route.wrongTypes }],
      ['a JSON array instead of an object', { json: [1, 2] }],
    ];
    for (const [label, body] of cases) {
      it(`${route.name}: ${label}`, async () => {
        const before = await snapshot();
        const res = await client().call(route.handler, { method: route.method, params, ...body });
        expect(res.status).toBe(400);
        expect(res.body).toEqual({ error: expect.any(String), issues: expect.any(Array) });
        expect(res.body.error.length).toBeGreaterThan(0);
        for (const issue of res.body.issues) expect(issue).toEqual({ path: expect.any(String), message: expect.any(String) });
        expect(await snapshot()).toEqual(before);
      });
    }
  }

  it('a non-numeric id in the path is a 400, not a 500', async () => {
    const res = await owner.call(members.GET, { params: { teamId: 'abc' } });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].path).toBe('teamId');
  });

  it('names the field at fault', async () => {
    const res = await new Client().call(signUp.POST, { json: { name: 'N', email: 'n@example.test', password: 'short', teamName: 'Team' } });
    expect(res.body.issues).toEqual([{ path: 'password', message: 'Use at least 10 characters.' }]);
  });
});
