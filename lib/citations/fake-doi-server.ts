import { createServer, type Server } from 'node:http';
import { CSL_JSON_MEDIA_TYPE } from './doi';
import { demoReference } from './demo-records';
import { listenOnLoopback } from './listen';

/**
 * A local stand-in for the DOI content-negotiation service, for tests and `npm run dev`: it
 * answers CSL-JSON for the invented demo DOIs (10.5555/…, ./demo-records.ts) and 404 for any
 * other, the way the public resolver answers an unknown DOI. Listens on 127.0.0.1 only.
 *
 * Two DOIs misbehave on purpose so the lookup's error paths can be tested:
 * 10.5555/fake.unavailable answers 503, and 10.5555/fake.untitled answers a record with no title.
 */

export interface FakeDoiServer {
  port: number;
  /** The base URL to put in DOI_BASE_URL. */
  url: string;
  /** How many lookups it has answered (tests check that a rejected import made none). */
  requests: number;
  close(): Promise<void>;
}

export async function startFakeDoiServer(options: { port?: number } = {}): Promise<FakeDoiServer> {
  const state = { requests: 0 };
  const server: Server = createServer((req, res) => {
    state.requests += 1;
    let doi: string;
    try {
      doi = decodeURIComponent(new URL(req.url ?? '/', 'http://fake').pathname.slice(1)).toLowerCase();
    } catch {
      res.writeHead(400, { 'content-type': 'text/plain' }).end('Bad DOI');
      return;
    }
    if (req.method !== 'GET') {
      res.writeHead(405, { 'content-type': 'text/plain' }).end('Method not allowed');
      return;
    }
    if (doi === '10.5555/fake.unavailable') {
      res.writeHead(503, { 'content-type': 'text/plain' }).end('Service unavailable');
      return;
    }
    if (doi === '10.5555/fake.untitled') {
      res
        .writeHead(200, { 'content-type': CSL_JSON_MEDIA_TYPE })
        .end(JSON.stringify({ type: 'article-journal', DOI: doi }));
      return;
    }
    const record = demoReference(doi);
    if (!record) {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('DOI not found');
      return;
    }
    if (!(req.headers.accept ?? '').includes(CSL_JSON_MEDIA_TYPE)) {
      res.writeHead(406, { 'content-type': 'text/plain' }).end(`This fake only speaks ${CSL_JSON_MEDIA_TYPE}`);
      return;
    }
    res.writeHead(200, { 'content-type': CSL_JSON_MEDIA_TYPE }).end(JSON.stringify(record));
  });
  const { port, url } = await listenOnLoopback(server, options.port);
  return {
    port,
    url,
    get requests() {
      return state.requests;
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
