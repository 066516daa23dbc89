import { Op } from 'sequelize';
import { bodyPlainText } from '@/lib/publishing/render-body';
import type { FuzzyIndex } from './engine';
import { listenForChanges, publishChange } from './change-feed';
import { Mechanism, Review, Study } from '@/models';
import {
  BODY_CHARS,
  newIndex,
  searchIndex,
  type MechanismDoc,
  type ReviewDoc,
  type SearchDoc,
  type SearchFilters,
  type SearchHit,
  type StudyDoc,
} from './documents';

/**
 * One fuse.js index per team, built the first time the team is searched and then kept current
 * by the change hooks below (upsert and remove), never rebuilt per request. Kept on globalThis:
 * Next bundles route handlers, pages and server actions separately, and they must share one
 * store (one Node process, like the sign-in throttle in lib/auth/rate-limit.ts).
 *
 * The hooks are called by the code that changes the data: `onReviewChanged(reviewId)` after a
 * review, its mechanisms or its body change (or it is deleted), `onStudyChanged(studyId)` after a
 * library study changes (or is deleted). A hook for a team whose index was never built does
 * nothing: the lazy build will read the current rows.
 *
 * Several processes on PostgreSQL (docs/deployment.md): each keeps its own indexes, and every
 * hook also tells the others through change-feed.ts (LISTEN/NOTIFY), which apply the same
 * update from the rows, so a change on one process is found by a search on any other within
 * moments. A process starts listening before its first build, so no change falls in between.
 */

interface TeamIndex {
  fuse: FuzzyIndex<SearchDoc>;
}

const store = globalThis as unknown as { loadbearingSearch?: Map<number, Promise<TeamIndex>> };
const teams = () => (store.loadbearingSearch ??= new Map());

export function reviewDoc(review: Review, mechanisms: Pick<Mechanism, 'name'>[]): ReviewDoc {
  return {
    kind: 'review',
    key: `review:${review.id}`,
    id: review.id,
    teamId: review.teamId,
    reviewId: review.id,
    title: review.title,
    claim: review.claim,
    tags: review.tags ?? [],
    mechanisms: mechanisms.map((m) => m.name),
    body: bodyPlainText(review.body).slice(0, BODY_CHARS),
    status: review.status,
    verdict: review.verdict,
    slug: review.slug,
  };
}

export function mechanismDoc(m: Mechanism, review: Pick<Review, 'id' | 'teamId' | 'title'>): MechanismDoc {
  return {
    kind: 'mechanism',
    key: `mechanism:${m.id}`,
    id: m.id,
    teamId: review.teamId,
    reviewId: review.id,
    reviewTitle: review.title,
    name: m.name,
    summary: m.summary,
  };
}

export function studyDoc(s: Study): StudyDoc {
  return {
    kind: 'study',
    key: `study:${s.id}`,
    id: s.id,
    teamId: s.teamId,
    title: s.title,
    citation: s.citation,
    journal: s.journal ?? '',
    doi: s.doi ?? '',
    tags: s.tags ?? [],
  };
}

async function build(teamId: number): Promise<TeamIndex> {
  const reviews = await Review.findAll({ where: { teamId } });
  const mechanisms = reviews.length
    ? await Mechanism.findAll({
        where: { reviewId: { [Op.in]: reviews.map((r) => r.id) } },
        order: [['position', 'ASC']],
      })
    : [];
  const studies = await Study.findAll({ where: { teamId } });
  const byReview = new Map<number, Mechanism[]>();
  for (const m of mechanisms) byReview.set(m.reviewId, [...(byReview.get(m.reviewId) ?? []), m]);
  const reviewById = new Map(reviews.map((r) => [r.id, r]));
  const docs: SearchDoc[] = [
    ...reviews.map((r) => reviewDoc(r, byReview.get(r.id) ?? [])),
    ...mechanisms.map((m) => mechanismDoc(m, reviewById.get(m.reviewId)!)),
    ...studies.map(studyDoc),
  ];
  return { fuse: newIndex(docs) };
}

async function teamIndex(teamId: number): Promise<TeamIndex> {
  // Missed changes (a dropped listening connection) cannot be replayed: forget every index.
  await listenForChanges(['review'], updateReview, resetSearchIndexes);
  await listenForChanges(['study'], updateStudy, resetSearchIndexes);
  let index = teams().get(teamId);
  if (!index) {
    index = build(teamId);
    // A failed build is not kept, so the next search tries again.
    index.catch(() => teams().delete(teamId));
    teams().set(teamId, index);
  }
  return index;
}

