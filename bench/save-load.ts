/**
 * Autosave load for the benchmarks: 16 coaches, each signed in on its own session, each saving
 * its own review over and over for `seconds` (PATCH /api/reviews/:id with the version it read,
 * as the workbench's autosave does), and the sessions of the first coach (one person in several
 * tabs) also saving one shared review, so honest 409s (a stale version) happen as they would. Counts saves, 409s, other errors and the
 * latency of each save.
 *
 * Two paces: `pauseMs` 0 (the default) saves back to back, a stress far above what the workbench
 * sends; `pauseMs` = AUTOSAVE_DELAY_MS waits the workbench's own autosave delay after each answer,
 * the fastest a coach who keeps typing can make it save (components/editor/use-autosave.ts), each
 * coach starting at a different point of that delay.
 */
import { newReview } from '../tests/helpers/review-input';

export interface SaveFigures {
  saves: number;
  conflicts: number;
  errors: number;
  /** The other errors by status and first message, to say what they were. */
  errorKinds: Record<string, number>;
  p50: number;
  p99: number;
}

const COACHES = 16;

/** The answer's JSON; an answer that is not JSON (a proxy's error page) as `{ error: <its start> }`. */
async function json(res: Response) {
  const text = await res.text();
  try {
    return text ? JSON.parse(text) : null;
  } catch {
    return { error: text.replace(/\s+/g, ' ').slice(0, 80) };
  }
}

/** Signs a demo account in at `base`; returns its session cookie (name=value). */
export async function signIn(base: string, email: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email, password: 'loadbearing-demo' }),
  });
  if (res.status !== 200) throw new Error(`sign-in ${res.status}`);
  return res.headers.getSetCookie()[0].split(';')[0];
}

export async function coachSaves(base: string, seconds: number, pauseMs = 0): Promise<SaveFigures> {
  const emails = ['coach@granite-hollow.test', 'coach2@granite-hollow.test', 'owner@granite-hollow.test'];
  const cookies: string[] = [];
  for (let i = 0; i < COACHES; i++) cookies.push(await signIn(base, emails[i % emails.length]));
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
  const errorKinds: Record<string, number> = {};
  // Created one after another: creation is not what is measured.
  const owned: { id: number; version: number }[] = [];
  for (const [i, cookie] of cookies.entries()) owned.push(await create(cookie, i + 1));
  const until = Date.now() + seconds * 1000;
  await Promise.all(
    cookies.map(async (cookie, i) => {
      const own = owned[i];
      let n = 0;
      // Coaches do not type in step: at the autosave pace each starts at its own point of the
      // delay, so the load is spread as sixteen people's pauses would spread it.
      if (pauseMs > 0) await new Promise((r) => setTimeout(r, (i / cookies.length) * pauseMs));
      while (Date.now() < until) {
        const target = i % 3 === 0 && n % 2 === 1 ? shared : own;
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
        } else {
          errors++;
          const kind = `${res.status} ${body?.error ?? ''}`.trim();
          errorKinds[kind] = (errorKinds[kind] ?? 0) + 1;
        }
        if (pauseMs > 0) await new Promise((r) => setTimeout(r, pauseMs));
      }
    }),
  );
  latencies.sort((a, b) => a - b);
  const at = (q: number) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))]);
  return { saves: latencies.length, conflicts, errors, errorKinds, p50: at(0.5), p99: at(0.99) };
}
