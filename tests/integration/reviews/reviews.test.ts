import { beforeAll, describe, expect, it } from 'vitest';
import * as one from '@/app/api/reviews/[id]/route';
import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as reviews from '@/app/api/reviews/route';
import { Appraisal, Mechanism, Review } from '@/models';
import { Client } from '../../helpers/app';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, protocol, snapshot, type TeamFixture } from './helpers';

useTestApp();
let t: TeamFixture;

beforeAll(async () => {
  t = await makeTeam('rv');
});

const create = (client: Client, extra: Record<string, unknown> = {}) =>
  client.call(reviews.POST, { json: newReview(t.teamId, extra) });
const id = (n: number) => ({ id: String(n) });

describe('POST /api/reviews — capture a claim', () => {
  it('creates a draft with a slug, lower-cased tags, the protocol on the one intensity scale, and no verdict yet', async () => {
    const res = await create(t.coach);
    expect(res.status).toBe(201);
    const r = res.body.review;
    expect(r).toMatchObject({
      teamId: t.teamId,
      title: 'Light daily hangs make fingers stronger in eight weeks.',
      slug: 'light-daily-hangs-make-fingers-stronger-in-eight-weeks',
      status: 'draft',
      version: 1,
      tags: ['fingers', 'hangboard'],
      authorId: t.userIds.coach,
      authorName: 'Cato Brill',
      claimUrl: 'https://video.example.test/hangs',
      population: { status: 'recreational', injured: false },
      body: { type: 'doc', content: [] },
      recommendations: { whoMightTry: '', whoShouldNot: '', whatInstead: '' },
      // No appraisal yet: evidence weight 0 < 1.
      verdict: 'insufficient',
      verdictLabel: 'Not enough evidence',
    });
    // 70 kg + 10 kg added over a 70 + 30 kg maximum.
    expect(r.protocol.intensity).toBeCloseTo(0.8, 12);
    expect(r.protocol).toMatchObject({ ...protocol });
  });

  it('keeps slugs unique per team, and another team may reuse one', async () => {
    const again = await create(t.coach);
    expect(again.body.review.slug).toBe('light-daily-hangs-make-fingers-stronger-in-eight-weeks-2');
    const elsewhere = await t.outsider.call(reviews.POST, { json: newReview(t.otherTeamId) });
    expect(elsewhere.status).toBe(201);
    expect(elsewhere.body.review.slug).toBe('light-daily-hangs-make-fingers-stronger-in-eight-weeks');
  });

  it('gives two reviews created at the same moment with one title two slugs', async () => {
    const [a, b] = await Promise.all([
      create(t.coach, { title: 'Simultaneous claim' }),
      create(t.owner, { title: 'Simultaneous claim' }),
    ]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect([a.body.review.slug, b.body.review.slug].sort()).toEqual(['simultaneous-claim', 'simultaneous-claim-2']);
  });

  it('takes a given title and a null claim URL', async () => {
    const res = await create(t.owner, { title: 'Daily hangs', claimUrl: null, tags: undefined });
    expect(res.body.review).toMatchObject({ title: 'Daily hangs', slug: 'daily-hangs', claimUrl: null, tags: [] });
  });

  it('refuses reviewers and athletes (403), hides the team from outsiders (404), and wants a session (401) — changing nothing', async () => {
    const before = await snapshot();
    expect((await create(t.reviewer)).status).toBe(403);
    expect((await create(t.athlete)).status).toBe(403);
    expect((await t.outsider.call(reviews.POST, { json: newReview(t.teamId) })).status).toBe(404);
    expect((await t.anonymous.call(reviews.POST, { json: newReview(t.teamId) })).status).toBe(401);
    expect(await snapshot()).toEqual(before);
  });
});

describe('bad input on the review routes is a 400 in the error shape of docs/api/README.md and changes nothing', () => {
  let reviewId: number;
  beforeAll(async () => {
    reviewId = (await create(t.coach)).body.review.id;
  });

  const cases = (): [string, (client: Client) => Promise<{ status: number; body: any }>, string?][] => [
    ['POST: malformed JSON', (c) => c.call(reviews.POST, { rawBody: '{"teamId": 1,' })],
    ['POST: empty body', (c) => c.call(reviews.POST, { method: 'POST', rawBody: '' })],
    ['POST: missing fields', (c) => c.call(reviews.POST, { json: { teamId: t.teamId } }), 'claim'],
    [
      'POST: wrong types',
      (c) => c.call(reviews.POST, { json: { ...newReview(t.teamId), claim: 42, protocol: 'heavy', tags: 'x' } }),
      'claim',
    ],
    ['POST: an array', (c) => c.call(reviews.POST, { json: [1, 2] })],
    [
      'POST: a load above the reference maximum',
      (c) => c.call(reviews.POST, { json: newReview(t.teamId, { protocol: { ...protocol, loadValue: 45 } }) }),
      'protocol.loadValue',
    ],
    [
      'POST: a body-weight load without the reference athlete',
      (c) =>
        c.call(reviews.POST, { json: newReview(t.teamId, { protocol: { ...protocol, referenceBodyweightKg: null } }) }),
      'protocol.referenceBodyweightKg',
    ],
    [
      'POST: a non-web claim link',
      (c) => c.call(reviews.POST, { json: newReview(t.teamId, { claimUrl: 'ftp://x.test/y' }) }),
      'claimUrl',
    ],
    [
      'PATCH: malformed JSON',
      (c) => c.call(one.PATCH, { method: 'PATCH', params: id(reviewId), rawBody: '{"version":' }),
    ],
    [
      'PATCH: no version',
      (c) => c.call(one.PATCH, { method: 'PATCH', params: id(reviewId), json: { claim: 'A new claim sentence.' } }),
      'version',
    ],
    [
      'PATCH: only the version',
      (c) => c.call(one.PATCH, { method: 'PATCH', params: id(reviewId), json: { version: 1 } }),
      '',
    ],
    [
      'PATCH: wrong types',
      (c) =>
        c.call(one.PATCH, { method: 'PATCH', params: id(reviewId), json: { version: '1', status: 'done', tags: [1] } }),
    ],
    [
      'PATCH: a body that is not a Tiptap doc',
      (c) =>
        c.call(one.PATCH, { method: 'PATCH', params: id(reviewId), json: { version: 1, body: { type: 'paragraph' } } }),
      'body.type',
    ],
    [
      'PATCH: a mechanism block without an id',
      (c) =>
        c.call(one.PATCH, {
          method: 'PATCH',
          params: id(reviewId),
          json: {
            version: 1,
            body: { type: 'doc', content: [{ type: 'mechanismBlock', attrs: { mechanismId: 'x' } }] },
          },
        }),
      'body.content.0.attrs.mechanismId',
    ],
    [
      'PATCH: a document nested 200 deep',
      (c) => {
        let node: Record<string, unknown> = { type: 'text', text: 'deep' };
        for (let i = 0; i < 200; i++) node = { type: 'blockquote', content: [node] };
        return c.call(one.PATCH, {
          method: 'PATCH',
          params: id(reviewId),
          json: { version: 1, body: { type: 'doc', content: [node] } },
        });
      },
      'body',
    ],
    ['GET: a non-numeric id', (c) => c.call(one.GET, { params: { id: 'abc' } }), 'id'],
    [
      'GET list: an unknown status filter',
      (c) => c.call(reviews.GET, { path: '/api/reviews?status=finished' }),
      'status',
    ],
  ];

  for (const [label, run, path] of cases()) {
    it(label, async () => {
      const before = await snapshot();
      const res = await run(t.coach);
      expect(res.status).toBe(400);
      expect(res.body).toEqual({ error: expect.any(String), issues: expect.any(Array) });
      for (const issue of res.body.issues)
        expect(issue).toEqual({ path: expect.any(String), message: expect.any(String) });
      if (path !== undefined) expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path);
      expect(await snapshot()).toEqual(before);
    });
  }
});

