import type { Sequelize } from 'sequelize';
import { DEMO_TEAM } from './demo-accounts';

/**
 * Peer-review rounds of the demo, written with the query interface like the other
 * seeders:
 * - "Weighted pull-up ladder" (by the owner): a CLOSED round of three reviewers. Their ratings
 *   of "Growth of the lats and elbow flexors" span three bands (2…4), so it was flagged, and the
 *   owner resolved it (kept, with a reason). No "do not publish" stood, so the review is approved.
 * - "Light daily pinch-block lifts" (by Tobias): an OPEN round, Ilse has submitted and Priya
 *   has a draft; due in four days.
 * All names, ratings and words are invented.
 */

const DAY = 24 * 60 * 60 * 1000;

async function idOf(sequelize: Sequelize, sql: string, replacements: unknown[]): Promise<number> {
  const [[row]] = (await sequelize.query(sql, { replacements })) as [{ id: number }[], unknown];
  if (!row) throw new Error(`Demo seed (rounds): no row for ${sql} ${JSON.stringify(replacements)}`);
  return row.id;
}

async function mechanismIds(sequelize: Sequelize, reviewId: number): Promise<number[]> {
  const [rows] = (await sequelize.query('SELECT id FROM mechanisms WHERE "reviewId" = ? ORDER BY position, id', {
    replacements: [reviewId],
  })) as [{ id: number }[], unknown];
  return rows.map((r) => r.id);
}

type Card = {
  bands: number[];
  contributions: string[];
  comments?: Record<number, string>;
  overall: string;
  signOff: string;
};

/** Bands per mechanism in the review's order (0 exceptionally unlikely … 6 virtually certain). */
export const CLOSED_ROUND_CARDS: Record<'coach' | 'coach2' | 'reviewer', Card> = {
  coach: {
    bands: [2, 5, 4, 3, 1],
    contributions: ['small', 'large', 'moderate', 'small', 'none'],
    comments: { 0: 'Six weeks at this volume is short for measurable growth in trained pullers.' },
    overall: 'Sound analysis; the neural story carries it.',
    signOff: 'approve',
  },
  coach2: {
    bands: [3, 4, 4, 3, 2],
    contributions: ['small', 'large', 'moderate', 'small', 'small'],
    overall: 'Agree with the ranking. The connective-tissue section could be shorter.',
    signOff: 'approve-with-changes',
  },
  reviewer: {
    bands: [4, 4, 5, 3, 1],
    contributions: ['moderate', 'large', 'moderate', 'small', 'none'],
    comments: { 0: 'Recreational climbers are far from their ceiling; growth is plausible here.' },
    overall: 'I would weigh muscle growth higher for this population.',
    signOff: 'approve',
  },
};

