import { DEMO_PASSWORD } from '../../../db/seeders/demo-accounts';
import type { Actor } from '../../../lib/auth/policy';
import type { Role } from '../../../models/roles';
import { newReview } from '../../../tests/helpers/review-input';
import type { ReadOnlyDb } from './database';
import { Caller } from './http';
import type { Production } from '../../lib/production';

/**
 * Two teams on the running server: the demo team of the seed and a second team built through the
 * API as its people would (sign-up, invitation by mail, a review with a mechanism, a study, an
 * appraisal, an open round with a comment, a pending invitation). Every text of the second team
 * carries OTHER_MARK, so finding it in an answer to anyone outside that team is a leak.
 */
export const OTHER_MARK = 'Quartzfield';

export interface ProbeActor {
  label: string;
  caller: Caller;
  /** Null when signed out. */
  actor: Actor | null;
}

export interface Team {
  name: string;
  teamId: number;
  /** Path parameter name → the real row ids (or slugs, tokens) to put there. */
  params: Record<string, (string | number)[]>;
  /** The review of `params.id`: its author, the round's invited and submitted reviewers. */
  reviewAuthorId: number;
  invited: Set<number>;
  submitted: Set<number>;
  coachesMayPublish: boolean;
  /** Words that must never reach anyone outside the team. */
  secrets: string[];
  /** Words that must never reach the team's athletes (titles of reviews not published). */
  staffOnly: string[];
  members: ProbeActor[];
}

export interface World {
  demo: Team;
  other: Team;
  signedOut: ProbeActor;
}

async function actorOf(db: ReadOnlyDb, userId: number): Promise<Actor> {
  const rows = await db.all<{ teamId: number; role: Role }>(
    'SELECT "teamId", role FROM memberships WHERE "userId" = ?',
    [userId],
  );
  return { userId, roles: new Map(rows.map((r) => [r.teamId, r.role])) };
}

async function signedIn(app: Production, db: ReadOnlyDb, label: string, email: string, password: string) {
  const caller = new Caller(app.url, label);
  await caller.signIn(email, password);
  const user = await db.first<{ id: number }>('SELECT id FROM users WHERE email = ?', [email]);
  return { label, caller, actor: await actorOf(db, user!.id) };
}

async function invitationToken(app: Production, owner: Caller, teamId: number, email: string, role: Role) {
  await owner.ok('POST', `/api/teams/${teamId}/members`, { email, role });
  const mail = await app.smtp.waitFor((m) => m.to.some((to) => to.includes(email)));
  const match = mail.text.match(/\/invitations\/([A-Za-z0-9_-]+)/);
  if (!match) throw new Error(`no invitation link in the mail to ${email}`);
  return match[1];
}

/** The second team, made through the API. */
async function buildOtherTeam(app: Production) {
  const password = 'quartzfield-probe-password';
  const owner = new Caller(app.url, 'other owner');
  const ownerEmail = `owner@${OTHER_MARK.toLowerCase()}.test`;
  // Sign-up answers the same for every address and mails a link; the link creates the account.
  await owner.ok('POST', '/api/auth/sign-up', {
    name: `${OTHER_MARK} Owner`,
    email: ownerEmail,
    password,
    teamName: `${OTHER_MARK} Strength Clinic`,
  });
  const mail = await app.smtp.waitFor((m) => m.to.some((to) => to.includes(ownerEmail)));
  const confirmToken = mail.text.match(/\/sign-up\/confirm\?token=([A-Za-z0-9_%-]+)/)?.[1];
  if (!confirmToken) throw new Error(`no sign-up link in the mail to ${ownerEmail}`);
  const { team } = await owner.ok<{ team: { id: number } }>('POST', '/api/auth/sign-up/confirm', {
    token: decodeURIComponent(confirmToken),
  });
  const teamId: number = team.id;
  const reviewerEmail = `reviewer@${OTHER_MARK.toLowerCase()}.test`;
  const token = await invitationToken(app, owner, teamId, reviewerEmail, 'reviewer');
  const reviewer = new Caller(app.url, 'other reviewer');
  await reviewer.ok('POST', `/api/invitations/${token}/accept`, { name: `${OTHER_MARK} Reviewer`, password });
  const { review } = await owner.ok<{ review: { id: number } }>(
    'POST',
    '/api/reviews',
    newReview(teamId, { title: `${OTHER_MARK} finger claim` }),
  );
  for (const [name, prior] of [
    [`${OTHER_MARK} neural drive`, 0.6],
    [`${OTHER_MARK} tendon stiffening`, 0.3],
  ] as const) {
    await owner.ok('POST', `/api/reviews/${review.id}/mechanisms`, { name, prior });
  }
  const { studies } = await owner.ok<{ studies: { id: number }[] }>('POST', '/api/studies', {
    teamId,
    title: `${OTHER_MARK} trial of daily hangs`,
    year: 2024,
    design: 'randomized',
    population: 'recreational',
    intensity: 0.8,
  });
  await owner.ok('POST', `/api/reviews/${review.id}/appraisals`, {
    studyId: studies[0].id,
    mechanismId: null,
    direction: 'supports',
  });
  return {
    teamId,
    owner,
    reviewerEmail,
    ownerEmail: `owner@${OTHER_MARK.toLowerCase()}.test`,
    password,
    reviewId: review.id,
  };
}

