import { beforeAll, describe, expect, it } from 'vitest';
import * as one from '@/app/api/reviews/[id]/route';
import * as publish from '@/app/api/reviews/[id]/publish/route';
import * as unpublish from '@/app/api/reviews/[id]/unpublish/route';
import * as verdicts from '@/app/api/verdicts/route';
import { getServerSideProps } from '@/pages/v/[slug]/index';
import { findVerdictPage, verdictPage } from '@/lib/publishing/queries';
import { updateTeamSettings } from '@/lib/publishing/settings';
import { db } from '@/lib/db';
import { Membership, Publication, PublishedVersion, Review } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { readyReview } from './helpers';

useTestApp();
let t: TeamFixture;
const p = (id: number) => ({ id: String(id) });

beforeAll(async () => {
  t = await makeTeam('pub');
});

async function publishingRows() {
  const out: Record<string, unknown> = {};
  for (const table of ['publications', 'published_versions', 'reviews']) {
    const [rows] = await db().query(`SELECT * FROM ${table} ORDER BY id`);
    out[table] = rows;
  }
  return out;
}

describe('who may publish what', () => {
  it('refuses a review that is not approved while the team requires peer review (409), then allows it once the team drops the rule', async () => {
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Draft claim about campus boards and power.',
      approved: false,
    });
    const refused = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'team' } });
    expect(refused.status).toBe(409);
    expect(await Publication.count({ where: { reviewId: id } })).toBe(0);

    await updateTeamSettings(t.teamId, { requirePeerReview: false });
    const ok = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'team' } });
    expect(ok.status).toBe(201);
    expect(ok.body.version.number).toBe(1);
    await updateTeamSettings(t.teamId, { requirePeerReview: true });
  });

  it('a coach may publish only when the team lets coaches publish; reviewers and athletes never; outsiders get 404; signed out 401', async () => {
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Slow eccentric pull-ups fix elbow pain in a month.',
    });
    const json = { visibility: 'public' };
    expect((await t.coach.call(publish.POST, { params: p(id), json })).status).toBe(403);
    expect((await t.reviewer.call(publish.POST, { params: p(id), json })).status).toBe(403);
    expect((await t.athlete.call(publish.POST, { params: p(id), json })).status).toBe(403);
    expect((await t.outsider.call(publish.POST, { params: p(id), json })).status).toBe(404);
    expect((await t.anonymous.call(publish.POST, { params: p(id), json })).status).toBe(401);
    expect(await Publication.count({ where: { reviewId: id } })).toBe(0);

    await updateTeamSettings(t.teamId, { coachesMayPublish: true });
    const res = await t.coach.call(publish.POST, { params: p(id), json });
    await updateTeamSettings(t.teamId, { coachesMayPublish: false });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      visibility: 'public',
      version: { number: 1, publishedBy: 'Cato Brill', changeNote: null },
    });
    expect(await Review.findByPk(id).then((r) => r!.status)).toBe('published');
  });
});

describe('bad input: 400 in the error shape of docs/api/README.md, nothing changed', () => {
  it.each([
    ['no body', undefined, ''],
    ['malformed JSON', undefined, '{"visibility":'],
    ['unknown visibility', { visibility: 'everyone' }, undefined],
    ['visibility missing', {}, undefined],
    ['note not text', { visibility: 'team', changeNote: 42 }, undefined],
    ['note too long', { visibility: 'team', changeNote: 'x'.repeat(2001) }, undefined],
  ])('%s', async (_label, json, rawBody) => {
    const { id } = await readyReview(t.coach, t.teamId, { claim: `Bad input case ${_label} for publishing claims.` });
    const before = await publishingRows();
    const res = await t.owner.call(publish.POST, { params: p(id), json, rawBody });
    expect(res.status).toBe(400);
    expect(typeof res.body.error).toBe('string');
    expect(Array.isArray(res.body.issues)).toBe(true);
    for (const issue of res.body.issues)
      expect(issue).toEqual({ path: expect.any(String), message: expect.any(String) });
    expect(await publishingRows()).toEqual(before);
  });

  it('a non-numeric review id is a 400, a missing review a 404', async () => {
    expect((await t.owner.call(publish.POST, { params: { id: 'abc' }, json: { visibility: 'team' } })).status).toBe(
      400,
    );
    expect((await t.owner.call(publish.POST, { params: { id: '999999' }, json: { visibility: 'team' } })).status).toBe(
      404,
    );
  });

  it('an unpublish reason that is too short is a 400 and withdraws nothing', async () => {
    const { id } = await readyReview(t.coach, t.teamId, { claim: 'Short reasons do not withdraw verdicts at all.' });
    await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'team' } });
    const before = await publishingRows();
    const res = await t.owner.call(unpublish.POST, { params: p(id), json: { reason: 'no' } });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].path).toBe('reason');
    expect(await publishingRows()).toEqual(before);
  });
});