export async function up({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  const now = Date.now();
  const teamId = await idOf(sequelize, 'SELECT id FROM teams WHERE slug = ?', [DEMO_TEAM.slug]);
  const user = (email: string) => idOf(sequelize, 'SELECT id FROM users WHERE email = ?', [email]);
  const owner = await user('owner@granite-hollow.test');
  const coach = await user('coach@granite-hollow.test');
  const coach2 = await user('coach2@granite-hollow.test');
  const reviewer = await user('reviewer@granite-hollow.test');
  const at = (daysAgo: number) => new Date(now - daysAgo * DAY);
  const event = (
    actorId: number | null,
    reviewId: number,
    action: string,
    data: Record<string, unknown>,
    when: Date,
  ) => ({
    teamId,
    actorId,
    action,
    subjectType: 'review',
    subjectId: reviewId,
    data: JSON.stringify(data),
    createdAt: when,
  });

  // ---- The closed round ------------------------------------------------------------------------
  const ladder = await idOf(sequelize, 'SELECT id FROM reviews WHERE "teamId" = ? AND slug = ?', [
    teamId,
    'weighted-pull-up-ladder',
  ]);
  const ladderMechanisms = await mechanismIds(sequelize, ladder);
  const flagged = ladderMechanisms[0];
  const resolution = {
    mechanismId: flagged,
    kind: 'keep',
    reason:
      'Kept at a low prior: the six-week window and the small added load make growth a minor player even in recreational climbers; the neural mechanism already explains the effect. Noted the disagreement in the text.',
    byId: owner,
    at: at(4.2).toISOString(),
  };
  await q.bulkInsert('review_rounds', [
    {
      reviewId: ladder,
      teamId,
      openedById: owner,
      openedAt: at(10),
      dueAt: at(5),
      status: 'closed',
      closedAt: at(4),
      closedById: owner,
      outcome: 'approved',
      resolutions: JSON.stringify([resolution]),
      note: 'Please look hardest at the muscle-growth mechanism.',
      createdAt: at(10),
      updatedAt: at(4),
    },
  ]);
  const closedRound = await idOf(sequelize, 'SELECT id FROM review_rounds WHERE "reviewId" = ? AND status = ?', [
    ladder,
    'closed',
  ]);
  const people = { coach, coach2, reviewer } as const;
  for (const [key, card] of Object.entries(CLOSED_ROUND_CARDS) as [keyof typeof people, Card][]) {
    const submittedAt = at(key === 'coach' ? 8 : key === 'coach2' ? 7 : 6);
    await q.bulkInsert('round_invitations', [
      {
        roundId: closedRound,
        reviewerId: people[key],
        invitedAt: at(10),
        submittedAt,
        closedWithoutReason: null,
        remindedAt: null,
        createdAt: at(10),
        updatedAt: submittedAt,
      },
    ]);
    await q.bulkInsert('scorecards', [
      {
        roundId: closedRound,
        reviewerId: people[key],
        ratings: JSON.stringify(
          ladderMechanisms.map((mechanismId, i) => ({
            mechanismId,
            band: card.bands[i],
            contribution: card.contributions[i],
            comment: card.comments?.[i] ?? '',
          })),
        ),
        overallComment: card.overall,
        signOff: card.signOff,
        submittedAt,
        createdAt: at(9),
        updatedAt: submittedAt,
      },
    ]);
  }
  await q.bulkInsert('review_comments', [
    {
      reviewId: ladder,
      roundId: closedRound,
      mechanismId: flagged,
      authorId: reviewer,
      parentId: null,
      body: 'We are three bands apart on muscle growth. What load do the ladder’s last rungs reach for a recreational climber?',
      resolved: true,
      resolvedById: owner,
      resolvedAt: at(4.2),
      createdAt: at(5.5),
      updatedAt: at(4.2),
    },
  ]);
  const thread = await idOf(sequelize, 'SELECT id FROM review_comments WHERE "roundId" = ? AND "parentId" IS NULL', [
    closedRound,
  ]);
  await q.bulkInsert('review_comments', [
    {
      reviewId: ladder,
      roundId: closedRound,
      mechanismId: flagged,
      authorId: owner,
      parentId: thread,
      body: 'About 15 % of body weight added at the top. I keep growth as a minor mechanism and say so in the text.',
      resolved: false,
      resolvedById: null,
      resolvedAt: null,
      createdAt: at(4.5),
      updatedAt: at(4.5),
    },
  ]);
  await q.bulkUpdate('reviews', { status: 'approved' }, { id: ladder });
  await q.bulkInsert('audit_events', [
    event(owner, ladder, 'round.opened', { roundId: closedRound, reviewerIds: [coach, coach2, reviewer] }, at(10)),
    event(coach, ladder, 'round.scorecard_submitted', { roundId: closedRound, signOff: 'approve' }, at(8)),
    event(
      coach2,
      ladder,
      'round.scorecard_submitted',
      { roundId: closedRound, signOff: 'approve-with-changes' },
      at(7),
    ),
    event(reviewer, ladder, 'round.scorecard_submitted', { roundId: closedRound, signOff: 'approve' }, at(6)),
    event(
      reviewer,
      ladder,
      'round.comment_posted',
      { roundId: closedRound, mechanismId: flagged, reply: false },
      at(5.5),
    ),
    event(owner, ladder, 'round.comment_posted', { roundId: closedRound, mechanismId: flagged, reply: true }, at(4.5)),
    event(
      owner,
      ladder,
      'round.resolution_recorded',
      { roundId: closedRound, mechanismId: flagged, kind: 'keep' },
      at(4.2),
    ),
    event(owner, ladder, 'round.comment_resolved', { roundId: closedRound, resolved: true }, at(4.2)),
    event(owner, ladder, 'round.closed', { roundId: closedRound, outcome: 'approved', flagged: 1 }, at(4)),
  ]);

  // ---- The open round --------------------------------------------------------------------------
  const pinch = await idOf(sequelize, 'SELECT id FROM reviews WHERE "teamId" = ? AND slug = ?', [
    teamId,
    'light-daily-pinch-block-lifts',
  ]);
  const pinchMechanisms = await mechanismIds(sequelize, pinch);
  await q.bulkInsert('review_rounds', [
    {
      reviewId: pinch,
      teamId,
      openedById: coach,
      openedAt: at(1),
      dueAt: new Date(now + 4 * DAY),
      status: 'open',
      closedAt: null,
      closedById: null,
      outcome: null,
      resolutions: JSON.stringify([]),
      note: 'The dose check is the crux: does anything survive at 30 % of max?',
      createdAt: at(1),
      updatedAt: at(1),
    },
  ]);
  const openRound = await idOf(sequelize, 'SELECT id FROM review_rounds WHERE "reviewId" = ? AND status = ?', [
    pinch,
    'open',
  ]);
  const submitted = at(0.5);
  await q.bulkInsert('round_invitations', [
    {
      roundId: openRound,
      reviewerId: coach2,
      invitedAt: at(1),
      submittedAt: submitted,
      closedWithoutReason: null,
      remindedAt: null,
      createdAt: at(1),
      updatedAt: submitted,
    },
    {
      roundId: openRound,
      reviewerId: reviewer,
      invitedAt: at(1),
      submittedAt: null,
      closedWithoutReason: null,
      remindedAt: null,
      createdAt: at(1),
      updatedAt: at(1),
    },
  ]);
  const ilse = [1, 4, 3, 3, 1];
  const priyaDraft = [1, 4, null, null, null];
  await q.bulkInsert('scorecards', [
    {
      roundId: openRound,
      reviewerId: coach2,
      ratings: JSON.stringify(
        pinchMechanisms.map((mechanismId, i) => ({
          mechanismId,
          band: ilse[i] ?? 3,
          contribution: i === 1 ? 'moderate' : 'small',
          comment: i === 0 ? 'Far below any loading that remodels tendon.' : '',
        })),
      ),
      overallComment: 'The verdict follows from the dose check; the skill mechanism deserves more space.',
      signOff: 'approve-with-changes',
      submittedAt: submitted,
      createdAt: at(0.8),
      updatedAt: submitted,
    },
    {
      roundId: openRound,
      reviewerId: reviewer,
      ratings: JSON.stringify(
        pinchMechanisms.map((mechanismId, i) => ({
          mechanismId,
          band: priyaDraft[i] ?? null,
          contribution: null,
          comment: '',
        })),
      ),
      overallComment: '',
      signOff: null,
      submittedAt: null,
      createdAt: at(0.6),
      updatedAt: at(0.6),
    },
  ]);
  await q.bulkInsert('review_comments', [
    {
      reviewId: pinch,
      roundId: openRound,
      mechanismId: null,
      authorId: coach,
      parentId: null,
      body: 'The claim’s video shows one-arm lifts; I scored the protocol as two-arm. Say if you read it differently.',
      resolved: false,
      resolvedById: null,
      resolvedAt: null,
      createdAt: at(0.9),
      updatedAt: at(0.9),
    },
  ]);
  await q.bulkInsert('audit_events', [
    event(coach, pinch, 'round.opened', { roundId: openRound, reviewerIds: [coach2, reviewer] }, at(1)),
    event(
      coach2,
      pinch,
      'round.scorecard_submitted',
      { roundId: openRound, signOff: 'approve-with-changes' },
      submitted,
    ),
  ]);
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const teamId = await idOf(sequelize, 'SELECT id FROM teams WHERE slug = ?', [DEMO_TEAM.slug]);
  const q = sequelize.getQueryInterface();
  // Invitations, scorecards and comments go with their rounds (foreign keys cascade).
  await q.bulkDelete('review_rounds', { teamId });
}
