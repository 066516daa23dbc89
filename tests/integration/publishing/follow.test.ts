import { beforeAll, describe, expect, it } from 'vitest';
import * as publish from '@/app/api/reviews/[id]/publish/route';
import * as followRoute from '@/app/api/teams/[teamId]/follow/route';
import { followForToken, unsubscribe } from '@/lib/follows/follows';
import { Follow } from '@/models';
import { linkIn, useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { readyReview } from './helpers';

const app = useTestApp();
let t: TeamFixture;
const athleteEmail = 'fenna.lark.fol@example.test';
const outsiderEmail = 'gert.wold.fol@example.test';

beforeAll(async () => {
  t = await makeTeam('fol');
});

const team = () => ({ teamId: String(t.teamId) });
const mailsTo = (email: string) => app.smtp().messages.filter((m) => m.to.includes(email));

describe('following a team', () => {
  it('signed out is 401; an outsider cannot follow a team with nothing public (404); a member can', async () => {
    expect((await t.anonymous.call(followRoute.POST, { params: team() })).status).toBe(401);
    expect((await t.outsider.call(followRoute.POST, { params: team() })).status).toBe(404);
    expect((await t.outsider.call(followRoute.POST, { params: { teamId: 'x' } })).status).toBe(400);
    const res = await t.athlete.call(followRoute.POST, { params: team() });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ teamId: t.teamId, following: true });
    // Following twice is the same as once.
    await t.athlete.call(followRoute.POST, { params: team() });
    expect(await Follow.count({ where: { teamId: t.teamId, userId: t.userIds.athlete } })).toBe(1);
  });

  it('a new verdict mails the following athlete, with the link, the cautions and a working unsubscribe link', async () => {
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Lifting a pinch block daily stiffens thumb tendons.',
    });
    const res = await t.owner.call(publish.POST, { params: { id: String(id) }, json: { visibility: 'team' } });
    expect(res.status).toBe(201);
    expect(res.body.notified).toBe(1);
    const mail = await app.smtp().waitFor((m) => m.to.includes(athleteEmail) && /New verdict/.test(m.subject));
    expect(mail.text).toContain(`http://app.test/v/${res.body.slug}`);
    expect(mail.text).toMatch(/Stop on pain and see a licensed clinician/);
    expect(mail.html).toMatch(/unsubscribe/);
    const link = linkIn(mail.text, 'http://app.test/unsubscribe/');
    const token = link.split('/unsubscribe/')[1];
    expect(await followForToken(token)).not.toBeNull();
    // A forged signature or someone else's id is refused.
    expect(await followForToken(token.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A')))).toBeNull();
    expect(await followForToken(`999${token}`)).toBeNull();

    expect(await unsubscribe(token)).toEqual({ teamName: expect.stringContaining('Runa Ostby') });
    expect(await Follow.count({ where: { teamId: t.teamId, userId: t.userIds.athlete } })).toBe(0);
    // The link is used up.
    expect(await unsubscribe(token)).toBeNull();

    const before = mailsTo(athleteEmail).length;
    const second = await t.owner.call(publish.POST, {
      params: { id: String(id) },
      json: { visibility: 'team', changeNote: 'Clarified the dose.' },
    });
    expect(second.status).toBe(201);
    expect(second.body.notified).toBe(0);
    await new Promise((r) => setTimeout(r, 300));
    expect(mailsTo(athleteEmail).length).toBe(before);
  });

  it('an outsider may follow once the team publishes something public, and is mailed only about public verdicts', async () => {
    const { id: publicId } = await readyReview(t.coach, t.teamId, {
      claim: 'Public one: antagonist push-ups prevent elbow pain.',
    });
    await t.owner.call(publish.POST, { params: { id: String(publicId) }, json: { visibility: 'public' } });
    expect((await t.outsider.call(followRoute.POST, { params: team() })).status).toBe(200);

    const { id: teamOnly } = await readyReview(t.coach, t.teamId, {
      claim: 'Team only one: warm-up hangs reduce pulley strains.',
    });
    const r1 = await t.owner.call(publish.POST, { params: { id: String(teamOnly) }, json: { visibility: 'team' } });
    expect(r1.body.notified).toBe(0);
    const r2 = await t.owner.call(publish.POST, {
      params: { id: String(publicId) },
      json: { visibility: 'public', changeNote: 'Added a study.' },
    });
    expect(r2.body.notified).toBe(1);
    // The outsider's first mail confirmed their sign-up; this one is about the verdict.
    const mail = await app.smtp().waitFor((m) => m.to.includes(outsiderEmail) && !/^Confirm/.test(m.subject));
    expect(mail.subject).toMatch(/version 2/);
    expect(mail.text).toContain('What changed: Added a study.');
    expect(mailsTo(outsiderEmail).some((m) => m.text.includes('warm-up hangs'))).toBe(false);

    expect((await t.outsider.call(followRoute.DELETE, { params: team(), method: 'DELETE' })).body).toEqual({
      teamId: t.teamId,
      following: false,
    });
  });
});
