import { beforeAll, describe, expect, it } from 'vitest';
import * as agreementRoute from '@/app/api/reviews/[id]/rounds/[roundId]/agreement/route';
import * as closeRoute from '@/app/api/reviews/[id]/rounds/[roundId]/close/route';
import * as resolutionsRoute from '@/app/api/reviews/[id]/rounds/[roundId]/resolutions/route';
import * as oneRound from '@/app/api/reviews/[id]/rounds/[roundId]/route';
import * as scorecardRoute from '@/app/api/reviews/[id]/rounds/[roundId]/scorecard/route';
import * as roundsRoute from '@/app/api/reviews/[id]/rounds/route';
import * as commentsRoute from '@/app/api/reviews/[id]/comments/route';
import * as commentRoute from '@/app/api/reviews/[id]/comments/[commentId]/route';
import * as reviewRoute from '@/app/api/reviews/[id]/route';
import { assertReviewEditable, blindRoundFor } from '@/lib/rounds/freeze';
import { remindDueRounds } from '@/lib/rounds/reminders';
import { ReviewRound, RoundInvitation } from '@/models';
import { useTestApp, type Client } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { inDays, reviewWithMechanisms, roundSnapshot } from './helpers';

const app = useTestApp();
let t: TeamFixture;
let reviewId: number;
let mechanismIds: number[];
let roundId: number;

const p = (extra: Record<string, string> = {}) => ({ id: String(reviewId), ...extra });
const rp = () => p({ roundId: String(roundId) });

/** A full scorecard: bands per mechanism in order. */
const card = (bands: number[], signOff = 'approve', submit = false) => ({
  ratings: mechanismIds.map((mechanismId, i) => ({
    mechanismId,
    band: bands[i],
    contribution: 'moderate',
    comment: `note ${i}`,
  })),
  overallComment: 'Overall thoughts.',
  signOff,
  submit,
});

/** The raw text of a response body, to assert what never crosses the wire. */
const raw = (body: unknown) => JSON.stringify(body);

beforeAll(async () => {
  t = await makeTeam('rd');
  ({ reviewId, mechanismIds } = await reviewWithMechanisms(t, 'Rounds test review'));
});

