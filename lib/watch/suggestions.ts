import { Op } from 'sequelize';
import { Publication, PublishedVersion, Review, Study } from '@/models';
import { EvidenceSuggestion } from '@/models/evidence-suggestion';
import type { VersionSnapshot } from '@/lib/publishing/types';
import { searchTeams } from '@/lib/search/index-store';
import { notFound } from '@/lib/api/errors';
import { decide, type Actor } from '@/lib/auth/policy';
import type { SuggestionDTO } from './types';

/**
 * "New evidence to consider": a study added to the library after a verdict was published that
 * shares a tag with the verdict and that the team's search index ranks close to one of its
 * mechanisms (the mechanism's name as the query, a strong match only). It is offered to the
 * verdict's author on their dashboard and never applied by itself: appraising it is the
 * author's call.
 */

/**
 * The search index's score is 0 when every query word matched exactly in the heaviest field and
 * 1 when nothing matched (lib/search/engine.ts); at most this counts as a strong match. Chosen
 * by hand on the demo library: a title that carries the mechanism's words scores below 0.35,
 * one that shares a single common word above 0.6.
 */
export const STRONG_MATCH = 0.4;

export interface SuggestionCandidate {
  teamId: number;
  publicationId: number;
  mechanismId: number;
  studyId: number;
  score: number;
  reason: string;
}

const lower = (tags: readonly string[]) => new Set(tags.map((t) => t.toLowerCase()));

/** Every suggestion the team's library calls for that does not exist yet (read-only). */
export async function suggestionCandidates(teamId: number): Promise<SuggestionCandidate[]> {
  const pubs = await Publication.findAll({ where: { teamId, withdrawnAt: null } });
  if (!pubs.length) return [];
  const versions = await PublishedVersion.findAll({
    where: { [Op.or]: pubs.map((p) => ({ publicationId: p.id, number: p.latestNumber })) },
  });
  const snapshotOf = new Map(versions.map((v) => [v.publicationId, v.snapshot as unknown as VersionSnapshot]));
  const earliest = new Date(Math.min(...pubs.map((p) => p.lastPublishedAt.getTime())));
  const fresh = await Study.findAll({ where: { teamId, createdAt: { [Op.gt]: earliest } } });
  if (!fresh.length) return [];
  const freshById = new Map(fresh.map((s) => [s.id, s]));
  const existing = await EvidenceSuggestion.findAll({
    where: { teamId },
    attributes: ['publicationId', 'mechanismId', 'studyId'],
  });
  const have = new Set(existing.map((e) => `${e.publicationId}:${e.mechanismId}:${e.studyId}`));

  const out: SuggestionCandidate[] = [];
  for (const pub of pubs) {
    const snapshot = snapshotOf.get(pub.id);
    if (!snapshot) continue;
    const cited = new Set(snapshot.references.map((r) => r.studyId));
    const verdictTags = lower(snapshot.tags);
    for (const m of snapshot.mechanisms) {
      const hits = await searchTeams([teamId], m.name, { kind: 'study', limit: 20 });
      for (const hit of hits) {
        const study = freshById.get(hit.doc.id);
        if (!study || cited.has(study.id) || hit.score > STRONG_MATCH) continue;
        if (study.createdAt <= pub.lastPublishedAt) continue;
        const shared = (study.tags ?? []).filter((t) => verdictTags.has(t.toLowerCase()));
        if (!shared.length || have.has(`${pub.id}:${m.id}:${study.id}`)) continue;
        have.add(`${pub.id}:${m.id}:${study.id}`);
        out.push({
          teamId,
          publicationId: pub.id,
          mechanismId: m.id,
          studyId: study.id,
          score: hit.score,
          reason: `Added after the verdict was published; shares the tag${shared.length > 1 ? 's' : ''} ${shared.join(', ')} and its title matches the mechanism “${m.name}”.`,
        });
      }
    }
  }
  return out;
}

/** The open suggestions on verdicts this person wrote in teams where they still work on reviews, newest first. */
export async function suggestionsFor(actor: Actor): Promise<SuggestionDTO[]> {
  const teamIds = [...actor.roles.keys()].filter((teamId) => decide(actor, 'review.read', { teamId }) === 'allow');
  if (!teamIds.length) return [];
  const reviews = await Review.findAll({
    where: { authorId: actor.userId, teamId: { [Op.in]: teamIds } },
    attributes: ['id'],
  });
  if (!reviews.length) return [];
  const pubs = await Publication.findAll({
    where: { reviewId: { [Op.in]: reviews.map((r) => r.id) }, withdrawnAt: null },
  });
  if (!pubs.length) return [];
  const rows = await EvidenceSuggestion.findAll({
    where: { publicationId: { [Op.in]: pubs.map((p) => p.id) }, dismissedAt: null },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: 50,
  });
  if (!rows.length) return [];
  const [studies, versions] = await Promise.all([
    Study.findAll({ where: { id: { [Op.in]: rows.map((r) => r.studyId) } } }),
    PublishedVersion.findAll({
      where: { [Op.or]: pubs.map((p) => ({ publicationId: p.id, number: p.latestNumber })) },
    }),
  ]);
  const study = new Map(studies.map((s) => [s.id, s]));
  const pub = new Map(pubs.map((p) => [p.id, p]));
  const snapshot = new Map(versions.map((v) => [v.publicationId, v.snapshot as unknown as VersionSnapshot]));
  return rows.flatMap((r) => {
    const s = study.get(r.studyId);
    const snap = snapshot.get(r.publicationId);
    if (!s || !snap) return [];
    return [
      {
        id: r.id,
        slug: pub.get(r.publicationId)!.slug,
        verdictTitle: snap.title,
        mechanism: snap.mechanisms.find((m) => m.id === r.mechanismId)?.name ?? 'A mechanism',
        study: { id: s.id, citation: s.citation, title: s.title },
        reason: r.reason,
        createdAt: r.createdAt.toISOString(),
      },
    ];
  });
}

/** The facts the policy needs to let someone dismiss a suggestion: its team and the verdict's author. */
export async function suggestionAccess(id: number): Promise<{ teamId: number; authorId: number }> {
  const row = await EvidenceSuggestion.findByPk(id);
  const pub = row && (await Publication.findByPk(row.publicationId, { attributes: ['reviewId'] }));
  const review = pub && (await Review.findByPk(pub.reviewId, { attributes: ['teamId', 'authorId'] }));
  if (!row || !review) throw notFound('That suggestion');
  return { teamId: review.teamId, authorId: review.authorId };
}

export async function dismissSuggestion(id: number, userId: number): Promise<void> {
  await EvidenceSuggestion.update(
    { dismissedAt: new Date(), dismissedById: userId },
    { where: { id, dismissedAt: null } },
  );
}