describe('GET /api/reviews — the dashboard list', () => {
  it('lists the team’s reviews for staff, newest change first, with author and cached verdict', async () => {
    const res = await t.reviewer.call(reviews.GET, { path: `/api/reviews?teamId=${t.teamId}` });
    expect(res.status).toBe(200);
    expect(res.body.reviews.length).toBeGreaterThanOrEqual(3);
    expect(res.body.reviews.every((r: { teamId: number }) => r.teamId === t.teamId)).toBe(true);
    const times = res.body.reviews.map((r: { updatedAt: string }) => r.updatedAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(res.body.reviews[0]).toEqual(
      expect.objectContaining({
        authorName: expect.any(String),
        verdict: 'insufficient',
        verdictLabel: 'Not enough evidence',
      }),
    );
    expect(res.body.reviews[0]).not.toHaveProperty('body');
  });

  it('filters by status, tag and verdict', async () => {
    const created = (await create(t.coach, { tags: ['rare-tag'] })).body.review;
    await t.coach.call(one.PATCH, {
      method: 'PATCH',
      params: id(created.id),
      json: { version: 1, status: 'archived' },
    });
    const byStatus = await t.coach.call(reviews.GET, { path: '/api/reviews?status=archived' });
    expect(byStatus.body.reviews.map((r: { id: number }) => r.id)).toEqual([created.id]);
    const byTag = await t.coach.call(reviews.GET, { path: '/api/reviews?tag=RARE-TAG' });
    expect(byTag.body.reviews.map((r: { id: number }) => r.id)).toEqual([created.id]);
    const byVerdict = await t.coach.call(reviews.GET, { path: '/api/reviews?verdict=supported' });
    expect(byVerdict.body.reviews).toEqual([]);
  });

  it('without a team filter, lists every team where the caller is staff, and nothing of other teams', async () => {
    const res = await t.outsider.call(reviews.GET);
    expect(res.status).toBe(200);
    expect(res.body.reviews.every((r: { teamId: number }) => r.teamId === t.otherTeamId)).toBe(true);
    expect(res.body.reviews.length).toBe(1);
  });

  it('is 403 for an athlete of the team, 404 for an outsider naming the team, 401 signed out', async () => {
    expect((await t.athlete.call(reviews.GET, { path: `/api/reviews?teamId=${t.teamId}` })).status).toBe(403);
    // Without a team, an athlete simply has no work in progress to see.
    expect(
      (await t.athlete.call(reviews.GET)).body.reviews.filter((r: { teamId: number }) => r.teamId === t.teamId),
    ).toEqual([]);
    expect((await t.outsider.call(reviews.GET, { path: `/api/reviews?teamId=${t.teamId}` })).status).toBe(404);
    expect((await t.anonymous.call(reviews.GET)).status).toBe(401);
  });
});

describe('GET /api/reviews/:id — the workbench', () => {
  it('returns the review with its mechanisms, appraisals, studies, cited studies and poolable targets', async () => {
    const created = (await create(t.coach)).body.review;
    await t.coach.call(mechanisms.POST, { params: id(created.id), json: { name: 'Neural drive' } });
    const res = await t.reviewer.call(one.GET, { params: id(created.id) });
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual([
      'appraisals',
      'citedStudies',
      'mechanisms',
      'poolable',
      'review',
      'studies',
    ]);
    expect(res.body.review.id).toBe(created.id);
    expect(res.body.mechanisms).toEqual([
      expect.objectContaining({ name: 'Neural drive', prior: 0.5, magnitude: 'moderate', stated: false, position: 0 }),
    ]);
  });

  it('is 403 for an athlete, 404 for an outsider and for a review that does not exist', async () => {
    const created = (await create(t.coach)).body.review;
    expect((await t.athlete.call(one.GET, { params: id(created.id) })).status).toBe(403);
    const hidden = await t.outsider.call(one.GET, { params: id(created.id) });
    expect(hidden.status).toBe(404);
    const missing = await t.coach.call(one.GET, { params: id(999999) });
    expect(missing.status).toBe(404);
    // The same answer either way: another team's review is never confirmed to exist.
    expect(hidden.body).toEqual(missing.body);
  });
});

describe('PATCH /api/reviews/:id — saving with the version', () => {
  it('saves any subset of fields, bumps the version, and recomputes intensity from a new protocol', async () => {
    const created = (await create(t.coach)).body.review;
    const doc = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'First thoughts.' }] }] };
    const res = await t.coach.call(one.PATCH, {
      method: 'PATCH',
      params: id(created.id),
      json: {
        version: 1,
        body: doc,
        claim: 'Light daily hangs make fingers much stronger.',
        protocol: { ...protocol, loadValue: 80, loadUnit: 'percent-max' },
        recommendations: { whoMightTry: 'Healthy adults.', whoShouldNot: 'Anyone with finger pain.', whatInstead: '' },
      },
    });
    expect(res.status).toBe(200);
    expect(res.body.review).toMatchObject({
      version: 2,
      body: doc,
      claim: 'Light daily hangs make fingers much stronger.',
      title: created.title,
      slug: created.slug,
    });
    expect(res.body.review.protocol.intensity).toBeCloseTo(0.8, 12);
    expect(res.body.review.recommendations.whoShouldNot).toBe('Anyone with finger pain.');
  });

  it('answers a stale version with 409, the current review, and no change', async () => {
    const created = (await create(t.coach)).body.review;
    const first = await t.coach.call(one.PATCH, {
      method: 'PATCH',
      params: id(created.id),
      json: { version: 1, title: 'Saved first' },
    });
    expect(first.body.review.version).toBe(2);
    const before = await snapshot();
    const stale = await t.owner.call(one.PATCH, {
      method: 'PATCH',
      params: id(created.id),
      json: { version: 1, title: 'Saved second' },
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/someone else/i);
    expect(stale.body.current).toMatchObject({ id: created.id, version: 2, title: 'Saved first' });
    expect(await snapshot()).toEqual(before);
  });

  it('lets exactly one of two saves of the same version win', async () => {
    const created = (await create(t.coach)).body.review;
    const [a, b] = await Promise.all([
      t.coach.call(one.PATCH, { method: 'PATCH', params: id(created.id), json: { version: 1, title: 'From tab A' } }),
      t.owner.call(one.PATCH, { method: 'PATCH', params: id(created.id), json: { version: 1, title: 'From tab B' } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const stored = await Review.findByPk(created.id);
    expect(stored!.version).toBe(2);
    expect(stored!.title).toBe(a.status === 200 ? 'From tab A' : 'From tab B');
  });

  it('lets the author and the owner save; not another coach (403), a reviewer (403) or an outsider (404)', async () => {
    const created = (await create(t.coach)).body.review;
    const before = await snapshot();
    for (const [client, status] of [
      [t.coach2, 403],
      [t.reviewer, 403],
      [t.athlete, 403],
      [t.outsider, 404],
      [t.anonymous, 401],
    ] as const) {
      expect(
        (
          await client.call(one.PATCH, {
            method: 'PATCH',
            params: id(created.id),
            json: { version: 1, title: 'Not mine' },
          })
        ).status,
      ).toBe(status);
    }
    expect(await snapshot()).toEqual(before);
    expect(
      (
        await t.owner.call(one.PATCH, {
          method: 'PATCH',
          params: id(created.id),
          json: { version: 1, title: 'Owner edit' },
        })
      ).status,
    ).toBe(200);
  });

  it('never moves a review to "in review", "approved" or "published" by hand: rounds and publishing do that', async () => {
    const created = (await create(t.coach)).body.review;
    for (const [client, status] of [
      [t.coach, 'in-review'],
      [t.coach, 'approved'],
      [t.owner, 'published'],
    ] as const) {
      const res = await client.call(one.PATCH, {
        method: 'PATCH',
        params: id(created.id),
        json: { version: 1, status },
      });
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toBe('status');
    }
    const after = await t.coach.call(one.GET, { params: id(created.id) });
    expect(after.body.review).toMatchObject({ status: 'draft', version: 1 });
  });
});

describe('DELETE /api/reviews/:id', () => {
  it('is refused to another coach, a reviewer and an outsider; the author deletes it with its mechanisms', async () => {
    const created = (await create(t.coach)).body.review;
    await t.coach.call(mechanisms.POST, { params: id(created.id), json: { name: 'Expectation' } });
    expect((await t.coach2.call(one.DELETE, { method: 'DELETE', params: id(created.id) })).status).toBe(403);
    expect((await t.reviewer.call(one.DELETE, { method: 'DELETE', params: id(created.id) })).status).toBe(403);
    expect((await t.outsider.call(one.DELETE, { method: 'DELETE', params: id(created.id) })).status).toBe(404);
    const res = await t.coach.call(one.DELETE, { method: 'DELETE', params: id(created.id) });
    expect(res.status).toBe(200);
    expect(res.body.review.id).toBe(created.id);
    expect((await t.coach.call(one.GET, { params: id(created.id) })).status).toBe(404);
    expect(await Mechanism.count({ where: { reviewId: created.id } })).toBe(0);
    expect(await Appraisal.count({ where: { reviewId: created.id } })).toBe(0);
  });
});
