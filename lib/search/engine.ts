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
 * The `want` highest-scoring documents among `touched`, best first (ties: indexed first). A full
 * sort of every scored document costs more than the scoring at tens of thousands of documents,
 * so a small min-heap keeps the best `want` in one pass.
 */
function topOrdinals(touched: number[], scores: Float64Array, want: number): number[] {
  const better = (a: number, b: number) => scores[a] > scores[b] || (scores[a] === scores[b] && a < b);
  const heap: number[] = []; // heap[0] is the worst of the best kept so far
  const down = (i: number) => {
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let worst = i;
      if (l < heap.length && better(heap[worst], heap[l])) worst = l;
      if (r < heap.length && better(heap[worst], heap[r])) worst = r;
      if (worst === i) return;
      [heap[i], heap[worst]] = [heap[worst], heap[i]];
      i = worst;
    }
  };
  for (const ord of touched) {
    if (heap.length < want) {
      heap.push(ord);
      for (let i = heap.length - 1; i > 0;) {
        const parent = (i - 1) >> 1;
        if (!better(heap[parent], heap[i])) break;
        [heap[i], heap[parent]] = [heap[parent], heap[i]];
        i = parent;
      }
    } else if (better(ord, heap[0])) {
      heap[0] = ord;
      down(0);
    }
  }
  return heap.sort((a, b) => (better(a, b) ? -1 : 1));
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
  /**
   * Documents are numbered (ordinals, reused after removal) so a query adds up scores in typed
   * arrays instead of maps keyed by strings: at 40,000 documents that is most of a query's time.
   */
  private ordinals = new Map<string, number>();
  private byOrdinal: (T | undefined)[] = [];
  private freeOrdinals: number[] = [];
  /** term → ordinal → bitmask of the fields it occurs in. */
  private postings = new Map<string, Map<number, number>>();
  /** ordinal → its terms (for removal and highlighting). */
  private termsOf = new Map<number, Set<string>>();
  /** Letter pair → the vocabulary words that contain it (the candidates for a fuzzy word). */
  private grams = new Map<string, Set<string>>();
  /** Per-query scratch, one slot per ordinal; every slot used is reset before search returns. */
  private total = new Float64Array(0);
  private perWord = new Float64Array(0);
  private seen = new Uint8Array(0);
  private seenForWord = new Uint8Array(0);

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
    return this.ordinals.size;
  }

  private fieldValues(doc: T, f: FieldSpec<T>): string[] {
    const v = f.get(doc);
    return (Array.isArray(v) ? v : [v]).filter((s) => typeof s === 'string' && s.length > 0);
  }

  private index(doc: T, fresh: Set<string>) {
    const ord = this.freeOrdinals.pop() ?? this.byOrdinal.length;
    this.ordinals.set(this.keyOf(doc), ord);
    this.byOrdinal[ord] = doc;
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
          posting.set(ord, (posting.get(ord) ?? 0) | (1 << i));
          terms.add(term);
        }
      }
    });
    this.termsOf.set(ord, terms);
  }

  /** The document with this key, if indexed. */
  get(key: string): T | undefined {
    const ord = this.ordinals.get(key);
    return ord === undefined ? undefined : this.byOrdinal[ord];
  }

  /** Adds the document, or replaces the one with the same key. */
  upsert(doc: T): void {
    this.remove(this.keyOf(doc));
    const fresh = new Set<string>();
    this.index(doc, fresh);
    for (const term of fresh) this.addGrams(term);
  }

  remove(key: string): boolean {
    const ord = this.ordinals.get(key);
    if (ord === undefined) return false;
    const gone = new Set<string>();
    for (const term of this.termsOf.get(ord) ?? []) {
      const posting = this.postings.get(term);
      posting?.delete(ord);
      if (posting && posting.size === 0) {
        this.postings.delete(term);
        gone.add(term);
      }
    }
    for (const term of gone) this.removeGrams(term);
    this.termsOf.delete(ord);
    this.ordinals.delete(key);
    this.byOrdinal[ord] = undefined;
    this.freeOrdinals.push(ord);
    return true;
  }

  removeWhere(predicate: (doc: T) => boolean): T[] {
    const removed = [...this.ordinals.values()].map((ord) => this.byOrdinal[ord]!).filter(predicate);
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
    this.growScratch();
    const { total, perWord, seen, seenForWord } = this;
    const n = this.ordinals.size || 1;
    const maxWeight = Math.max(...this.fields.map((f) => f.weight));
    const touched: number[] = [];
    const allTerms = new Set<string>();
    let best = 0;
    const add = (ord: number, s: number) => {
      if (!seen[ord]) {
        seen[ord] = 1;
        touched.push(ord);
      }
      total[ord] += s;
    };
    try {
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
          for (const [ord, mask] of posting) add(ord, this.weightOf(mask) * factor);
        } else {
          // Several vocabulary words match this query word: a document counts its best one only.
          const wordTouched: number[] = [];
          for (const [term, closeness] of expanded) {
            allTerms.add(term);
            const posting = this.postings.get(term)!;
            const idf = Math.log(1 + n / posting.size);
            bestIdf = Math.max(bestIdf, idf);
            const factor = closeness * closeness * idf;
            for (const [ord, mask] of posting) {
              const s = this.weightOf(mask) * factor;
              if (!seenForWord[ord]) {
                seenForWord[ord] = 1;
                wordTouched.push(ord);
                perWord[ord] = s;
              } else if (s > perWord[ord]) perWord[ord] = s;
            }
          }
          for (const ord of wordTouched) {
            add(ord, perWord[ord]);
            perWord[ord] = 0;
            seenForWord[ord] = 0;
          }
        }
        best += maxWeight * (bestIdf || Math.log(1 + n));
      }
      const limit = opts.limit ?? 30;
      const out: EngineHit<T>[] = [];
      const collect = (ords: number[]) => {
        for (const ord of ords) {
          const doc = this.byOrdinal[ord]!;
          if (opts.filter && !opts.filter(doc)) continue;
          // Matched words are worked out only for the results returned, not for every scored document.
          const mine = this.termsOf.get(ord)!;
          const terms = new Set([...allTerms].filter((t) => mine.has(t)));
          out.push({ doc, score: Math.max(0, 1 - total[ord] / best), matches: this.ranges(doc, terms) });
          if (out.length >= limit) return;
        }
      };
      const head = topOrdinals(touched, total, opts.filter ? limit * 4 : limit);
      collect(head);
      if (out.length < limit && head.length < touched.length) {
        // The filter dropped too many of the best: go on through the rest, best first.
        const taken = new Set(head);
        collect(
          topOrdinals(
            touched.filter((o) => !taken.has(o)),
            total,
            touched.length,
          ),
        );
      }
      return out;
    } finally {
      for (const ord of touched) {
        total[ord] = 0;
        seen[ord] = 0;
      }
    }
  }

  /** Scratch arrays as long as the highest ordinal (they grow with the index, never shrink). */
  private growScratch() {
    const need = this.byOrdinal.length;
    if (this.total.length >= need) return;
    const size = Math.ceil(need * 1.25) + 64;
    this.total = new Float64Array(size);
    this.perWord = new Float64Array(size);
    this.seen = new Uint8Array(size);
    this.seenForWord = new Uint8Array(size);
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