describe('opening a round', () => {
  it('refuses bad input with 400 in the error shape of docs/api/README.md and changes nothing', async () => {
    const before = await roundSnapshot();
    const mailsBefore = app.smtp().messages.length;
    const cases: unknown[] = [
      {},
      { reviewerIds: [], dueAt: inDays(3) },
      { reviewerIds: [t.userIds.reviewer], dueAt: 'next tuesday' },
      { reviewerIds: [t.userIds.reviewer], dueAt: inDays(-1) },
      { reviewerIds: [t.userIds.reviewer, t.userIds.reviewer], dueAt: inDays(3) },
      { reviewerIds: ['x'], dueAt: inDays(3) },
    ];
    for (const json of cases) {
      const res = await t.coach.call(roundsRoute.POST, { params: p(), json });
      expect(res.status, JSON.stringify(json)).toBe(400);
      expect(typeof res.body.error).toBe('string');
      expect(Array.isArray(res.body.issues)).toBe(true);
      expect(res.body.issues.length).toBeGreaterThan(0);
    }
    // The author, an athlete and someone outside the team are not eligible reviewers.
    for (const who of [t.userIds.coach, t.userIds.athlete, t.userIds.outsider, t.userIds.owner]) {
      const res = await t.coach.call(roundsRoute.POST, { params: p(), json: { reviewerIds: [who], dueAt: inDays(3) } });
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toBe('reviewerIds.0');
    }
    const malformed = await t.coach.call(roundsRoute.POST, { params: p(), rawBody: '{"reviewerIds": [' });
    expect(malformed.status).toBe(400);
    expect(await roundSnapshot()).toEqual(before);
    expect(app.smtp().messages.length).toBe(mailsBefore);
  });

  it('is for the author and the owner: another coach 403, the reviewer 403, an athlete 403, another team 404, signed out 401', async () => {
    const json = { reviewerIds: [t.userIds.reviewer], dueAt: inDays(3) };
    expect((await t.coach2.call(roundsRoute.POST, { params: p(), json })).status).toBe(403);
    expect((await t.reviewer.call(roundsRoute.POST, { params: p(), json })).status).toBe(403);
    expect((await t.athlete.call(roundsRoute.POST, { params: p(), json })).status).toBe(403);
    expect((await t.outsider.call(roundsRoute.POST, { params: p(), json })).status).toBe(404);
    expect((await t.anonymous.call(roundsRoute.POST, { params: p(), json })).status).toBe(401);
  });

  it('opens a round, mails each reviewer a link to their scorecard, puts the review in review and freezes it', async () => {
    const res = await t.coach.call(roundsRoute.POST, {
      params: p(),
      json: {
        reviewerIds: [t.userIds.reviewer, t.userIds.coach2],
        dueAt: inDays(3),
        note: 'Look at tendon stiffening.',
      },
    });
    expect(res.status).toBe(201);
    expect(res.body.mailFailures).toEqual([]);
    roundId = res.body.round.id;
    expect(res.body.round).toMatchObject({ status: 'open', you: { manages: true, invited: false } });
    expect(res.body.round.invitations).toHaveLength(2);

    for (const name of ['oswin.sorrel', 'dagny.fell']) {
      const mail = await app
        .smtp()
        .waitFor((m) => m.to.some((to) => to.startsWith(name)) && /Peer review requested/.test(m.subject));
      expect(mail.text).toContain(`http://app.test/reviews/${reviewId}/round/${roundId}`);
      expect(mail.html).toContain(`/reviews/${reviewId}/round/${roundId}`);
      expect(mail.text).toContain('Look at tendon stiffening.');
    }
    const review = await t.coach.call(reviewRoute.GET, { params: p() });
    expect(review.body.review.status).toBe('in-review');

    await expect(assertReviewEditable(reviewId)).rejects.toMatchObject({ code: 'conflict' });
    const second = await t.coach.call(roundsRoute.POST, {
      params: p(),
      json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(3) },
    });
    expect(second.status).toBe(409);
  });
});

describe('who sees a round', () => {
  it('an invited reviewer reads their scorecard; an uninvited coach and reviewer get 404; an athlete 404; another team 404', async () => {
    expect((await t.reviewer.call(scorecardRoute.GET, { params: rp() })).status).toBe(200);
    for (const client of [t.owner, t.coach, t.athlete, t.outsider] as Client[]) {
      expect((await client.call(scorecardRoute.GET, { params: rp() })).status).toBe(404);
    }
    expect((await t.anonymous.call(scorecardRoute.GET, { params: rp() })).status).toBe(401);
    // The round itself: author, owner and invitees only.
    expect((await t.owner.call(oneRound.GET, { params: rp() })).status).toBe(200);
    expect((await t.athlete.call(oneRound.GET, { params: rp() })).status).toBe(404);
    expect((await t.outsider.call(oneRound.GET, { params: rp() })).status).toBe(404);
    // A round id of another review answers like a missing one.
    const other = await reviewWithMechanisms(t, 'Another review');
    expect(
      (await t.reviewer.call(scorecardRoute.GET, { params: { id: String(other.reviewId), roundId: String(roundId) } }))
        .status,
    ).toBe(404);
  });

  it('a coach neither invited nor the author gets 404 for the round, its scorecard, agreement and comments', async () => {
    const other = await reviewWithMechanisms(t, 'Only Oswin reviews this');
    const opened = await t.coach.call(roundsRoute.POST, {
      params: { id: String(other.reviewId) },
      json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(4) },
    });
    expect(opened.status).toBe(201);
    const params = { id: String(other.reviewId), roundId: String(opened.body.round.id) };
    for (const handler of [oneRound.GET, scorecardRoute.GET, agreementRoute.GET]) {
      const res = await t.coach2.call(handler, { params });
      expect(res.status).toBe(404);
      expect(raw(res.body)).not.toMatch(/Oswin|ratings|alpha/);
    }
    expect((await t.coach2.call(commentsRoute.GET, { params: { id: String(other.reviewId) } })).status).toBe(404);
    expect((await t.coach2.call(scorecardRoute.PUT, { params, json: { ratings: [] } })).status).toBe(404);
    // The review's round list shows an uninvited coach nothing of it.
    const list = await t.coach2.call(roundsRoute.GET, { params: { id: String(other.reviewId) } });
    expect(list.status).toBe(200);
    expect(list.body.rounds).toEqual([]);
    expect((await t.athlete.call(roundsRoute.GET, { params: { id: String(other.reviewId) } })).status).toBe(403);
  });
});

