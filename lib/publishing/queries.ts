import { Op } from 'sequelize';
import { decide, type Actor } from '@/lib/auth/policy';
import { AppError, notFound } from '@/lib/api/errors';
import { verdictDoc, verdictIndex, searchVerdictIndex, type VerdictDoc } from '@/lib/search/verdict-index';
import { Publication, PublishedVersion, Team, User } from '@/models';
import { flagsOfVersion } from '@/lib/watch/flags';
import type { VerdictListItemDTO, VerdictPageDTO, Visibility, VersionSnapshot, VersionSummaryDTO } from './types';

/**
 * Reading published verdicts. Who may read one is decided here from two facts: a public
 * publication is anyone's; a team-only one is readable by members of its team (the policy's
 * `verdict.read`). Anyone else — signed out included — is told it does not exist (404), so a
 * team-only verdict's existence is never confirmed to outsiders.
 */

export function mayRead(actor: Actor | null, pub: { teamId: number; visibility: string }): boolean {
  if (pub.visibility === 'public') return true;
  return decide(actor, 'verdict.read', { teamId: pub.teamId }) === 'allow';
}

/** A publication with its versions and publishers' names, as one immutable value. */
interface LoadedPublication {
  publication: Pick<
    Publication,
    'id' | 'reviewId' | 'teamId' | 'slug' | 'visibility' | 'latestNumber' | 'withdrawnAt' | 'withdrawnReason'
  >;
  versions: Pick<PublishedVersion, 'number' | 'createdAt' | 'changeNote' | 'publishedById' | 'snapshot'>[];
  publisherNames: Map<number, string>;
  /** Flags the evidence watch raised on the latest version (lib/watch/flags.ts). */
  evidenceChanged: Awaited<ReturnType<typeof flagsOfVersion>>;
}

/**
 * Read from the database every time: several processes serve the page, and a withdrawal on one
 * must show on all of them (docs/deployment.md); the shared cache in front keeps a public page
 * at most a second.
 */
async function loadPublication(slug: string): Promise<LoadedPublication | null> {
  const publication = await Publication.findOne({ where: { slug } });
  if (!publication) return null;
  const versions = await PublishedVersion.findAll({
    where: { publicationId: publication.id },
    order: [['number', 'ASC']],
  });
  const ids = [...new Set(versions.map((v) => v.publishedById).filter((id): id is number => id !== null))];
  const users = ids.length ? await User.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'name'] }) : [];
  return {
    publication: publication.get({ plain: true }),
    versions: versions.map((v) => v.get({ plain: true })),
    publisherNames: new Map(users.map((u) => [u.id, u.name])),
    evidenceChanged: await flagsOfVersion(publication.id, publication.latestNumber),
  };
}

function summary(v: LoadedPublication['versions'][number], names: Map<number, string>): VersionSummaryDTO {
  return {
    number: v.number,
    publishedAt: new Date(v.createdAt).toISOString(),
    publishedBy: (v.publishedById !== null && names.get(v.publishedById)) || 'Former member',
    changeNote: v.changeNote,
  };
}

/** The verdict page's data for this reader, latest version unless `version` asks for an earlier one. */
export async function verdictPage(slug: string, actor: Actor | null, version?: number): Promise<VerdictPageDTO> {
  const loaded = await loadPublication(slug);
  if (!loaded || !mayRead(actor, loaded.publication)) throw notFound('That verdict');
  const { publication: p, versions, publisherNames } = loaded;
  const shown = version === undefined ? versions[versions.length - 1] : versions.find((v) => v.number === version);
  if (!shown) throw notFound('That version');
  return {
    slug: p.slug,
    reviewId: p.reviewId,
    teamId: p.teamId,
    visibility: p.visibility as Visibility,
    withdrawn: p.withdrawnAt ? { at: new Date(p.withdrawnAt).toISOString(), reason: p.withdrawnReason ?? '' } : null,
    version: summary(shown, publisherNames),
    latestNumber: p.latestNumber,
    versions: versions.map((v) => summary(v, publisherNames)).reverse(),
    snapshot: shown.snapshot as unknown as VersionSnapshot,
    evidenceChanged: shown.number === p.latestNumber ? (loaded.evidenceChanged ?? []) : [],
  };
}

const SLUG = /^[a-z0-9-]{1,100}$/;

/**
 * The verdict page's data for this reader, or null when it does not exist or is not theirs to
 * read (the page then answers 404). Takes the actor, so both routers' pages can call it.
 */
