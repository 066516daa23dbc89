import { alpha as oracleAlpha } from 'krippendorff';
import { beforeAll, describe, expect, it } from 'vitest';
import * as signIn from '@/app/api/auth/sign-in/route';
import * as agreementRoute from '@/app/api/reviews/[id]/rounds/[roundId]/agreement/route';
import * as scorecardRoute from '@/app/api/reviews/[id]/rounds/[roundId]/scorecard/route';
import * as roundsRoute from '@/app/api/reviews/[id]/rounds/route';
import * as verdictRoute from '@/app/api/reviews/[id]/verdict/route';
import { seed } from '@/db/migrate';
import { CLOSED_ROUND_CARDS } from '@/db/seeders/20261201-0003-demo-rounds';
import { DEMO_PASSWORD } from '@/db/seeders/demo-accounts';
import { db } from '@/lib/db';
import { likelihoodBand } from '@/lib/scoring/likelihood';
import { Client, useTestApp } from '../../helpers/app';

useTestApp();

const owner = new Client('10.91.0.1');
const priya = new Client('10.91.0.2');
let ids: { ladder: number; pinch: number; closedRound: number; openRound: number };

async function one<T>(sql: string, replacements: unknown[]): Promise<T> {
  const [[row]] = (await db().query(sql, { replacements })) as [T[], unknown];
  return row;
}

beforeAll(async () => {
  await seed(db());
  for (const [client, email] of [
    [owner, 'owner@granite-hollow.test'],
    [priya, 'reviewer@granite-hollow.test'],
  ] as const) {
    expect((await client.call(signIn.POST, { json: { email, password: DEMO_PASSWORD } })).status).toBe(200);
  }
  const ladder = (await one<{ id: number }>('SELECT id FROM reviews WHERE slug = ?', ['weighted-pull-up-ladder'])).id;
  const pinch = (await one<{ id: number }>('SELECT id FROM reviews WHERE slug = ?', ['light-daily-pinch-block-lifts']))
    .id;
  const closedRound = (await one<{ id: number }>('SELECT id FROM review_rounds WHERE "reviewId" = ?', [ladder])).id;
  const openRound = (await one<{ id: number }>('SELECT id FROM review_rounds WHERE "reviewId" = ?', [pinch])).id;
  ids = { ladder, pinch, closedRound, openRound };
});

/** Rows reviewers (in submission order: Tobias, Ilse, Priya), columns mechanisms in the review's order. */
const MATRIX = [CLOSED_ROUND_CARDS.coach.bands, CLOSED_ROUND_CARDS.coach2.bands, CLOSED_ROUND_CARDS.reviewer.bands];

/**
 * Ordinal α computed independently of lib/stats: by enumerating every ordered pair of ratings
 * from different raters within a unit (weight 1/(m_u − 1)) for D_o and every ordered pair of
 * pairable values for D_e, with Krippendorff's ordinal distance
 * δ²(c,k) = (Σ_{g=c..k} n_g − (n_c + n_k)/2)² (Krippendorff 2011, "Computing Krippendorff's
 * Alpha-Reliability", section C).
 */
function ordinalAlphaByPairs(matrix: number[][]): number {
  const units = matrix[0].map((_, u) => matrix.map((row) => row[u]));
  const values = units.flat();
  const n = values.length;
  const count = (v: number) => values.filter((x) => x === v).length;
  const delta2 = (c: number, k: number) => {
    if (c === k) return 0;
    const [lo, hi] = c < k ? [c, k] : [k, c];
    let sum = 0;
    for (let g = lo; g <= hi; g += 1) sum += count(g);
    return (sum - (count(lo) + count(hi)) / 2) ** 2;
  };
  let observed = 0;
  for (const unit of units) {
    for (let i = 0; i < unit.length; i += 1)
      for (let j = 0; j < unit.length; j += 1) if (i !== j) observed += delta2(unit[i], unit[j]) / (unit.length - 1);
  }
  let expected = 0;
  for (let i = 0; i < n; i += 1) for (let j = 0; j < n; j += 1) if (i !== j) expected += delta2(values[i], values[j]);
  return 1 - observed / n / (expected / (n * (n - 1)));
}