describe('blindness at the HTTP level', () => {
  it('before submitting, a reviewer gets no engine output, no other scorecard, no agreement and no other reviewer’s comments', async () => {
    // coach2 saves a draft and submits with ratings we can look for.
    const submitted = await t.coach2.call(scorecardRoute.PUT, {
      params: rp(),
      json: card([5, 1, 3], 'do-not-publish', true),
    });
    expect(submitted.status).toBe(200);
    await t.coach2.call(commentsRoute.POST, {
      params: p(),
      json: { body: 'SECRET-COACH2-COMMENT: I rated tendons low.', mechanismId: mechanismIds[1] },
    });
    await t.coach.call(commentsRoute.POST, { params: p(), json: { body: 'AUTHOR-NOTE for everyone.' } });

    const view = await t.reviewer.call(scorecardRoute.GET, { params: rp() });
    expect(view.status).toBe(200);
    const text = raw(view.body);
    for (const leak of [
      'probability',
      'verdict',
      'certainty',
      'applicability',
      'logOdds',
      'engineBand',
      'do-not-publish',
      'note 0',
      'Overall thoughts',
    ]) {
      expect(text).not.toContain(leak);
    }
    // Only their own invitation, and their own (empty) scorecard.
    expect(view.body.round.invitations).toHaveLength(1);
    expect(view.body.round.invitations[0].reviewerId).toBe(t.userIds.reviewer);
    expect(view.body.round.resolutions).toEqual([]);
    expect(view.body.scorecard.ratings.every((r: { band: unknown }) => r.band === null)).toBe(true);
    expect(view.body.mechanisms.map((m: { id: number }) => m.id)).toEqual(mechanismIds);

    const round = await t.reviewer.call(oneRound.GET, { params: rp() });
    expect(raw(round.body)).not.toContain('Dagny');
    expect(round.body.round.invitations).toHaveLength(1);

    const agreement = await t.reviewer.call(agreementRoute.GET, { params: rp() });
    expect(agreement.status).toBe(403);
    expect(raw(agreement.body)).not.toMatch(/alpha|ratings|engine/);

    const list = await t.reviewer.call(roundsRoute.GET, { params: p() });
    expect(list.status).toBe(200);
    expect(raw(list.body)).not.toMatch(/candidates|audit|submittedAt":"20/);

    const comments = await t.reviewer.call(commentsRoute.GET, { params: p() });
    expect(comments.status).toBe(200);
    expect(raw(comments.body)).not.toContain('SECRET-COACH2-COMMENT');
    expect(raw(comments.body)).toContain('AUTHOR-NOTE');

    // The freeze module's hook for the verdict route reports the reviewer as blind.
    expect(await blindRoundFor(t.userIds.reviewer, reviewId)).toBe(roundId);
    expect(await blindRoundFor(t.userIds.coach2, reviewId)).toBeNull();
  });

  it('after submitting, the reviewer sees the agreement with the others’ ratings and the engine band', async () => {
    const saved = await t.reviewer.call(scorecardRoute.PUT, {
      params: rp(),
      json: { ...card([5, 4, 3]), signOff: null },
    });
    expect(saved.status).toBe(200);
    expect(saved.body.scorecard.submittedAt).toBeNull();
    const draft = await t.reviewer.call(scorecardRoute.GET, { params: rp() });
    expect(draft.body.scorecard.ratings.map((r: { band: number }) => r.band)).toEqual([5, 4, 3]);

    const submit = await t.reviewer.call(scorecardRoute.PUT, { params: rp(), json: card([5, 4, 3], 'approve', true) });
    expect(submit.status).toBe(200);
    const mail = await app
      .smtp()
      .waitFor((m) => m.to.some((to) => to.startsWith('cato.brill')) && /Oswin Sorrel submitted/.test(m.subject));
    expect(mail.text).toContain(`http://app.test/reviews/${reviewId}/rounds`);
    expect(mail.text).toContain('2 of 2');

    const agreement = await t.reviewer.call(agreementRoute.GET, { params: rp() });
    expect(agreement.status).toBe(200);
    expect(agreement.body.raters).toBe(2);
    expect(agreement.body.kappa).not.toBeNull();
    // Tendon stiffening: 1 vs 4 → span 3, flagged and listed first.
    expect(agreement.body.mechanisms[0]).toMatchObject({ mechanismId: mechanismIds[1], span: 3, flagged: true });
    expect(agreement.body.flaggedCount).toBe(1);
    expect(agreement.body.mechanisms[0].engineBand).toBeGreaterThanOrEqual(0);

    const again = await t.reviewer.call(scorecardRoute.PUT, { params: rp(), json: card([0, 0, 0], 'approve', true) });
    expect(again.status).toBe(409);
  });
});

