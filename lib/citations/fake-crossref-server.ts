import { createServer, type Server } from 'node:http';
import type { NoticeKind } from '@/lib/watch/notices';
import { demoReference } from './demo-records';
import { listenOnLoopback } from './listen';

/**
 * A local stand-in for the Crossref REST API's `/works/{doi}`, for tests, benches and `npm run
 * dev`. It answers Crossref-shaped JSON (`{status, message-type, message}`) for any DOI under
 * the demo prefix 10.5555 (the demo records' titles where it has them) and 404 for others, the
 * way the registry answers an unknown DOI. The `updated-by` / `update-to` relations come from
 * DEMO_NOTICES (or `setNotices`): the demo study 10.5555/hjts.2022.0333 is retracted, and
 * 10.5555/hjts.2020.0421 corrected.
 *
 * It can be told to misbehave, in process (`setMode`, `rateLimitNext`) or over HTTP (`POST
 * /__control` with `{mode, rateLimitNext, retryAfter, notices}`) for a browser test or a demo:
 * 'down' answers 503 to every lookup, 'rate-limited' answers 429 with Retry-After.
 * Listens on 127.0.0.1 only.
 */

export interface FakeNotice {
  /** The original's DOI. */
  doi: string;
  kind: NoticeKind;
  noticeDoi: string;
  date: [number, number, number];
}

export const DEMO_NOTICES: FakeNotice[] = [
  { doi: '10.5555/hjts.2022.0333', kind: 'retraction', noticeDoi: '10.5555/hjts.2026.r0333', date: [2026, 11, 20] },
  { doi: '10.5555/hjts.2020.0421', kind: 'correction', noticeDoi: '10.5555/hjts.2026.c0421', date: [2026, 11, 27] },
];

export type FakeCrossrefMode = 'ok' | 'down' | 'rate-limited';

export interface FakeCrossrefServer {
  port: number;
  /** The base URL to put in CROSSREF_BASE_URL. */
  url: string;
  /** Lookups received, 429s included. */
  requests: number;
  /** Most lookups in flight at once (a polite client keeps it at 1). */
  maxConcurrent: number;
  /** The User-Agent of the last lookup. */
  lastUserAgent: string | null;
  setMode(mode: FakeCrossrefMode, retryAfterSeconds?: number): void;
  /** The next `count` lookups answer 429 with this Retry-After, then it answers normally. */
  rateLimitNext(count: number, retryAfterSeconds: number): void;
  setNotices(notices: FakeNotice[]): void;
  close(): Promise<void>;
}

const relation = (n: FakeNotice, doi: string) => ({
  DOI: doi,
  type: n.kind,
  label: n.kind.replace(/_/g, ' ').replace(/^./, (c) => c.toUpperCase()),
  source: 'publisher',
  updated: { 'date-parts': [n.date], timestamp: Date.UTC(n.date[0], n.date[1] - 1, n.date[2]) },
});

function work(doi: string, notices: FakeNotice[]) {
  const demo = demoReference(doi);
  const updatedBy = notices.filter((n) => n.doi === doi).map((n) => relation(n, n.noticeDoi));
  const updateTo = notices.filter((n) => n.noticeDoi === doi).map((n) => relation(n, n.doi));
  return {
    status: 'ok',
    'message-type': 'work',
    'message-version': '1.0.0',
    message: {
      DOI: doi,
      type: 'journal-article',
      title: [typeof demo?.title === 'string' ? demo.title : `Invented record ${doi}`],
      prefix: '10.5555',
      ...(updatedBy.length ? { 'updated-by': updatedBy } : {}),
      ...(updateTo.length ? { 'update-to': updateTo } : {}),
    },
  };
}

export async function startFakeCrossrefServer(options: { port?: number } = {}): Promise<FakeCrossrefServer> {
  const state = {
    requests: 0,
    inFlight: 0,
    maxConcurrent: 0,
    lastUserAgent: null as string | null,
    mode: 'ok' as FakeCrossrefMode,
    retryAfter: 1,
    limitedLeft: 0,
    notices: [...DEMO_NOTICES],
  };
  const server: Server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://fake');
    if (req.method === 'POST' && url.pathname === '/__control') {
      let text = '';
      req.on('data', (chunk) => (text += chunk));
      req.on('end', () => {
        try {
          const body = JSON.parse(text || '{}') as Record<string, unknown>;
          if (body.mode === 'ok' || body.mode === 'down' || body.mode === 'rate-limited') state.mode = body.mode;
          if (typeof body.retryAfter === 'number') state.retryAfter = body.retryAfter;
          if (typeof body.rateLimitNext === 'number') state.limitedLeft = body.rateLimitNext;
          if (Array.isArray(body.notices)) state.notices = body.notices as FakeNotice[];
          res.writeHead(204).end();
        } catch {
          res.writeHead(400, { 'content-type': 'text/plain' }).end('Bad control JSON');
        }
      });
      return;
    }
    state.requests += 1;
    state.inFlight += 1;
    state.maxConcurrent = Math.max(state.maxConcurrent, state.inFlight);
    state.lastUserAgent = req.headers['user-agent'] ?? null;
    // Answered on the next turn, so overlapping requests would be seen overlapping.
    setImmediate(() => {
      state.inFlight -= 1;
      const match = url.pathname.match(/^\/works\/(.+)$/);
      if (req.method !== 'GET' || !match) {
        res.writeHead(404, { 'content-type': 'text/plain' }).end('Resource not found.');
        return;
      }
      if (state.mode === 'down') {
        res.writeHead(503, { 'content-type': 'text/plain' }).end('Service unavailable');
        return;
      }
      if (state.mode === 'rate-limited' || state.limitedLeft > 0) {
        if (state.limitedLeft > 0) state.limitedLeft -= 1;
        res
          .writeHead(429, { 'content-type': 'text/plain', 'retry-after': String(state.retryAfter) })
          .end('Too many requests');
        return;
      }
      let doi: string;
      try {
        doi = decodeURIComponent(match[1]).toLowerCase();
      } catch {
        res.writeHead(400, { 'content-type': 'text/plain' }).end('Bad DOI');
        return;
      }
      if (!doi.startsWith('10.5555/')) {
        res.writeHead(404, { 'content-type': 'text/plain' }).end('Resource not found.');
        return;
      }
      res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify(work(doi, state.notices)));
    });
  });
  const { port, url } = await listenOnLoopback(server, options.port);
  return {
    port,
    url,
    get requests() {
      return state.requests;
    },
    get maxConcurrent() {
      return state.maxConcurrent;
    },
    get lastUserAgent() {
      return state.lastUserAgent;
    },
    setMode(mode, retryAfterSeconds) {
      state.mode = mode;
      if (retryAfterSeconds !== undefined) state.retryAfter = retryAfterSeconds;
    },
    rateLimitNext(count, retryAfterSeconds) {
      state.limitedLeft = count;
      state.retryAfter = retryAfterSeconds;
    },
    setNotices(notices) {
      state.notices = [...notices];
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
