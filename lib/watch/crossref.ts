import { env } from '@/lib/env';
import { isNoticeKind, type EvidenceNotice } from './notices';

/**
 * A polite client of the Crossref REST API's `/works/{doi}` (https://api.crossref.org/swagger-ui/,
 * "Etiquette" in https://www.crossref.org/documentation/retrieve-metadata/rest-api/tips-for-using-the-crossref-rest-api/):
 * one request at a time for the whole process, a `mailto:` contact in the User-Agent (the "polite
 * pool"), and on 429 a wait of what `Retry-After` says before asking again — a few times at
 * most, then the run stops rather than hammering a service that asked us to slow down.
 *
 * The base URL comes from CROSSREF_BASE_URL (lib/env.ts); `npm run dev` and the tests point it at
 * the local fake in lib/citations/fake-crossref-server.ts.
 */

const TIMEOUT_MS = 10_000;
/** Retries of one DOI after a 429 before the run gives up (common practice: a small fixed number). */
const MAX_RETRIES = 3;
/** A Retry-After longer than this ends the run instead of holding it (common practice). */
const MAX_WAIT_MS = 60_000;
/** Without a usable Retry-After: 1 s, 2 s, 4 s (exponential back-off, common practice). */
const FALLBACK_WAIT_MS = 1000;

export type WorkLookup =
  | { ok: true; found: true; notices: EvidenceNotice[] }
  | { ok: true; found: false }
  | { ok: false; reason: string; rateLimited: boolean };

type Relation = { DOI?: unknown; type?: unknown; updated?: { 'date-parts'?: unknown } };

/** `[[2026, 11, 20]]` → "2026-11-20" (a year or year-month when that is all there is). */
function isoDate(parts: unknown): string | null {
  const first = Array.isArray(parts) ? parts[0] : null;
  if (!Array.isArray(first) || typeof first[0] !== 'number') return null;
  const [y, m, d] = first as number[];
  const pad = (n: number) => String(n).padStart(2, '0');
  return [String(y), m ? pad(m) : null, m && d ? pad(d) : null].filter(Boolean).join('-');
}

/**
 * The notices about a work, from its Crossref record (pure). `updated-by` lists the notices
 * that update this work (retraction, correction …, each with the notice's DOI and date);
 * `update-to` on the same record means the work is itself such a notice for another DOI — then
 * the library entry is the notice, and it is marked as one pointing at itself.
 */
export function noticesOf(message: Record<string, unknown>, doi: string): EvidenceNotice[] {
  const out: EvidenceNotice[] = [];
  const seen = new Set<string>();
  const add = (relations: unknown, selfIsNotice: boolean) => {
    if (!Array.isArray(relations)) return;
    for (const r of relations as Relation[]) {
      if (typeof r?.type !== 'string' || !isNoticeKind(r.type)) continue;
      const noticeDoi = selfIsNotice ? doi : typeof r.DOI === 'string' ? r.DOI.toLowerCase() : null;
      if (!noticeDoi) continue;
      const key = `${r.type} ${noticeDoi}`;
      if (seen.has(key)) continue;
      seen.add(key);
      out.push({ kind: r.type, noticeDoi, date: isoDate(r.updated?.['date-parts']) });
    }
  };
  add(message['updated-by'], false);
  add(message['update-to'], true);
  return out;
}

/** Seconds or an HTTP date (RFC 9110 §10.2.3), in milliseconds from now; null when unreadable. */
export function retryAfterMs(header: string | null, now = Date.now()): number | null {
  if (!header) return null;
  const trimmed = header.trim();
  if (/^\d+$/.test(trimmed)) return Number(trimmed) * 1000;
  const at = Date.parse(trimmed);
  return Number.isNaN(at) ? null : Math.max(0, at - now);
}

export function worksUrl(doi: string, base = env().CROSSREF_BASE_URL): string {
  return `${base.replace(/\/+$/, '')}/works/${doi.split('/').map(encodeURIComponent).join('/')}`;
}

export function userAgent(): string {
  const e = env();
  const mailto = e.CROSSREF_MAILTO ?? e.MAIL_FROM.match(/<([^>]+)>/)?.[1] ?? e.MAIL_FROM;
  return `Loadbearing/0.1 (${e.APP_URL}; mailto:${mailto})`;
}

// One request at a time in this process, whoever asks (the daily job and a member's run alike).
let queue: Promise<unknown> = Promise.resolve();
function serially<T>(task: () => Promise<T>): Promise<T> {
  const next = queue.then(task, task);
  queue = next.catch(() => undefined);
  return next;
}

export interface CrossrefClientOptions {
  baseUrl?: string;
  fetch?: typeof fetch;
  sleep?: (ms: number) => Promise<void>;
  /** Called on each 429 wait (the run counts them). */
  onBackoff?: (waitMs: number) => void;
}

const defaultSleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/** Looks one DOI up. Never throws: a failure is a reason the run can report. */
export function lookupWork(doi: string, options: CrossrefClientOptions = {}): Promise<WorkLookup> {
  return serially(() => askWithBackoff(doi, options));
}

async function askWithBackoff(doi: string, options: CrossrefClientOptions): Promise<WorkLookup> {
  const doFetch = options.fetch ?? fetch;
  const sleep = options.sleep ?? defaultSleep;
  const url = worksUrl(doi, options.baseUrl);
  for (let attempt = 0; ; attempt++) {
    let response: Response;
    try {
      response = await doFetch(url, {
        headers: { Accept: 'application/json', 'User-Agent': userAgent() },
        signal: AbortSignal.timeout(TIMEOUT_MS),
      });
    } catch {
      return { ok: false, rateLimited: false, reason: `The registry did not answer (asking about ${doi}).` };
    }
    if (response.status === 429) {
      await response.body?.cancel();
      const wait = retryAfterMs(response.headers.get('retry-after')) ?? FALLBACK_WAIT_MS * 2 ** attempt;
      if (attempt >= MAX_RETRIES || wait > MAX_WAIT_MS) {
        return {
          ok: false,
          rateLimited: true,
          reason: `The registry is limiting requests (429 on ${doi} after ${attempt + 1} tries); the watch stopped and tries again on its next run.`,
        };
      }
      options.onBackoff?.(wait);
      await sleep(wait);
      continue;
    }
    if (response.status === 404) {
      await response.body?.cancel();
      return { ok: true, found: false };
    }
    if (!response.ok) {
      await response.body?.cancel();
      return {
        ok: false,
        rateLimited: false,
        reason: `The registry answered ${response.status} (asking about ${doi}).`,
      };
    }
    try {
      const data = (await response.json()) as { message?: Record<string, unknown> };
      return { ok: true, found: true, notices: noticesOf(data.message ?? {}, doi) };
    } catch {
      return { ok: false, rateLimited: false, reason: `The registry sent an unreadable record for ${doi}.` };
    }
  }
}