describe('scorecard validation', () => {
  it('400s in the error shape of docs/api/README.md that change nothing', async () => {
    const fresh = await reviewWithMechanisms(t, 'Validation review');
    const opened = await t.coach.call(roundsRoute.POST, {
      params: { id: String(fresh.reviewId) },
      json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(2) },
    });
    const params = { id: String(fresh.reviewId), roundId: String(opened.body.round.id) };
    const before = await roundSnapshot();
    const bad: unknown[] = [
      { ratings: [{ mechanismId: fresh.mechanismIds[0], band: 7 }] },
      { ratings: [{ mechanismId: fresh.mechanismIds[0], band: 2.5 }] },
      { ratings: [{ mechanismId: fresh.mechanismIds[0], contribution: 'huge' }] },
      { ratings: [{ mechanismId: mechanismIds[0], band: 3 }] },
      { ratings: [], signOff: 'maybe' },
      // Submitting an incomplete scorecard.
      {
        ratings: [{ mechanismId: fresh.mechanismIds[0], band: 3, contribution: 'small' }],
        signOff: 'approve',
        submit: true,
      },
      { ratings: 'all good' },
    ];
    for (const json of bad) {
      const res = await t.reviewer.call(scorecardRoute.PUT, { params, json });
      expect(res.status, JSON.stringify(json)).toBe(400);
      expect(typeof res.body.error).toBe('string');
      expect(res.body.issues.length).toBeGreaterThan(0);
    }
    expect(await roundSnapshot()).toEqual(before);
  });
});