describe('the seeded closed round', () => {
  it('reports α against an outside oracle: the `krippendorff` npm package 0.1.0 (Max Schaefer, MIT) for nominal and interval', async () => {
    const res = await owner.call(agreementRoute.GET, {
      params: { id: String(ids.ladder), roundId: String(ids.closedRound) },
    });
    expect(res.status).toBe(200);
    const a = res.body;
    expect(a.status).toBe('closed');
    expect(a.raters).toBe(3);
    // Oracle: krippendorff@0.1.0 `alpha(matrix, metric)`, identity metric = nominal, squared difference = interval.
    expect(a.alpha.nominal).toBeCloseTo(oracleAlpha(MATRIX), 10);
    expect(a.alpha.interval).toBeCloseTo(
      oracleAlpha(MATRIX, (x: number, y: number) => (x - y) ** 2),
      10,
    );
    // Ordinal: the independent pair enumeration above.
    expect(a.alpha.ordinal).toBeCloseTo(ordinalAlphaByPairs(MATRIX), 10);
    expect(a.alpha.interpretation).toBe(
      a.alpha.ordinal >= 0.8 ? 'reliable' : a.alpha.ordinal >= 0.667 ? 'tentative' : 'unreliable',
    );
    // Three reviewers: no Cohen's kappa.
    expect(a.kappa).toBeNull();
  });

  it('flags exactly the mechanism whose ratings span two bands or more, first, with its resolution', async () => {
    const res = await owner.call(agreementRoute.GET, {
      params: { id: String(ids.ladder), roundId: String(ids.closedRound) },
    });
    const [first, ...rest] = res.body.mechanisms;
    expect(first).toMatchObject({
      name: 'Growth of the lats and elbow flexors',
      flagged: true,
      min: 2,
      max: 4,
      span: 2,
    });
    expect(first.ratings.map((r: { band: number }) => r.band)).toEqual([2, 3, 4]);
    expect(first.resolution).toMatchObject({ kind: 'keep', byName: 'Maren Holt' });
    expect(rest.every((m: { flagged: boolean; span: number }) => !m.flagged && m.span < 2)).toBe(true);
    expect(res.body.flaggedCount).toBe(1);
    expect(res.body.unresolvedFlags).toBe(0);
    expect(res.body.blockers).toEqual([]);
    // The engine's own band, as the verdict route reports the mechanism's probability.
    const verdict = await owner.call(verdictRoute.GET, { params: { id: String(ids.ladder) } });
    for (const row of res.body.mechanisms) {
      const scored = verdict.body.mechanisms.find((m: { id: number }) => m.id === row.mechanismId);
      expect(row.engineBand).toBe(likelihoodBand(scored.probability));
    }
  });

  it('shows the owner the round’s audit events and leaves the review approved', async () => {
    const res = await owner.call(roundsRoute.GET, { params: { id: String(ids.ladder) } });
    expect(res.body.rounds[0]).toMatchObject({ status: 'closed', outcome: 'approved' });
    expect(res.body.audit.map((e: { action: string }) => e.action)).toContain('round.closed');
    expect((await one<{ status: string }>('SELECT status FROM reviews WHERE id = ?', [ids.ladder])).status).toBe(
      'approved',
    );
  });
});

describe('the seeded open round', () => {
  it('keeps Priya blind: her draft comes back, Ilse’s submitted scores and the agreement do not', async () => {
    const params = { id: String(ids.pinch), roundId: String(ids.openRound) };
    const view = await priya.call(scorecardRoute.GET, { params });
    expect(view.status).toBe(200);
    expect(view.body.scorecard.submittedAt).toBeNull();
    expect(view.body.scorecard.ratings.slice(0, 2).map((r: { band: number }) => r.band)).toEqual([1, 4]);
    const text = JSON.stringify(view.body);
    expect(text).not.toMatch(/Far below any loading|skill mechanism deserves|approve-with-changes|probability|verdict/);
    expect((await priya.call(agreementRoute.GET, { params })).status).toBe(403);
  });
});

describe('hooks for the workbench (lib/rounds/freeze.ts)', () => {
  it('freezes the review with the open round, blanks its verdict for the blind reviewer only, and leaves the closed one editable', async () => {
    const { assertReviewEditable, assertSeesScores, withBlindVerdictsHidden } = await import('@/lib/rounds/freeze');
    await expect(assertReviewEditable(ids.pinch)).rejects.toMatchObject({ code: 'conflict' });
    await expect(assertReviewEditable(ids.ladder)).resolves.toBeUndefined();
    const priyaId = (
      await one<{ id: number }>('SELECT id FROM users WHERE email = ?', ['reviewer@granite-hollow.test'])
    ).id;
    const ilseId = (await one<{ id: number }>('SELECT id FROM users WHERE email = ?', ['coach2@granite-hollow.test']))
      .id;
    await expect(assertSeesScores(priyaId, ids.pinch)).rejects.toMatchObject({ code: 'forbidden' });
    await expect(assertSeesScores(ilseId, ids.pinch)).resolves.toBeUndefined();
    const rows = [
      { id: ids.pinch, verdict: 'not-supported', verdictLabel: 'Does not hold up' },
      { id: ids.ladder, verdict: 'other-reasons', verdictLabel: 'x' },
    ];
    expect((await withBlindVerdictsHidden(priyaId, rows)).map((r) => r.verdict)).toEqual([null, 'other-reasons']);
    expect((await withBlindVerdictsHidden(ilseId, rows)).map((r) => r.verdict)).toEqual([
      'not-supported',
      'other-reasons',
    ]);
  });
});
