/**
 * Autosave load for the benchmarks: 16 coaches, each signed in on its own session, each saving
 * its own review over and over for `seconds` (PATCH /api/reviews/:id with the version it read,
 * as the workbench's autosave does), plus every fourth coach also saving a shared review, so
 * honest 409s (a stale version) happen as they would. Counts saves, 409s, other errors and the
 * latency of each save.
 */
import { newReview } from '../tests/helpers/review-input';

export interface SaveFigures {
  saves: number;
  conflicts: number;
  errors: number;
  p50: number;
  p99: number;
}

const COACHES = 16;

async function json(res: Response) {
  const text = await res.text();
  return text ? JSON.parse(text) : null;
}

export async function coachSaves(base: string, seconds: number): Promise<SaveFigures> {
  const signIn = async (email: string) => {
    const res = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: base },
      body: JSON.stringify({ email, password: 'loadbearing-demo' }),
    });
    if (res.status !== 200) throw new Error(`sign-in ${res.status}`);
    return res.headers.getSetCookie()[0].split(';')[0];
  };
  const emails = ['coach@granite-hollow.test', 'coach2@granite-hollow.test', 'owner@granite-hollow.test'];
  const cookies: string[] = [];
  for (let i = 0; i < COACHES; i++) cookies.push(await signIn(emails[i % emails.length]));
  const me = await json(await fetch(`${base}/api/me`, { headers: { cookie: cookies[0] } }));
  const teamId = me.teams[0].id as number;
  const call = (cookie: string, method: string, pathname: string, body?: unknown) =>
    fetch(`${base}${pathname}`, {
      method,
      headers: { 'content-type': 'application/json', cookie, origin: base },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  const create = async (cookie: string, n: number) => {
    const res = await call(
      cookie,
      'POST',
      '/api/reviews',
      newReview(teamId, { claim: `Autosave load claim number ${n}: daily hangs grow finger strength.` }),
    );
    const body = await json(res);
    if (res.status !== 201) throw new Error(`create ${res.status} ${JSON.stringify(body)}`);
    return { id: body.review.id as number, version: body.review.version as number };
  };
  const shared = await create(cookies[0], 0);
  const latencies: number[] = [];
  let conflicts = 0;
  let errors = 0;
  const until = Date.now() + seconds * 1000;
  await Promise.all(
    cookies.map(async (cookie, i) => {
      const own = await create(cookie, i + 1);
      let n = 0;
      while (Date.now() < until) {
        const target = i % 4 === 0 && n % 2 === 1 ? shared : own;
        const started = performance.now();
        const res = await call(cookie, 'PATCH', `/api/reviews/${target.id}`, {
          version: target.version,
          claimSource: `Autosave ${i}.${n++}`,
        });
        latencies.push(performance.now() - started);
        const body = await json(res);
        if (res.status === 200) target.version = body.review.version;
        else if (res.status === 409) {
          conflicts++;
          target.version = body.current?.version ?? target.version; // reload, as the workbench does
        } else errors++;
      }
    }),
  );
  latencies.sort((a, b) => a - b);
  const at = (q: number) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))]);
  return { saves: latencies.length, conflicts, errors, p50: at(0.5), p99: at(0.99) };
}