function removeWhere(index: TeamIndex, predicate: (doc: SearchDoc) => boolean) {
  index.fuse.removeWhere(predicate);
}

function addAll(index: TeamIndex, docs: SearchDoc[]) {
  for (const doc of docs) index.fuse.upsert(doc);
}

/** Keeps the indexes current after a review, its mechanisms or its body changed, or it was deleted. */
export async function onReviewChanged(reviewId: number): Promise<void> {
  await updateReview(reviewId);
  await publishChange({ kind: 'review', id: reviewId });
}

/**
 * After a save of the review's own fields (PATCH /api/reviews/:id, the autosave), with the row
 * as saved. Its mechanisms did not change, so while its title is the same the mechanism
 * documents stay and the review's document keeps their names: no query, and no scan of the
 * team's index. Otherwise (a new title, a document not there) it is onReviewChanged.
 */
export async function onReviewSaved(review: Review): Promise<void> {
  const pending = teams().get(review.teamId);
  const index = pending ? await pending : null;
  const old = index?.fuse.get(`review:${review.id}`) as ReviewDoc | undefined;
  if (index && (!old || old.title !== review.title)) return onReviewChanged(review.id);
  if (index && old)
    index.fuse.upsert(
      reviewDoc(
        review,
        old.mechanisms.map((name) => ({ name })),
      ),
    );
  await publishChange({ kind: 'review', id: review.id });
}

/** Keeps the indexes current after a library study changed or was deleted. */
export async function onStudyChanged(studyId: number): Promise<void> {
  await updateStudy(studyId);
  await publishChange({ kind: 'study', id: studyId });
}

async function updateReview(reviewId: number): Promise<void> {
  const review = await Review.findByPk(reviewId);
  for (const [teamId, pending] of teams()) {
    if (review && review.teamId !== teamId) continue;
    const index = await pending;
    removeWhere(index, (d) => (d.kind === 'review' || d.kind === 'mechanism') && d.reviewId === reviewId);
    if (!review) continue;
    const mechanisms = await Mechanism.findAll({ where: { reviewId }, order: [['position', 'ASC']] });
    addAll(index, [reviewDoc(review, mechanisms), ...mechanisms.map((m) => mechanismDoc(m, review))]);
  }
}

async function updateStudy(studyId: number): Promise<void> {
  const study = await Study.findByPk(studyId);
  for (const [teamId, pending] of teams()) {
    if (study && study.teamId !== teamId) continue;
    const index = await pending;
    removeWhere(index, (d) => d.kind === 'study' && d.id === studyId);
    if (study) addAll(index, [studyDoc(study)]);
  }
}

/**
 * Re-indexes the studies an import or a hand entry resolved to; passes the import's result through.
 * One query for all of them and one pass per built index: a 5,000-entry import must not cost a
 * query per study.
 */
export async function reindexStudies<T extends { studies: { id: number }[] }>(result: T): Promise<T> {
  const ids = new Set(result.studies.map((s) => s.id));
  if (!ids.size || !teams().size) return result;
  const rows = await Study.findAll({ where: { id: { [Op.in]: [...ids] } } });
  for (const [teamId, pending] of teams()) {
    const docs = rows.filter((s) => s.teamId === teamId).map(studyDoc);
    if (!docs.length) continue;
    const index = await pending;
    removeWhere(index, (d) => d.kind === 'study' && ids.has(d.id));
    addAll(index, docs);
  }
  return result;
}

/** Searches the given teams' indexes (the caller decided which the actor may search), best first. */
export async function searchTeams(teamIds: number[], q: string, filters: SearchFilters = {}): Promise<SearchHit[]> {
  const hits: SearchHit[] = [];
  for (const teamId of teamIds) hits.push(...searchIndex((await teamIndex(teamId)).fuse, q, filters));
  return hits.sort((a, b) => a.score - b.score).slice(0, filters.limit ?? 30);
}

/** For tests: forget every index (the next search rebuilds lazily). */
export function resetSearchIndexes(): void {
  teams().clear();
}

/** For tests and the benchmark: whether a team's index is built (it is never built per request). */
export function isIndexBuilt(teamId: number): boolean {
  return teams().has(teamId);
}