describe('versions', () => {
  it('version 2 needs a "what changed" note (400 naming changeNote, nothing written); with it, version 2 keeps version 1 as it was', async () => {
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Daily finger rolls thicken the flexor tendons quickly.',
    });
    const first = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'public' } });
    expect(first.status).toBe(201);
    const before = await publishingRows();
    const noNote = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'public' } });
    expect(noNote.status).toBe(400);
    expect(noNote.body.issues).toEqual([{ path: 'changeNote', message: 'Version 2 needs a “what changed” note.' }]);
    const blank = await t.owner.call(publish.POST, {
      params: p(id),
      json: { visibility: 'public', changeNote: '   ' },
    });
    expect(blank.status).toBe(400);
    expect(await publishingRows()).toEqual(before);

    const second = await t.owner.call(publish.POST, {
      params: p(id),
      json: { visibility: 'public', changeNote: 'Added a second mechanism after a reader question.' },
    });
    expect(second.status).toBe(201);
    expect(second.body.version).toMatchObject({
      number: 2,
      changeNote: 'Added a second mechanism after a reader question.',
    });
    const page = await verdictPage(first.body.slug, null);
    expect(page.version.number).toBe(2);
    expect(page.versions.map((v) => v.number)).toEqual([2, 1]);
    expect((await verdictPage(first.body.slug, null, 1)).version.changeNote).toBeNull();
  });

  it('editing the review after publishing does not change the published version', async () => {
    const { id } = await readyReview(t.coach, t.teamId, { claim: 'Cold showers double grip endurance in two weeks.' });
    const res = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'team' } });
    const slug = res.body.slug as string;
    const owner = await Membership.findOne({ where: { teamId: t.teamId, role: 'owner' } });
    const actor = { userId: owner!.userId, roles: new Map([[t.teamId, 'owner' as const]]) };
    const before = await verdictPage(slug, actor);
    const stored = await PublishedVersion.findOne({
      where: { publicationId: (await Publication.findOne({ where: { slug } }))!.id },
    });
    const storedBefore = JSON.stringify(stored!.snapshot);

    const review = await Review.findByPk(id);
    const edit = await t.coach.call(one.PATCH, {
      params: p(id),
      method: 'PATCH',
      json: {
        version: review!.version,
        claim: 'A completely different claim after publishing.',
        title: 'Edited title after publish',
      },
    });
    expect(edit.status).toBe(200);
    const after = await verdictPage(slug, actor);
    expect(after.snapshot.claim).toBe('Cold showers double grip endurance in two weeks.');
    expect(after).toEqual(before);
    await stored!.reload();
    expect(JSON.stringify(stored!.snapshot)).toBe(storedBefore);
    // The model refuses to update a version at all.
    await expect(stored!.update({ changeNote: 'rewritten' })).rejects.toThrow(/immutable/);
  });

  it('the snapshot carries the verdict, ranked mechanisms with terms and shares, the everyday protocol and a sanitized body', async () => {
    const { id } = await readyReview(t.coach, t.teamId, { claim: 'Hangs with ten kilos added build finger strength.' });
    const res = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'public' } });
    const page = await verdictPage(res.body.slug, null);
    const s = page.snapshot;
    expect(s.verdict.label).toBeTruthy();
    expect(s.verdict.summary.length).toBeGreaterThan(40);
    expect(s.mechanisms.map((m) => m.rank)).toEqual([1, 2]);
    for (const m of s.mechanisms) {
      expect(m.term).toMatch(/likely|unlikely|certain|chance|about as/i);
      expect(m.share).toBeGreaterThanOrEqual(0);
    }
    // 70 kg + 30 kg max, 10 kg added = 0.8 of maximum; at 55 kg with the same relative max (×1.4286): 0.8 × 78.6 = 62.9 → +7.9 kg.
    expect(s.everyday.loadTable).toEqual([
      { bodyweightKg: 55, totalKg: 63, addedKg: 8 },
      { bodyweightKg: 70, totalKg: 80, addedKg: 10 },
      { bodyweightKg: 85, totalKg: 97, addedKg: 12 },
    ]);
    expect(s.bodyHtml).toContain('Mechanism: Tendon stiffness');
    expect(s.bodyHtml).not.toMatch(/<script|javascript:|onerror/i);
    expect(s.bodyHtml).toContain('&lt;script&gt;');
  });
});

