import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { Op } from 'sequelize';
import { decide, type Actor } from '@/lib/auth/policy';
import { notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { env } from '@/lib/env';
import { newVerdictMail } from '@/lib/mail/publish-templates';
import { sendMail } from '@/lib/mail/send';
import { Follow, Membership, Publication, Team, User } from '@/models';

/**
 * Following a team's new verdicts by e-mail. Anyone signed in may follow a team they belong to,
 * or another team that has published something public (what they would be mailed about);
 * otherwise the team answers as if it did not exist.
 *
 * Unsubscribe links carry `<followId>.<HMAC-SHA256(secret, followId:salt)>`: nothing secret is
 * stored, a link works without signing in (as mail clients expect), and unfollowing deletes the
 * salt with the row, which voids every link sent before.
 */

function secret(): string {
  const value = env().SESSION_SECRET;
  if (!value || value.length < 32) throw new Error('SESSION_SECRET must be set to sign unsubscribe links.');
  return value;
}

function signature(followId: number, salt: string): string {
  return createHmac('sha256', secret()).update(`unsubscribe:${followId}:${salt}`).digest('base64url');
}

export function unsubscribeToken(follow: Pick<Follow, 'id' | 'tokenSalt'>): string {
  return `${follow.id}.${signature(follow.id, follow.tokenSalt)}`;
}

export function unsubscribeUrl(follow: Pick<Follow, 'id' | 'tokenSalt'>): string {
  return `${env().APP_URL}/unsubscribe/${unsubscribeToken(follow)}`;
}

/** The follow a token names, or null for a malformed, forged or already used token. */
export async function followForToken(token: string): Promise<(Follow & { teamName: string }) | null> {
  const match = /^(\d{1,12})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!match) return null;
  const follow = await Follow.findByPk(Number(match[1]));
  if (!follow) return null;
  const expected = Buffer.from(signature(follow.id, follow.tokenSalt));
  const given = Buffer.from(match[2]);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  const team = await Team.findByPk(follow.teamId, { attributes: ['name'] });
  return Object.assign(follow, { teamName: team?.name ?? 'the team' });
}

/** Deletes the follow the token names. Returns the team's name, or null when the link is not (or no longer) valid. */
export async function unsubscribe(token: string): Promise<{ teamName: string } | null> {
  const follow = await followForToken(token);
  if (!follow) return null;
  await follow.destroy();
  await recordEvent({
    teamId: follow.teamId,
    actorId: follow.userId,
    action: 'follow.unsubscribed',
    subjectType: 'team',
    subjectId: follow.teamId,
  });
  return { teamName: follow.teamName };
}

async function mayFollow(actor: Actor, teamId: number): Promise<boolean> {
  if (decide(actor, 'team.read', { teamId }) === 'allow') return true;
  const publicOnes = await Publication.count({ where: { teamId, visibility: 'public', withdrawnAt: null } });
  return publicOnes > 0;
}

export interface FollowStateDTO {
  teamId: number;
  following: boolean;
}

export async function follow(actor: Actor, teamId: number): Promise<FollowStateDTO> {
  if (!(await Team.count({ where: { id: teamId } })) || !(await mayFollow(actor, teamId))) throw notFound('That team');
  const [, created] = await Follow.findOrCreate({
    where: { teamId, userId: actor.userId },
    defaults: { teamId, userId: actor.userId, tokenSalt: randomBytes(16).toString('hex') },
  });
  if (created)
    await recordEvent({
      teamId,
      actorId: actor.userId,
      action: 'follow.created',
      subjectType: 'team',
      subjectId: teamId,
    });
  return { teamId, following: true };
}

export async function unfollow(actor: Actor, teamId: number): Promise<FollowStateDTO> {
  await Follow.destroy({ where: { teamId, userId: actor.userId } });
  return { teamId, following: false };
}

export async function isFollowing(userId: number, teamId: number): Promise<boolean> {
  return (await Follow.count({ where: { teamId, userId } })) > 0;
}

/**
 * Mails every follower who may read the new version: all followers for a public verdict, only
 * current members for a team-only one (someone who left the team keeps no access through mail).
 * A refused mail is logged and skipped: the version is already published.
 */
export async function notifyFollowers(input: {
  teamId: number;
  visibility: 'team' | 'public';
  slug: string;
  title: string;
  claim: string;
  verdictLabel: string;
  summary: string;
  version: number;
  changeNote: string | null;
}): Promise<number> {
  const follows = await Follow.findAll({ where: { teamId: input.teamId } });
  if (!follows.length) return 0;
  let allowed = follows;
  if (input.visibility === 'team') {
    const members = await Membership.findAll({
      where: { teamId: input.teamId, userId: { [Op.in]: follows.map((f) => f.userId) } },
      attributes: ['userId'],
    });
    const ids = new Set(members.map((m) => m.userId));
    allowed = follows.filter((f) => ids.has(f.userId));
  }
  const users = await User.findAll({
    where: { id: { [Op.in]: allowed.map((f) => f.userId) } },
    attributes: ['id', 'email'],
  });
  const emailOf = new Map(users.map((u) => [u.id, u.email]));
  const team = await Team.findByPk(input.teamId, { attributes: ['name'] });
  const url = `${env().APP_URL}/v/${input.slug}`;
  let sent = 0;
  for (const f of allowed) {
    const to = emailOf.get(f.userId);
    if (!to) continue;
    try {
      await sendMail(
        newVerdictMail({ ...input, to, teamName: team?.name ?? 'Your team', url, unsubscribeUrl: unsubscribeUrl(f) }),
      );
      sent++;
    } catch (error) {
      console.error('Could not send a verdict mail', error);
    }
  }
  return sent;
}