describe('settling and closing', () => {
  it('refuses to close while a flag is unresolved; resolutions are for the author or owner and need a reason', async () => {
    const close = await t.coach.call(closeRoute.POST, { params: rp(), json: {} });
    expect(close.status).toBe(409);
    expect(close.body.error).toMatch(/Tendon stiffening/);

    expect(
      (
        await t.reviewer.call(resolutionsRoute.POST, {
          params: rp(),
          json: { mechanismId: mechanismIds[1], kind: 'keep', reason: 'Because I say so.' },
        })
      ).status,
    ).toBe(403);
    const noReason = await t.coach.call(resolutionsRoute.POST, {
      params: rp(),
      json: { mechanismId: mechanismIds[1], kind: 'keep', reason: '' },
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.issues[0].path).toBe('reason');
    const notFlagged = await t.coach.call(resolutionsRoute.POST, {
      params: rp(),
      json: { mechanismId: mechanismIds[0], kind: 'keep', reason: 'Nothing to settle here.' },
    });
    expect(notFlagged.status).toBe(400);
    const ok = await t.coach.call(resolutionsRoute.POST, {
      params: rp(),
      json: {
        mechanismId: mechanismIds[1],
        kind: 'change-prior',
        reason: 'Lower the prior to 0.2 after closing: the dose is too light.',
      },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.round.resolutions).toHaveLength(1);
  });

  it('threads: replies mail the thread starter; only the author or owner resolves', async () => {
    const list = await t.coach.call(commentsRoute.GET, { params: p() });
    const root = list.body.comments.find((c: { body: string }) => c.body.startsWith('SECRET-COACH2'));
    const reply = await t.coach.call(commentsRoute.POST, {
      params: p(),
      json: { body: 'Good point; I will lower the prior.', parentId: root.id },
    });
    expect(reply.status).toBe(201);
    expect(reply.body.comment).toMatchObject({ parentId: root.id, mechanismId: mechanismIds[1] });
    const mail = await app
      .smtp()
      .waitFor((m) => m.to.some((to) => to.startsWith('dagny.fell')) && /replied/.test(m.subject));
    expect(mail.text).toContain(`/reviews/${reviewId}/round/${roundId}`);
    expect(
      (await t.coach2.call(commentRoute.PATCH, { params: p({ commentId: String(root.id) }), json: { resolved: true } }))
        .status,
    ).toBe(403);
    const resolved = await t.coach.call(commentRoute.PATCH, {
      params: p({ commentId: String(root.id) }),
      json: { resolved: true },
    });
    expect(resolved.status).toBe(200);
    expect(resolved.body.comment.resolved).toBe(true);
    expect((await t.athlete.call(commentsRoute.GET, { params: p() })).status).toBe(404);
    expect((await t.outsider.call(commentsRoute.POST, { params: p(), json: { body: 'hi' } })).status).toBe(404);
    expect((await t.coach.call(commentsRoute.POST, { params: p(), json: { body: '' } })).status).toBe(400);
  });

  it('a standing "do not publish" closes the round back to draft; withdrawing it first gives "approved"', async () => {
    // coach2 withdraws the "do not publish" after the discussion.
    const changed = await t.coach2.call(scorecardRoute.PATCH, {
      params: rp(),
      json: { signOff: 'approve-with-changes' },
    });
    expect(changed.status).toBe(200);
    const closed = await t.coach.call(closeRoute.POST, { params: rp(), json: {} });
    expect(closed.status).toBe(200);
    expect(closed.body.outcome).toBe('approved');
    expect((await t.coach.call(reviewRoute.GET, { params: p() })).body.review.status).toBe('approved');
    await assertReviewEditable(reviewId);
    const mail = await app
      .smtp()
      .waitFor((m) => m.to.some((to) => to.startsWith('oswin.sorrel')) && /Peer review closed/.test(m.subject));
    expect(mail.text).toContain('approved');
    // Closed is closed.
    expect((await t.reviewer.call(commentsRoute.POST, { params: p(), json: { body: 'late' } })).status).toBe(409);
    expect((await t.coach.call(closeRoute.POST, { params: rp(), json: {} })).status).toBe(409);
  });

  it('needs every reviewer submitted or closed without, with a reason; a "do not publish" left standing returns the review to draft', async () => {
    const fresh = await reviewWithMechanisms(t, 'Close-without review');
    const opened = await t.owner.call(roundsRoute.POST, {
      params: { id: String(fresh.reviewId) },
      json: { reviewerIds: [t.userIds.reviewer, t.userIds.coach2], dueAt: inDays(5) },
    });
    expect(opened.status).toBe(201);
    const params = { id: String(fresh.reviewId), roundId: String(opened.body.round.id) };
    const full = {
      ratings: fresh.mechanismIds.map((mechanismId) => ({ mechanismId, band: 3, contribution: 'small' })),
      signOff: 'do-not-publish',
      submit: true,
    };
    expect((await t.reviewer.call(scorecardRoute.PUT, { params, json: full })).status).toBe(200);

    const waiting = await t.coach.call(closeRoute.POST, { params, json: {} });
    expect(waiting.status).toBe(409);
    expect(waiting.body.error).toMatch(/Dagny Fell/);
    const noReason = await t.coach.call(closeRoute.POST, {
      params,
      json: { closedWithout: [{ reviewerId: t.userIds.coach2, reason: '' }] },
    });
    expect(noReason.status).toBe(400);
    const wrongPerson = await t.coach.call(closeRoute.POST, {
      params,
      json: { closedWithout: [{ reviewerId: t.userIds.reviewer, reason: 'Not needed.' }] },
    });
    expect(wrongPerson.status).toBe(400);

    const closed = await t.coach.call(closeRoute.POST, {
      params,
      json: { closedWithout: [{ reviewerId: t.userIds.coach2, reason: 'On leave until after the due date.' }] },
    });
    expect(closed.status).toBe(200);
    expect(closed.body.outcome).toBe('draft');
    expect((await t.coach.call(reviewRoute.GET, { params: { id: String(fresh.reviewId) } })).body.review.status).toBe(
      'draft',
    );
    const invitation = await RoundInvitation.findOne({
      where: { roundId: opened.body.round.id, reviewerId: t.userIds.coach2 },
    });
    expect(invitation?.closedWithoutReason).toBe('On leave until after the due date.');
  });

  it('the owner sees the audit log of round events; the author (a coach) does not', async () => {
    const owner = await t.owner.call(roundsRoute.GET, { params: p() });
    const actions = owner.body.audit.map((e: { action: string }) => e.action);
    for (const action of [
      'round.opened',
      'round.scorecard_submitted',
      'round.resolution_recorded',
      'round.comment_posted',
      'round.comment_resolved',
      'round.signoff_changed',
      'round.closed',
    ]) {
      expect(actions).toContain(action);
    }
    const author = await t.coach.call(roundsRoute.GET, { params: p() });
    expect(author.body.audit).toBeUndefined();
    expect(author.body.candidates.map((c: { userId: number }) => c.userId).sort()).toEqual(
      [t.userIds.coach2, t.userIds.reviewer].sort(),
    );
  });
});

describe('the 24-hour reminder', () => {
  it('mails unsubmitted reviewers of a round due within a day, once', async () => {
    const fresh = await reviewWithMechanisms(t, 'Reminder review');
    const opened = await t.coach.call(roundsRoute.POST, {
      params: { id: String(fresh.reviewId) },
      json: { reviewerIds: [t.userIds.reviewer], dueAt: inDays(3) },
    });
    const id = opened.body.round.id;
    // Not yet within 24 hours: nothing.
    expect((await remindDueRounds()).reminded.filter((e) => e.startsWith('oswin.sorrel'))).toEqual([]);
    await ReviewRound.update({ dueAt: new Date(Date.now() + 20 * 60 * 60 * 1000) }, { where: { id } });
    const first = await remindDueRounds();
    expect(first.reminded.filter((e) => e.startsWith('oswin.sorrel'))).toHaveLength(1);
    const mail = await app
      .smtp()
      .waitFor((m) => m.to.some((to) => to.startsWith('oswin.sorrel')) && /Due within a day/.test(m.subject));
    expect(mail.text).toContain(`/reviews/${fresh.reviewId}/round/${id}`);
    const second = await remindDueRounds();
    expect(second.reminded).toEqual([]);
  });
});
