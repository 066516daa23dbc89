import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as watchRoute from '@/app/api/teams/[teamId]/evidence-watch/route';
import * as signIn from '@/app/api/auth/sign-in/route';
import { seed } from '@/db/migrate';
import { db } from '@/lib/db';
import { DEMO_NOTICES, startFakeCrossrefServer, type FakeCrossrefServer } from '@/lib/citations/fake-crossref-server';
import { verdictPage } from '@/lib/publishing/queries';
import { runWatch } from '@/lib/watch/run';
import { Appraisal, Publication, Study, Team, User } from '@/models';
import * as dismiss from '@/app/api/evidence-suggestions/[id]/dismiss/route';
import { loadActor } from '@/lib/auth/actor';
import { resetSearchIndexes } from '@/lib/search/index-store';
import { suggestionsFor } from '@/lib/watch/suggestions';
import { DoiCheck } from '@/models/doi-check';
import { EvidenceFlag } from '@/models/evidence-flag';
import { Client, useTestApp } from '../../helpers/app';

/** The actor of a fresh session of that user. */
const actorOf = async (userId: number) =>
  loadActor({ userId, generation: (await User.findByPk(userId))!.sessionGeneration });

/**
 * The evidence watch against the local registry fake (lib/citations/fake-crossref-server.ts):
 * the demo seed's state, then from a clean slate a retraction, nothing new, a correction, the
 * registry down (nothing changes) and 429 back-off.
 */

const { smtp } = useTestApp();
let fake: FakeCrossrefServer;
let teamId: number;
const RETRACTED = '10.5555/hjts.2022.0333';
const CORRECTED = '10.5555/hjts.2020.0421';
const retraction = DEMO_NOTICES.filter((n) => n.doi === RETRACTED);
const noWait = { sleep: async () => undefined };

const studyNotice = async (doi: string) => (await Study.findOne({ where: { teamId, doi } }))!.evidenceNotice;
const pubId = async (slug: string) => (await Publication.findOne({ where: { slug } }))!.id;

beforeAll(async () => {
  fake = await startFakeCrossrefServer();
  process.env.CROSSREF_BASE_URL = fake.url;
  process.env.CROSSREF_MAILTO = 'watch@granite-hollow.test';
  await seed(db());
  teamId = (await Team.findOne({ where: { slug: 'granite-hollow' } }))!.id;
});

afterAll(async () => {
  await fake.close();
});

