import Fuse from 'fuse.js';
import type { MatchDTO } from '@/lib/publishing/types';

/**
 * A fuzzy full-text index that stays fast at tens of thousands of documents, kept current by
 * `upsert` and `remove` (never rebuilt per query).
 *
 * Scanning every document with fuse.js costs a full pass over all their text per query (about
 * half a second at 10,000 reviews on this machine), and even a fuse.js index of the vocabulary
 * (the distinct words, ~10,000 at that size) took ~40 ms a word. So the fuzzy matching is done
 * where it is cheap: the vocabulary words that share enough letter pairs with a query word are
 * the candidates, and fuse.js (`Fuse.match`, its bitap matcher) decides which of those match
 * and how closely — which is what tolerates typos ("tendn" → "tendon", "kettlebel" →
 * "kettlebell"). The matched words lead through an
 * inverted index to the documents, which are ranked by field weight × how close the word
 * matched × how rare it is (inverse document frequency, so "training" counts for less than
 * "pulley"). Matched ranges come back per field for highlighting.
 */

export interface FieldSpec<T> {
  name: string;
  weight: number;
  get: (doc: T) => string | string[];
}

export interface EngineHit<T> {
  doc: T;
  /** 0 = every query word matched exactly in the heaviest field; 1 = nothing matched. */
  score: number;
  matches: MatchDTO[];
}