describe('visibility and withdrawal', () => {
  it('a team-only verdict is readable by every member, athletes included, and 404 to outsiders and signed-out readers', async () => {
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Team only: fingerboard repeaters cure tendinopathy.',
    });
    const res = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'team' } });
    const slug = res.body.slug;
    const list = async (c: typeof t.owner) =>
      (await c.call(verdicts.GET, { path: '/api/verdicts' })).body.verdicts.map((v: { slug: string }) => v.slug);
    expect(await list(t.athlete)).toContain(slug);
    expect(await list(t.reviewer)).toContain(slug);
    expect(await list(t.outsider)).not.toContain(slug);
    expect(await list(t.anonymous)).not.toContain(slug);
    await expect(verdictPage(slug, null)).rejects.toMatchObject({ status: 404 });
    await expect(
      verdictPage(slug, { userId: t.userIds.outsider, roles: new Map([[t.otherTeamId, 'owner']]) }),
    ).rejects.toMatchObject({ status: 404 });
    const athlete = { userId: t.userIds.athlete, roles: new Map([[t.teamId, 'athlete' as const]]) };
    expect((await verdictPage(slug, athlete)).snapshot.claim).toContain('Team only');
  });

  it('a public verdict is readable signed out; withdrawing keeps its versions and shows the reason, and drops it from public lists', async () => {
    const { id } = await readyReview(t.coach, t.teamId, {
      claim: 'Public: weighted pull-up ladders double lock-off strength.',
    });
    const res = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'public' } });
    const slug = res.body.slug;
    expect((await verdictPage(slug, null)).withdrawn).toBeNull();
    const anonList = async () =>
      (await t.anonymous.call(verdicts.GET, { path: '/api/verdicts' })).body.verdicts.map(
        (v: { slug: string }) => v.slug,
      );
    expect(await anonList()).toContain(slug);

    const w = await t.owner.call(unpublish.POST, {
      params: p(id),
      json: { reason: 'A study we relied on was retracted.' },
    });
    expect(w.status).toBe(200);
    const page = await verdictPage(slug, null);
    expect(page.withdrawn?.reason).toBe('A study we relied on was retracted.');
    expect(page.versions).toHaveLength(1);
    expect(await anonList()).not.toContain(slug);
    expect(
      (await t.owner.call(unpublish.POST, { params: p(id), json: { reason: 'Withdrawing it a second time.' } })).status,
    ).toBe(409);
  });
});

describe('the public page /v/[slug]', () => {
  /** Renders the signed-out page's data as Next would, with the headers it sets. */
  async function render(slug: string) {
    const headers = new Map<string, string>();
    const res = { statusCode: 200, setHeader: (name: string, value: string) => headers.set(name.toLowerCase(), value) };
    const result = (await getServerSideProps({ params: { slug }, res } as never)) as {
      props?: { page: { latestNumber: number; withdrawn: unknown } | null };
    };
    return {
      result,
      status: res.statusCode,
      cacheControl: headers.get('cache-control'),
      accelExpires: headers.get('x-accel-expires'),
    };
  }

  it('reads every change at once and lets shared caches keep it one second, browsers not at all', async () => {
    const { id } = await readyReview(t.coach, t.teamId, { claim: 'Fresh: daily max hangs grow finger strength.' });
    const first = await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'public' } });
    const slug = first.body.slug as string;
    const before = Math.floor(Date.now() / 1000);
    const v1 = await render(slug);
    const after = Math.floor(Date.now() / 1000);
    expect(v1.cacheControl).toBe('public, max-age=0, s-maxage=1');
    // For nginx: an absolute expiry in the second the render ran in — whatever the render took.
    const second = Number(v1.accelExpires?.replace(/^@/, ''));
    expect(second).toBeGreaterThanOrEqual(before);
    expect(second).toBeLessThanOrEqual(after + 1);
    expect(v1.result.props?.page).toMatchObject({ latestNumber: 1 });

    await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'public', changeNote: 'Added a study.' } });
    expect((await render(slug)).result.props?.page).toMatchObject({ latestNumber: 2 });

    await t.owner.call(unpublish.POST, { params: p(id), json: { reason: 'A study we relied on was retracted.' } });
    expect((await render(slug)).result.props?.page?.withdrawn).toMatchObject({
      reason: 'A study we relied on was retracted.',
    });

    await t.owner.call(publish.POST, { params: p(id), json: { visibility: 'team', changeNote: 'Team only for now.' } });
    const teamOnly = await render(slug);
    // The page answers its own 404, without scripts (components/verdict-page/MissingVerdictPage.tsx).
    expect(teamOnly.status).toBe(404);
    expect(teamOnly.result).toEqual({ props: { page: null } });
    expect(teamOnly.cacheControl).toBe('public, max-age=0, s-maxage=1');
  });

  it('findVerdictPage answers null (a 404) for malformed slugs and versions instead of querying', async () => {
    expect(await findVerdictPage('Not A Slug!', null)).toBeNull();
    expect(await findVerdictPage('x'.repeat(101), null)).toBeNull();
    expect(await findVerdictPage('cold-plunges', null, 0)).toBeNull();
    expect(await findVerdictPage('cold-plunges', null, 1.5)).toBeNull();
    expect(await findVerdictPage('no-such-verdict', null)).toBeNull();
  });
});