describe('evidence watch', () => {
  it('the demo seed: the retracted study is marked and the public verdict citing it is flagged', async () => {
    expect(await studyNotice(RETRACTED)).toEqual({
      kind: 'retraction',
      noticeDoi: '10.5555/hjts.2026.r0333',
      date: '2026-11-20',
    });
    const page = await verdictPage('cold-plunges-after-strength', null);
    expect(page.evidenceChanged).toEqual([
      expect.objectContaining({ kind: 'retraction', noticeDoi: '10.5555/hjts.2026.r0333', date: '2026-11-20' }),
    ]);
    const flag = await EvidenceFlag.findOne({ where: { publicationId: await pubId('cold-plunges-after-strength') } });
    expect(flag!.reason).toMatch(/was retracted on 20 Nov 2026/);
    expect(flag!.dryRun).toMatchObject({ studyId: expect.any(Number), verdict: expect.any(String) });
    // An earlier version shows no notice: the flag belongs to the version it was raised on.
    expect((await verdictPage('cold-plunges-after-strength', null, 1)).evidenceChanged).toEqual([]);

    // From here on, a clean slate: as if the watch had never run.
    await EvidenceFlag.destroy({ where: {} });
    await DoiCheck.destroy({ where: {} });
    await Study.update({ evidenceNotice: null }, { where: {} });
  });

  it('a retraction: marks the study, flags the verdict with reason and dry run, shows it on the next read, mails author and owner', async () => {
    fake.setNotices(retraction);
    // Read once before the run: the next read after it must show the notice.
    expect((await verdictPage('cold-plunges-after-strength', null)).evidenceChanged).toEqual([]);
    const before = fake.requests;
    const run = await runWatch(teamId, { trigger: 'member', maxAgeMs: 0, client: noWait });

    expect(run.status).toBe('done');
    const libraryDois = await Study.count({ where: { teamId }, distinct: true, col: 'doi' });
    expect(fake.requests - before).toBe(libraryDois);
    expect(fake.maxConcurrent).toBe(1);
    expect(fake.lastUserAgent).toContain('mailto:watch@granite-hollow.test');
    expect(run.summary!.newNotices.map((n) => n.notice.kind)).toEqual(['retraction']);
    expect(run.summary!.flagged.map((f) => f.slug)).toEqual(['cold-plunges-after-strength']);
    expect(await studyNotice(RETRACTED)).toMatchObject({ kind: 'retraction', date: '2026-11-20' });
    expect(await studyNotice(CORRECTED)).toBeNull();

    const page = await verdictPage('cold-plunges-after-strength', null);
    expect(page.evidenceChanged!.map((n) => n.kind)).toEqual(['retraction']);
    const flag = (await EvidenceFlag.findOne({
      where: { publicationId: await pubId('cold-plunges-after-strength') },
    }))!;
    expect(flag.versionNumber).toBe(2);
    expect(flag.reason).toMatch(/retracted on 20 Nov 2026 \(notice doi:10\.5555\/hjts\.2026\.r0333\)/);
    expect(flag.reason).not.toMatch(/Without it/);
    expect(flag.dryRun!.currentVerdict).toBe(page.snapshot.verdict.key);

    const mail = await smtp().waitFor(
      (m) => m.to.includes('owner@granite-hollow.test') && /Evidence changed/.test(m.subject),
    );
    expect(mail.text).toContain('retracted on 20 Nov 2026');
    expect(mail.html).toContain('10.5555/hjts.2026.r0333');
    expect(run.summary!.mailed).toBeGreaterThanOrEqual(1);
    // The checks are cached with the date they were made.
    expect((await DoiCheck.findOne({ where: { doi: RETRACTED } }))!.checkedAt.getTime()).toBeGreaterThan(
      Date.now() - 60_000,
    );
  });

  it('nothing new: a second run flags and mails nothing, and the daily run asks nothing fresh in the cache', async () => {
    const mails = smtp().messages.length;
    const again = await runWatch(teamId, { trigger: 'member', maxAgeMs: 0, client: noWait });
    expect(again.status).toBe('done');
    expect(again.summary).toMatchObject({ newNotices: [], flagged: [], mailed: 0 });
    expect(await EvidenceFlag.count()).toBe(1);

    const before = fake.requests;
    const daily = await runWatch(teamId, { trigger: 'schedule', client: noWait });
    expect(daily.summary).toMatchObject({ asked: 0, flagged: [] });
    expect(fake.requests).toBe(before);
    expect(smtp().messages.length).toBe(mails);
  });

  it('a correction: marks the study corrected and flags the team-only verdict citing it', async () => {
    fake.setNotices(DEMO_NOTICES);
    const run = await runWatch(teamId, { trigger: 'member', maxAgeMs: 0, client: noWait });
    expect(run.status).toBe('done');
    expect(run.summary!.newNotices).toEqual([
      expect.objectContaining({
        notice: { kind: 'correction', noticeDoi: '10.5555/hjts.2026.c0421', date: '2026-11-27' },
      }),
    ]);
    expect(run.summary!.flagged.map((f) => f.slug)).toEqual(['weighted-pull-up-ladder']);
    expect(await studyNotice(CORRECTED)).toMatchObject({ kind: 'correction' });
  });

  it('the registry down: the run reports it and changes nothing', async () => {
    fake.setNotices([
      ...DEMO_NOTICES,
      { doi: '10.5555/hjts.2019.0255', kind: 'retraction', noticeDoi: '10.5555/x.r1', date: [2026, 12, 1] },
    ]);
    fake.setMode('down');
    const flagsBefore = await EvidenceFlag.count();
    const checksBefore = (await DoiCheck.findAll({ order: [['doi', 'ASC']] })).map((c) => c.checkedAt.getTime());
    const run = await runWatch(teamId, { trigger: 'member', maxAgeMs: 0, client: noWait });
    expect(run.status).toBe('failed');
    expect(run.error).toMatch(/registry answered 503/);
    expect(await EvidenceFlag.count()).toBe(flagsBefore);
    expect(await studyNotice('10.5555/hjts.2019.0255')).toBeNull();
    expect((await DoiCheck.findAll({ order: [['doi', 'ASC']] })).map((c) => c.checkedAt.getTime())).toEqual(
      checksBefore,
    );

    // Unreachable altogether (nothing listening) reads the same way.
    const closed = await startFakeCrossrefServer();
    await closed.close();
    const unreachable = await runWatch(teamId, {
      trigger: 'member',
      maxAgeMs: 0,
      client: { ...noWait, baseUrl: closed.url },
    });
    expect(unreachable.status).toBe('failed');
    expect(unreachable.error).toMatch(/did not answer/);
    expect(await EvidenceFlag.count()).toBe(flagsBefore);
    fake.setMode('ok');
    fake.setNotices(DEMO_NOTICES);
  });

  it('429: waits what Retry-After says and carries on; a registry that keeps refusing ends the run after a few tries', async () => {
    const waits: number[] = [];
    fake.rateLimitNext(2, 3);
    const run = await runWatch(teamId, {
      trigger: 'member',
      maxAgeMs: 0,
      client: { sleep: async (ms) => void waits.push(ms) },
    });
    expect(run.status).toBe('done');
    expect(waits).toEqual([3000, 3000]);
    expect(run.summary!.backoffs).toBe(2);

    // Always 429: one DOI is tried 1 + 3 times, then the run stops — no storm over the other DOIs.
    fake.setMode('rate-limited', 1);
    const before = fake.requests;
    const limited = await runWatch(teamId, { trigger: 'member', maxAgeMs: 0, client: noWait });
    expect(limited.status).toBe('failed');
    expect(limited.error).toMatch(/limiting requests/);
    expect(fake.requests - before).toBe(4);
    fake.setMode('ok');
  });
});