async function openRoundWithComment(owner: Caller, reviewId: number, reviewerId: number) {
  const dueAt = new Date(Date.now() + 3 * 24 * 3600 * 1000).toISOString();
  await owner.ok('POST', `/api/reviews/${reviewId}/rounds`, { reviewerIds: [reviewerId], dueAt });
  await owner.ok('POST', `/api/reviews/${reviewId}/comments`, { body: `${OTHER_MARK} comment on the whole review` });
}

/** Real ids of one team's rows, read from the database; `reviewId` is the review under an open round. */
async function teamRows(db: ReadOnlyDb, teamId: number, reviewId: number, token: string) {
  const author = await db.first<{ authorId: number }>('SELECT "authorId" FROM reviews WHERE id = ?', [reviewId]);
  const one = async (sql: string, params: unknown[]) => (await db.first<{ id: number }>(sql, params))?.id ?? 999_999;
  const round = await one(`SELECT id FROM review_rounds WHERE "reviewId" = ? AND status = 'open'`, [reviewId]);
  const slugs = await db.all<{ slug: string }>('SELECT slug FROM publications WHERE "teamId" = ?', [teamId]);
  const appraisal = await db.first<{ id: number; studyId: number }>(
    'SELECT id, "studyId" FROM appraisals WHERE "reviewId" = ? ORDER BY id',
    [reviewId],
  );
  return {
    teamId: [teamId],
    id: [reviewId],
    roundId: [round],
    mechanismId: [await one('SELECT id FROM mechanisms WHERE "reviewId" = ? ORDER BY id', [reviewId])],
    appraisalId: [appraisal?.id ?? 999_999],
    studyId: [appraisal?.studyId ?? 999_999],
    commentId: [await one('SELECT id FROM review_comments WHERE "roundId" = ? ORDER BY id', [round])],
    membershipId: [
      await one(`SELECT id FROM memberships WHERE "teamId" = ? AND role <> 'owner' ORDER BY id`, [teamId]),
    ],
    suggestionId: [await one('SELECT id FROM evidence_suggestions WHERE "teamId" = ? ORDER BY id', [teamId])],
    slug: slugs.length ? slugs.map((s) => s.slug) : ['no-verdict'],
    token: [token],
    number: [1],
    // Not a path parameter: someone a round could invite (a coach or reviewer, not the author).
    reviewerId: [
      await one(
        `SELECT "userId" AS id FROM memberships WHERE "teamId" = ? AND role IN ('coach', 'reviewer') AND "userId" <> ? ORDER BY role DESC, id`,
        [teamId, author!.authorId],
      ),
    ],
  };
}