export async function findVerdictPage(
  slug: string,
  actor: Actor | null,
  version?: number,
): Promise<VerdictPageDTO | null> {
  if (!SLUG.test(slug)) return null;
  if (version !== undefined && !(Number.isInteger(version) && version > 0)) return null;
  try {
    return await verdictPage(slug, actor, version);
  } catch (error) {
    if (error instanceof AppError && error.status === 404) return null;
    throw error;
  }
}

/** The list line and search document of every publication (latest version). */
async function allItems(
  where: Record<string, unknown> = {},
): Promise<{ item: VerdictListItemDTO; snapshot: VersionSnapshot }[]> {
  const pubs = await Publication.findAll({
    where,
    order: [
      ['lastPublishedAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  if (!pubs.length) return [];
  const latest = await PublishedVersion.findAll({
    where: { [Op.or]: pubs.map((p) => ({ publicationId: p.id, number: p.latestNumber })) },
  });
  const byPub = new Map(latest.map((v) => [v.publicationId, v]));
  const teams = await Team.findAll({
    where: { id: { [Op.in]: [...new Set(pubs.map((p) => p.teamId))] } },
    attributes: ['id', 'name'],
  });
  const teamName = new Map(teams.map((t) => [t.id, t.name]));
  return pubs
    .filter((p) => byPub.has(p.id))
    .map((p) => {
      const snapshot = byPub.get(p.id)!.snapshot as unknown as VersionSnapshot;
      return { item: listItem(p, snapshot, teamName.get(p.teamId) ?? snapshot.team.name), snapshot };
    });
}

export function listItem(p: Publication, snapshot: VersionSnapshot, teamName: string): VerdictListItemDTO {
  return {
    slug: p.slug,
    teamId: p.teamId,
    teamName,
    title: snapshot.title,
    claim: snapshot.claim,
    verdict: snapshot.verdict.key,
    verdictLabel: snapshot.verdict.label,
    visibility: p.visibility as Visibility,
    version: p.latestNumber,
    publishedAt: p.lastPublishedAt.toISOString(),
    withdrawn: p.withdrawnAt !== null,
  };
}

export async function loadVerdictDocs(): Promise<VerdictDoc[]> {
  return (await allItems()).map(({ item, snapshot }) => verdictDoc(item, snapshot));
}

/**
 * GET /api/verdicts and the athlete's home: the verdicts this reader may see, newest first; with
 * `q`, best match first from the fuzzy index. Withdrawn verdicts stay listed for the team (with
 * their notice) but leave public lists.
 */
export async function listVerdicts(
  actor: Actor | null,
  opts: { q?: string; teamId?: number; limit?: number } = {},
): Promise<VerdictListItemDTO[]> {
  const limit = opts.limit ?? 50;
  const visible = (item: VerdictListItemDTO) => {
    if (opts.teamId !== undefined && item.teamId !== opts.teamId) return false;
    const member = decide(actor, 'verdict.read', { teamId: item.teamId }) === 'allow';
    if (member) return true;
    return item.visibility === 'public' && !item.withdrawn;
  };
  if (opts.q) {
    const store = await verdictIndex(loadVerdictDocs);
    return searchVerdictIndex(store, opts.q, visible, limit);
  }
  const where = opts.teamId !== undefined ? { teamId: opts.teamId } : {};
  return (await allItems(where))
    .map((x) => x.item)
    .filter(visible)
    .slice(0, limit);
}

/** /feed.xml: a team's public, not withdrawn verdicts (or every team's without a slug). */
export async function publicFeed(teamSlug?: string): Promise<{
  team: { name: string; slug: string } | null;
  entries: { item: VerdictListItemDTO; snapshot: VersionSnapshot }[];
} | null> {
  let team: Team | null = null;
  if (teamSlug) {
    team = await Team.findOne({ where: { slug: teamSlug }, attributes: ['id', 'name', 'slug'] });
    if (!team) return null;
  }
  const entries = await allItems({ visibility: 'public', withdrawnAt: null, ...(team ? { teamId: team.id } : {}) });
  return { team: team ? { name: team.name, slug: team.slug } : null, entries: entries.slice(0, 50) };
}

/** The publication of a review, for the workbench's publish panel (staff only; the route checked). */
export async function publicationOfReview(reviewId: number) {
  const p = await Publication.findOne({ where: { reviewId } });
  if (!p) return null;
  return {
    slug: p.slug,
    visibility: p.visibility as Visibility,
    latestNumber: p.latestNumber,
    lastPublishedAt: p.lastPublishedAt.toISOString(),
    withdrawn: p.withdrawnAt ? { at: p.withdrawnAt.toISOString(), reason: p.withdrawnReason ?? '' } : null,
  };
}