describe('evidence watch routes', () => {
  const signedIn = async (email: string) => {
    const client = new Client(`10.9.0.${email.length}`);
    const res = await client.call(signIn.POST, { json: { email, password: 'loadbearing-demo' } });
    expect(res.status).toBe(200);
    return client;
  };

  it('an owner runs it and reads the flags; a reviewer reads; an athlete may do neither', async () => {
    const params = { teamId: String(teamId) };
    const owner = await signedIn('owner@granite-hollow.test');
    const ran = await owner.call(watchRoute.POST, {
      method: 'POST',
      params,
      path: '/api/teams/x/evidence-watch?wait=1',
    });
    expect(ran.status).toBe(200);
    expect(ran.body.run).toMatchObject({ status: 'done', teamId });

    const reviewer = await signedIn('reviewer@granite-hollow.test');
    const status = await reviewer.call(watchRoute.GET, { params });
    expect(status.status).toBe(200);
    expect(status.body.flags.map((f: { slug: string }) => f.slug).sort()).toEqual([
      'cold-plunges-after-strength',
      'weighted-pull-up-ladder',
    ]);
    // A reviewer may be scoring a new round blind: no engine numbers in the flags.
    expect(status.body.flags[0]).toMatchObject({
      dryRun: null,
      dryRunText: null,
      reason: expect.stringMatching(/was/),
    });
    const ownerView = await owner.call(watchRoute.GET, { params });
    expect(ownerView.body.flags[0].dryRun).toMatchObject({ verdict: expect.any(String) });
    expect(ownerView.body.flags[0].dryRunText).toMatch(/Without it the verdict would/);
    expect((await reviewer.call(watchRoute.POST, { method: 'POST', params })).status).toBe(403);

    const athlete = await signedIn('athlete@granite-hollow.test');
    expect((await athlete.call(watchRoute.GET, { params })).status).toBe(403);
    expect((await athlete.call(watchRoute.POST, { method: 'POST', params })).status).toBe(403);
    expect((await new Client('10.9.9.9').call(watchRoute.GET, { params })).status).toBe(401);
  });
});

describe('new evidence to consider', () => {
  it('offers a study added after publishing, with a shared tag and a title that matches a mechanism, to the verdict’s author only; never applied; dismissable', async () => {
    const pub = (await Publication.findOne({ where: { slug: 'cold-plunges-after-strength' } }))!;
    const snapshot = (await verdictPage(pub.slug, null)).snapshot;
    const mechanism = snapshot.mechanisms[0];
    const author = (await User.findOne({ where: { email: 'coach2@granite-hollow.test' } }))!;
    const appraisalsBefore = await Appraisal.count({ where: { reviewId: pub.reviewId } });
    const make = (title: string, tags: string[]) =>
      Study.create({
        teamId,
        createdById: author.id,
        csl: { type: 'article-journal', title },
        doi: null,
        title,
        fingerprint: title.toLowerCase(),
        year: 2026,
        journal: null,
        citation: `Newcomb, 2026 ${tags.length}`,
        design: null,
        population: null,
        n: null,
        intensity: null,
        durationWeeks: null,
        outcome: null,
        effect: null,
        tags,
        pdfKey: null,
      });
    const close = await make(`${mechanism.name} in trained lifters`, [snapshot.tags[0]]);
    // Same words, no shared tag: not offered.
    await make(`${mechanism.name} in rowers`, ['unrelated-tag']);
    resetSearchIndexes();

    const run = await runWatch(teamId, { trigger: 'member', client: noWait });
    expect(run.status).toBe('done');
    expect(run.summary!.suggestions).toBe(1);
    expect(await Appraisal.count({ where: { reviewId: pub.reviewId } })).toBe(appraisalsBefore);

    const offered = await suggestionsFor((await actorOf(author.id))!);
    expect(offered).toEqual([
      expect.objectContaining({
        slug: pub.slug,
        mechanism: mechanism.name,
        study: expect.objectContaining({ id: close.id }),
      }),
    ]);
    const owner = (await User.findOne({ where: { email: 'owner@granite-hollow.test' } }))!;
    expect(await suggestionsFor((await actorOf(owner.id))!)).toEqual([]);

    const params = { id: String(offered[0].id) };
    const otherCoach = new Client('10.9.1.1');
    await otherCoach.call(signIn.POST, { json: { email: 'coach@granite-hollow.test', password: 'loadbearing-demo' } });
    expect((await otherCoach.call(dismiss.POST, { method: 'POST', params })).status).toBe(403);
    const me = new Client('10.9.1.2');
    await me.call(signIn.POST, { json: { email: 'coach2@granite-hollow.test', password: 'loadbearing-demo' } });
    expect((await me.call(dismiss.POST, { method: 'POST', params })).status).toBe(200);
    expect(await suggestionsFor((await actorOf(author.id))!)).toEqual([]);

    // A later run does not offer it again.
    const again = await runWatch(teamId, { trigger: 'member', client: noWait });
    expect(again.summary!.suggestions).toBe(0);
  });
});