async function reviewFacts(db: ReadOnlyDb, reviewId: number, roundId: number) {
  const review = await db.first<{ authorId: number }>('SELECT "authorId" FROM reviews WHERE id = ?', [reviewId]);
  const invitations = await db.all<{ reviewerId: number; submittedAt: string | null }>(
    'SELECT "reviewerId", "submittedAt" FROM round_invitations WHERE "roundId" = ?',
    [roundId],
  );
  return {
    reviewAuthorId: review!.authorId,
    invited: new Set(invitations.map((i) => i.reviewerId)),
    submitted: new Set(invitations.filter((i) => i.submittedAt).map((i) => i.reviewerId)),
  };
}

/** Titles of the team's reviews with no live publication (athletes must not read them). */
async function unpublishedTitles(db: ReadOnlyDb, teamId: number, publicOnly: boolean) {
  const rows = await db.all<{ title: string }>(
    `SELECT title FROM reviews r WHERE r."teamId" = ? AND NOT EXISTS (
       SELECT 1 FROM publications p WHERE p."reviewId" = r.id AND p."withdrawnAt" IS NULL ${publicOnly ? `AND p.visibility = 'public'` : ''})`,
    [teamId],
  );
  return rows.map((r) => r.title);
}

export async function buildWorld(app: Production, db: ReadOnlyDb): Promise<World> {
  const demoTeam = await db.first<{ id: number; coachesMayPublish: number }>(
    `SELECT id, "coachesMayPublish" FROM teams WHERE slug = 'granite-hollow'`,
  );
  const demoId = demoTeam!.id;
  const demoMember = (role: string, email: string) => signedIn(app, db, `demo ${role}`, email, DEMO_PASSWORD);
  const demoOwner = await demoMember('owner', 'owner@granite-hollow.test');
  const demoToken = await invitationToken(
    app,
    demoOwner.caller,
    demoId,
    'probe-invitee@granite-hollow.test',
    'athlete',
  );

  const built = await buildOtherTeam(app);
  const otherReviewer = await signedIn(app, db, 'other reviewer', built.reviewerEmail, built.password);
  await openRoundWithComment(built.owner, built.reviewId, otherReviewer.actor.userId);
  const otherOwner = await signedIn(app, db, 'other owner', built.ownerEmail, built.password);
  const otherToken = await invitationToken(
    app,
    otherOwner.caller,
    built.teamId,
    `athlete@${OTHER_MARK.toLowerCase()}.test`,
    'athlete',
  );

  const openDemo = await db.first<{ reviewId: number }>(
    `SELECT "reviewId" FROM review_rounds WHERE "teamId" = ? AND status = 'open' ORDER BY id`,
    [demoId],
  );
  const demoParams = await teamRows(db, demoId, openDemo!.reviewId, demoToken);
  const otherParams = await teamRows(db, built.teamId, built.reviewId, otherToken);
  const comments = await db.all<{ body: string }>('SELECT body FROM review_comments WHERE "reviewId" = ?', [
    openDemo!.reviewId,
  ]);

  const demo: Team = {
    name: 'demo team',
    teamId: demoId,
    params: demoParams,
    ...(await reviewFacts(db, openDemo!.reviewId, Number(demoParams.roundId[0]))),
    coachesMayPublish: Boolean(demoTeam!.coachesMayPublish),
    secrets: [
      '@granite-hollow.test',
      ...(await unpublishedTitles(db, demoId, true)),
      ...comments.map((c) => c.body.slice(0, 60)),
    ],
    staffOnly: await unpublishedTitles(db, demoId, false),
    members: [
      demoOwner,
      await demoMember('coach', 'coach@granite-hollow.test'),
      await demoMember('reviewer', 'reviewer@granite-hollow.test'),
      await demoMember('athlete', 'athlete@granite-hollow.test'),
    ],
  };
  const other: Team = {
    name: 'other team',
    teamId: built.teamId,
    params: otherParams,
    ...(await reviewFacts(db, built.reviewId, Number(otherParams.roundId[0]))),
    coachesMayPublish: false,
    secrets: [OTHER_MARK],
    staffOnly: [],
    members: [otherOwner, otherReviewer],
  };
  return { demo, other, signedOut: { label: 'signed out', caller: new Caller(app.url, 'signed out'), actor: null } };
}