const WORD = /[\p{L}\p{N}]+(?:[-'’][\p{L}\p{N}]+)*/gu;

export function normalize(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase();
}

/** Words of a text with their positions; a hyphenated word also counts as its parts and as one joined word. */
export function tokens(text: string): { term: string; start: number; end: number }[] {
  const out: { term: string; start: number; end: number }[] = [];
  const norm = normalize(text);
  // NFKD can change lengths (ligatures); positions are then only approximate, which highlighting tolerates.
  for (const m of norm.matchAll(WORD)) {
    const start = m.index ?? 0;
    const word = m[0];
    const parts = word.split(/[-'’]/);
    if (parts.length > 1) {
      out.push({ term: parts.join(''), start, end: start + word.length - 1 });
      let at = start;
      for (const p of parts) {
        if (p.length >= 2) out.push({ term: p, start: at, end: at + p.length - 1 });
        at += p.length + 1;
      }
    } else if (word.length >= 2) out.push({ term: word, start, end: start + word.length - 1 });
  }
  return out;
}

/**
 * The entries with the highest values first. A full sort of every scored document costs more
 * than the scoring at 10,000 documents, so the best `want` are picked first and sorted; the
 * rest follow (sorted) only if the caller's filter drops enough of those.
 */
function* topFirst(scores: Map<string, number>, want: number): Generator<[string, number]> {
  const entries = [...scores];
  if (entries.length <= want * 4) {
    yield* entries.sort((a, b) => b[1] - a[1]);
    return;
  }
  const values = entries.map((e) => e[1]).sort((a, b) => b - a);
  const cut = values[want - 1];
  const head = entries.filter((e) => e[1] >= cut).sort((a, b) => b[1] - a[1]);
  yield* head;
  yield* entries.filter((e) => e[1] < cut).sort((a, b) => b[1] - a[1]);
}

const MATCH_OPTIONS = { threshold: 0.34, ignoreLocation: true, includeScore: true } as const;

const STOP = new Set([
  'a',
  'an',
  'and',
  'the',
  'of',
  'in',
  'on',
  'to',
  'for',
  'is',
  'it',
  'at',
  'by',
  'or',
  'as',
  'be',
  'with',
]);

export class FuzzyIndex<T> {
  private docs = new Map<string, T>();
  /** term → docKey → bitmask of the fields it occurs in. */
  private postings = new Map<string, Map<string, number>>();
  /** docKey → its terms (for removal). */
  private termsOf = new Map<string, Set<string>>();
  /** Letter pair → the vocabulary words that contain it (the candidates for a fuzzy word). */
  private grams = new Map<string, Set<string>>();

  constructor(
    private readonly fields: FieldSpec<T>[],
    private readonly keyOf: (doc: T) => string,
    docs: T[] = [],
  ) {
    const fresh = new Set<string>();
    for (const doc of docs) this.index(doc, fresh);
    for (const term of fresh) this.addGrams(term);
  }

  get size(): number {
    return this.docs.size;
  }

  private fieldValues(doc: T, f: FieldSpec<T>): string[] {
    const v = f.get(doc);
    return (Array.isArray(v) ? v : [v]).filter((s) => typeof s === 'string' && s.length > 0);
  }

  private index(doc: T, fresh: Set<string>) {
    const key = this.keyOf(doc);
    this.docs.set(key, doc);
    const terms = new Set<string>();
    this.fields.forEach((f, i) => {
      for (const value of this.fieldValues(doc, f)) {
        for (const { term } of tokens(value)) {
          if (STOP.has(term)) continue;
          let posting = this.postings.get(term);
          if (!posting) {
            posting = new Map();
            this.postings.set(term, posting);
            fresh.add(term);
          }
          posting.set(key, (posting.get(key) ?? 0) | (1 << i));
          terms.add(term);
        }
      }
    });
    this.termsOf.set(key, terms);
  }

  /** Adds the document, or replaces the one with the same key. */
  upsert(doc: T): void {
    this.remove(this.keyOf(doc));
    const fresh = new Set<string>();
    this.index(doc, fresh);
    for (const term of fresh) this.addGrams(term);
  }

  remove(key: string): boolean {
    const terms = this.termsOf.get(key);
    if (!terms) return false;
    const gone = new Set<string>();
    for (const term of terms) {
      const posting = this.postings.get(term);
      posting?.delete(key);
      if (posting && posting.size === 0) {
        this.postings.delete(term);
        gone.add(term);
      }
    }
    for (const term of gone) this.removeGrams(term);
    this.termsOf.delete(key);
    this.docs.delete(key);
    return true;
  }

  removeWhere(predicate: (doc: T) => boolean): T[] {
    const removed = [...this.docs.values()].filter(predicate);
    for (const doc of removed) this.remove(this.keyOf(doc));
    return removed;
  }

  private static bigrams(term: string): string[] {
    const padded = `^${term}$`;
    const out = new Set<string>();
    for (let i = 0; i < padded.length - 1; i++) out.add(padded.slice(i, i + 2));
    return [...out];
  }

  private addGrams(term: string) {
    for (const g of FuzzyIndex.bigrams(term)) {
      let set = this.grams.get(g);
      if (!set) this.grams.set(g, (set = new Set()));
      set.add(term);
    }
  }

  private removeGrams(term: string) {
    for (const g of FuzzyIndex.bigrams(term)) this.grams.get(g)?.delete(term);
  }

  /** Vocabulary words close to a query word, with how close (1 = exact). */
  private expand(word: string): Map<string, number> {
    const out = new Map<string, number>();
    if (this.postings.has(word)) out.set(word, 1);
    // Very short words are matched exactly: three letters fuzzy-match half the vocabulary.
    if (word.length < 4) return out;
    const qg = FuzzyIndex.bigrams(word);
    const shared = new Map<string, number>();
    for (const g of qg) for (const t of this.grams.get(g) ?? []) shared.set(t, (shared.get(t) ?? 0) + 1);
    // Each typo breaks at most two letter pairs; allow two typos, and longer words that start the same (prefixes).
    const minShared = Math.max(2, qg.length - 4);
    const candidates = [...shared]
      .filter(([t, c]) => c >= minShared && t.length >= word.length - 2 && t !== word)
      .sort((a, b) => b[1] - a[1])
      .slice(0, 200);
    for (const [term] of candidates) {
      const r = Fuse.match(word, term, MATCH_OPTIONS);
      if (!r.isMatch) continue;
      // A much longer vocabulary word that merely contains the query is a weaker match.
      const lengthPenalty = Math.min(1, word.length / term.length);
      const closeness = (1 - (r.score ?? 1)) * (0.6 + 0.4 * lengthPenalty);
      if (closeness > (out.get(term) ?? 0)) out.set(term, closeness);
    }
    return out;
  }

  private maskWeights: number[] = [];

  /** The heaviest field weight among the fields in a bitmask (cached: at most 2^fields masks). */
  private weightOf(mask: number): number {
    let w = this.maskWeights[mask];
    if (w === undefined) {
      w = 0;
      this.fields.forEach((f, i) => {
        if (mask & (1 << i)) w = Math.max(w!, f.weight);
      });
      this.maskWeights[mask] = w;
    }
    return w;
  }

  search(query: string, opts: { filter?: (doc: T) => boolean; limit?: number } = {}): EngineHit<T>[] {
    const words = [...new Set(tokens(query).map((t) => t.term))].filter((w) => !STOP.has(w));
    if (!words.length) return [];
    const n = this.docs.size || 1;
    const maxWeight = Math.max(...this.fields.map((f) => f.weight));
    const scores = new Map<string, number>();
    const allTerms = new Set<string>();
    let best = 0;
    for (const word of words) {
      const expanded = this.expand(word);
      let bestIdf = 0;
      if (expanded.size === 1) {
        // The common case (one exact or one close word): add straight into the totals.
        const [[term, closeness]] = expanded;
        allTerms.add(term);
        const posting = this.postings.get(term)!;
        const idf = Math.log(1 + n / posting.size);
        bestIdf = idf;
        const factor = closeness * closeness * idf;
        for (const [key, mask] of posting) scores.set(key, (scores.get(key) ?? 0) + this.weightOf(mask) * factor);
      } else {
        // Several vocabulary words match this query word: a document counts its best one only.
        const perDoc = new Map<string, number>();
        for (const [term, closeness] of expanded) {
          allTerms.add(term);
          const posting = this.postings.get(term)!;
          const idf = Math.log(1 + n / posting.size);
          bestIdf = Math.max(bestIdf, idf);
          const factor = closeness * closeness * idf;
          for (const [key, mask] of posting) {
            const s = this.weightOf(mask) * factor;
            const had = perDoc.get(key);
            if (had === undefined || s > had) perDoc.set(key, s);
          }
        }
        for (const [key, s] of perDoc) scores.set(key, (scores.get(key) ?? 0) + s);
      }
      best += maxWeight * (bestIdf || Math.log(1 + n));
    }
    const limit = opts.limit ?? 30;
    const out: EngineHit<T>[] = [];
    for (const [key, total] of topFirst(scores, opts.filter ? limit * 4 : limit)) {
      const doc = this.docs.get(key)!;
      if (opts.filter && !opts.filter(doc)) continue;
      // Matched words are worked out only for the results returned, not for every scored document.
      const mine = this.termsOf.get(key)!;
      const terms = new Set([...allTerms].filter((t) => mine.has(t)));
      out.push({ doc, score: Math.max(0, 1 - total / best), matches: this.ranges(doc, terms) });
      if (out.length >= limit) break;
    }
    return out;
  }

  /** Where the matched words occur in each field's text, as fuse.js reports matches. */
  private ranges(doc: T, terms: Set<string>): MatchDTO[] {
    const out: MatchDTO[] = [];
    for (const f of this.fields) {
      for (const value of this.fieldValues(doc, f)) {
        const indices = tokens(value)
          .filter((t) => terms.has(t.term))
          .map((t) => [t.start, t.end] as [number, number]);
        if (indices.length) out.push({ key: f.name, value, indices });
      }
    }
    return out;
  }
}
