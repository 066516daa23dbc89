/**
 * Malformed requests to every write route of the production build, as the demo team's owner:
 * broken JSON, wrong types, huge strings, odd ids in bodies and paths, wrong content types.
 * Counts the 5xx answers and compares every table (row count + checksum) before and after:
 * a malformed request changes nothing (docs/api/README.md, "Errors").
 * Run: npx tsx bench/probes/fuzz.ts [total, default 12000]
 */
import { readFileSync } from 'node:fs';
import { wellFormed, type Ids } from './lib/bodies';
import { changedTables, ReadOnlyDb } from './lib/database';
import { BROKEN_JSON, ODD_PATH_IDS, oneFieldWrong, randomlyWrong, WRONG_TYPES, type Malformed } from './lib/malformed';
import { publish, table } from './lib/report';
import { endpoints, fill, type Endpoint } from './lib/routes';
import { startProduction } from '../lib/production';
import { buildWorld } from './lib/world';

/** The malformed requests of one route: its body kind decides which apply. */
function requestsFor(e: Endpoint, ids: Ids, perRoute: number, seed: number): (Malformed & { path: string })[] {
  const [path] = fill(e.template, Object.fromEntries(Object.entries(ids).map(([k, v]) => [k, [v]])));
  const base = wellFormed(e, ids);
  const baseText = JSON.stringify(base);
  const out: (Malformed & { path: string })[] = [];
  // Odd ids in the path, with a well-formed body.
  const params = [...e.template.matchAll(/\[([^\]]+)\]/g)].map((m) => m[0]);
  for (const param of params) {
    for (const odd of ODD_PATH_IDS) {
      const [oddPath] = fill(
        e.template.replace(param, odd),
        Object.fromEntries(Object.entries(ids).map(([k, v]) => [k, [v]])),
      );
      if (param !== '[token]') out.push({ label: `path ${param}=${odd}`, raw: baseText, path: oddPath });
    }
  }
  // A JSON body to a multipart upload; a well-formed body under another type.
  for (const type of e.body === 'multipart' ? ['application/json', ...WRONG_TYPES.slice(0, 3)] : WRONG_TYPES) {
    out.push({ label: `type ${type}`, raw: baseText, contentType: type, path });
  }
  if (e.body === 'multipart') {
    for (const raw of [
      '--x\r\n',
      '--x\r\nContent-Disposition: form-data; name="file"\r\n\r\n%PDF',
      '',
      'a'.repeat(100_000),
    ]) {
      out.push({ label: 'broken multipart', raw, contentType: 'multipart/form-data; boundary=x', path });
    }
  }
  if (e.body !== 'json') return out;
  for (const raw of BROKEN_JSON) out.push({ label: `broken ${JSON.stringify(raw.slice(0, 12))}`, raw, path });
  for (const m of oneFieldWrong(base)) out.push({ ...m, path });
  const rest = Math.max(0, perRoute - out.length);
  for (const m of randomlyWrong(base, rest, seed)) out.push({ ...m, path });
  return out;
}

async function main() {
  const total = Number(process.argv[2] ?? 12_000);
  const app = await startProduction();
  const db = await ReadOnlyDb.open(app.databaseFile);
  try {
    const world = await buildWorld(app, db);
    const owner = world.demo.members[0];
    const team = world.demo;
    // A review under no open round (so not frozen): a body the checks let through would reach its rows.
    const draft = await db.first<{ id: number }>(
      `SELECT r.id FROM reviews r WHERE r."teamId" = ?
         AND NOT EXISTS (SELECT 1 FROM review_rounds o WHERE o."reviewId" = r.id AND o.status = 'open')
         AND EXISTS (SELECT 1 FROM appraisals a WHERE a."reviewId" = r.id)
       ORDER BY r.status = 'published', r.id`,
      [team.teamId],
    );
    const mechanism = await db.first<{ id: number }>('SELECT id FROM mechanisms WHERE "reviewId" = ? ORDER BY id', [
      draft!.id,
    ]);
    const appraisal = await db.first<{ id: number }>('SELECT id FROM appraisals WHERE "reviewId" = ? ORDER BY id', [
      draft!.id,
    ]);
    const first = (name: string) => team.params[name][0];
    const roundIds: Ids = { ...Object.fromEntries(Object.keys(team.params).map((k) => [k, first(k)])) };
    const draftIds: Ids = {
      ...roundIds,
      id: draft!.id,
      mechanismId: mechanism?.id ?? 999_999,
      appraisalId: appraisal?.id ?? 999_999,
    };

    // Sign-out would end the session the rest is sent with; it reads no body.
    const writes = endpoints().filter(
      (e) => e.kind === 'api' && e.method !== 'GET' && e.template !== '/api/auth/sign-out',
    );
    const jsonRoutes = writes.filter((e) => e.body === 'json').length;
    const before = await db.snapshot();
    const rows: (string | number)[][] = [];
    const failures: string[] = [];
    const accepted: string[] = [];
    let sent = 0;
    for (const [i, e] of writes.entries()) {
      const ids = /rounds|comments/.test(e.template) ? roundIds : draftIds;
      const requests = requestsFor(e, ids, Math.ceil(total / jsonRoutes), 1000 + i);
      const statuses = new Map<number, number>();
      for (const r of requests) {
        const answer = await owner.caller.send(e.method, r.path, { raw: r.raw, contentType: r.contentType });
        sent++;
        statuses.set(answer.status, (statuses.get(answer.status) ?? 0) + 1);
        const where = `${e.method} ${r.path} ${r.label}${r.contentType ? ` (${r.contentType})` : ''}`;
        if (answer.status >= 500 || answer.status === 0) failures.push(`${where} → ${answer.status || answer.text}`);
        else if (answer.status !== 400 && answer.status !== 415) {
          accepted.push(`${where} → ${answer.status} ${answer.text.slice(0, 120)}`);
        }
      }
      const codes = [...statuses]
        .sort(([a], [b]) => a - b)
        .map(([s, n]) => `${s}×${n}`)
        .join(' ');
      rows.push([e.method, e.template, e.body, requests.length, codes]);
    }
    // Still signed in: had a request ended the session, everything after it would have been a 401.
    const me = await owner.caller.send('GET', '/api/me');
    const changed = changedTables(before, await db.snapshot());
    const summary = [
      `write routes: ${writes.length} (JSON ${jsonRoutes}); malformed requests sent: ${sent}`,
      `5xx or no answer: ${failures.length}`,
      ...failures.slice(0, 50).map((f) => `  ${f}`),
      `answered other than 400/415 (got past validation): ${accepted.length}`,
      ...accepted.slice(0, 50).map((f) => `  ${f}`),
      `rows changed: ${changed.length ? JSON.stringify(changed) : 0}`,
      `owner still signed in at the end: ${me.status === 200 ? 'yes' : `no (${me.status})`}`,
    ].join('\n');
    if (failures.length) console.log(readFileSync(app.logFile, 'utf8').split('\n').slice(-40).join('\n'));
    publish('fuzz', `${summary}\n\n${table(['method', 'route', 'body', 'requests', 'answers'], rows)}`);
    process.exitCode = failures.length || changed.length || me.status !== 200 ? 1 : 0;
  } finally {
    await db.close();
    await app.stop();
  }
}

void main();
