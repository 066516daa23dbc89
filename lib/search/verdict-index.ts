import type { VerdictListItemDTO, VersionSnapshot } from '@/lib/publishing/types';
import { listenForChanges, publishChange } from './change-feed';
import { FuzzyIndex, type FieldSpec } from './engine';

/**
 * The index of published verdicts that athletes and the public search (GET /api/verdicts?q=).
 * One document per publication, its latest version; built once from the database (the caller
 * hands the loader) and kept current by `upsertVerdict` / `removeVerdict` on every publish and
 * withdrawal. Visibility is applied to the results by the caller, per reader.
 */

export interface VerdictDoc {
  key: string;
  item: VerdictListItemDTO;
  tags: string[];
  mechanisms: string[];
  body: string;
}

export function verdictDoc(item: VerdictListItemDTO, snapshot: VersionSnapshot): VerdictDoc {
  return {
    key: item.slug,
    item,
    tags: snapshot.tags,
    mechanisms: snapshot.mechanisms.map((m) => m.name),
    body: `${snapshot.verdict.summary} ${snapshot.bodyText}`.slice(0, 4000),
  };
}

const FIELDS: FieldSpec<VerdictDoc>[] = [
  { name: 'item.title', weight: 3, get: (d) => d.item.title },
  { name: 'item.claim', weight: 3, get: (d) => d.item.claim },
  { name: 'tags', weight: 2, get: (d) => d.tags },
  { name: 'mechanisms', weight: 2, get: (d) => d.mechanisms },
  { name: 'item.verdictLabel', weight: 1, get: (d) => d.item.verdictLabel },
  { name: 'item.teamName', weight: 0.5, get: (d) => d.item.teamName },
  { name: 'body', weight: 0.5, get: (d) => d.body },
];

type Store = FuzzyIndex<VerdictDoc>;
const holder = globalThis as unknown as { loadbearingVerdictIndex?: Promise<Store> };

/**
 * The index of published verdicts, built on first use. With several processes on PostgreSQL a
 * publish, withdraw or delete on another process arrives through change-feed.ts and simply drops
 * this copy: the next search rebuilds it from the rows (publishing is rare, searching common).
 */
export async function verdictIndex(load: () => Promise<VerdictDoc[]>): Promise<Store> {
  await listenForChanges(['verdict'], async () => resetVerdictIndex(), resetVerdictIndex);
  if (!holder.loadbearingVerdictIndex) {
    const pending = load().then((docs) => new FuzzyIndex<VerdictDoc>(FIELDS, (d) => d.key, docs));
    pending.catch(() => {
      holder.loadbearingVerdictIndex = undefined;
    });
    holder.loadbearingVerdictIndex = pending;
  }
  return holder.loadbearingVerdictIndex;
}

/**
 * Replaces a publication's document; a no-op while the index is not built (the build reads
 * current rows). Tells the other processes either way.
 */
export async function upsertVerdict(doc: VerdictDoc): Promise<void> {
  if (holder.loadbearingVerdictIndex) (await holder.loadbearingVerdictIndex).upsert(doc);
  await publishChange({ kind: 'verdict', id: 0 });
}

export async function removeVerdict(slug: string): Promise<void> {
  if (holder.loadbearingVerdictIndex) (await holder.loadbearingVerdictIndex).remove(slug);
  await publishChange({ kind: 'verdict', id: 0 });
}

export function resetVerdictIndex(): void {
  holder.loadbearingVerdictIndex = undefined;
}

export function searchVerdictIndex(
  store: Store,
  q: string,
  visible: (item: VerdictListItemDTO) => boolean,
  limit = 30,
): VerdictListItemDTO[] {
  return store
    .search(q, { filter: (d) => visible(d.item), limit })
    .map((h) => ({ ...h.doc.item, score: h.score, matches: h.matches }));
}
