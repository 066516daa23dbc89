/**
 * Benchmark (not a test): what one autosave costs, in figures that do not depend on how loaded
 * the machine is — the queries a save sends (in and outside its write transaction), the CPU
 * milliseconds of the process per save, and how long the write transaction is held. Calls the
 * route handler of PATCH /api/reviews/:id in this process, as the integration tests do, on a
 * fresh seeded database: SQLite by default, or PostgreSQL when given a server's maintenance URL.
 *
 *   npx tsx bench/save-profile.ts [saves] [postgres://…/postgres]
 *
 * With SAVE_CPU_PROFILE=file.cpuprofile it also writes a CPU profile of the measured saves alone.
 */
import { randomBytes } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { Session } from 'node:inspector/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';

const SAVES = Number(process.argv[2] ?? 200);
const server = process.argv[3];
const work = mkdtempSync(path.join(tmpdir(), 'loadbearing-bench-save-profile-'));
process.env.DATABASE_URL = path.join(work, 'bench.sqlite');
process.env.SESSION_SECRET = 'bench-secret-that-is-long-enough-for-iron-session-0';
process.env.APP_URL = 'http://app.test';
process.env.MAIL_DROP_DIR = path.join(work, 'mail');
process.env.SMTP_PORT = '1';

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function main() {
  if (server) {
    const name = `loadbearing_bench_${randomBytes(4).toString('hex')}`;
    const admin = new pg.Client({ connectionString: server });
    await admin.connect();
    await admin.query(`CREATE DATABASE ${name}`);
    await admin.end();
    const url = new URL(server);
    url.pathname = `/${name}`;
    process.env.DATABASE_URL = url.toString();
  }
  const { db } = await import('../lib/db');
  const { migrate, seed } = await import('../db/migrate');
  await migrate(db());
  await seed(db());
  const signIn = (await import('../app/api/auth/sign-in/route')).POST as unknown as Handler;
  const reviews = (await import('../app/api/reviews/route')).POST as unknown as Handler;
  const one = (await import('../app/api/reviews/[id]/route')).PATCH as unknown as Handler;
  const { searchTeams } = await import('../lib/search/index-store');
  const { newReview } = await import('../tests/helpers/review-input');

  let cookie = '';
  const call = async (handler: Handler, method: string, json: unknown, params: Record<string, string> = {}) => {
    const headers = new Headers({ 'content-type': 'application/json', 'x-forwarded-for': '10.0.0.9' });
    if (cookie) headers.set('cookie', cookie);
    const res = await handler(new Request('http://app.test/api/x', { method, headers, body: JSON.stringify(json) }), {
      params: Promise.resolve(params),
    });
    const set = res.headers.getSetCookie()[0];
    if (set) cookie = set.split(';')[0];
    return { status: res.status, body: await res.json() };
  };
  const signedIn = await call(signIn, 'POST', { email: 'coach@granite-hollow.test', password: 'loadbearing-demo' });
  if (signedIn.status !== 200) throw new Error(`sign-in ${signedIn.status}`);
  const teamId = (await db().query('SELECT id FROM teams ORDER BY id LIMIT 1', { plain: true })) as { id: number };
  const created = await call(reviews, 'POST', newReview(teamId.id));
  if (created.status !== 201) throw new Error(`create ${created.status} ${JSON.stringify(created.body)}`);
  let version = created.body.review.version as number;
  const reviewId = String(created.body.review.id);
  // The team's search index is built, as on a server where someone searched: saves keep it current.
  await searchTeams([teamId.id], 'hang');

  // Counts every statement the save sends, and how long each write transaction is held.
  const sequelize = db() as unknown as {
    query: (sql: unknown, options?: { transaction?: unknown }) => Promise<unknown>;
    transaction: (...args: unknown[]) => Promise<unknown>;
  };
  const query = sequelize.query.bind(sequelize);
  const transaction = sequelize.transaction.bind(sequelize);
  let inside = 0;
  let outside = 0;
  let heldMs = 0;
  let transactions = 0;
  const statements = new Map<string, number>();
  sequelize.query = (sql, options) => {
    const text = typeof sql === 'string' ? sql : ((sql as { query?: string })?.query ?? '');
    const key = text.replace(/\s+/g, ' ').slice(0, 70);
    statements.set(key, (statements.get(key) ?? 0) + 1);
    if (options?.transaction) inside++;
    else outside++;
    return query(sql, options);
  };
  sequelize.transaction = async (...args: unknown[]) => {
    const fn = args.find((a) => typeof a === 'function') as ((t: unknown) => Promise<unknown>) | undefined;
    if (!fn) return transaction(...args);
    const rest = args.filter((a) => typeof a !== 'function');
    return transaction(...rest, async (t: unknown) => {
      const started = performance.now();
      try {
        return await fn(t);
      } finally {
        heldMs += performance.now() - started;
        transactions++;
      }
    });
  };

  const save = async (n: number) => {
    const res = await call(one, 'PATCH', { version, claimSource: `Autosave ${n}` }, { id: reviewId });
    if (res.status !== 200) throw new Error(`save ${res.status} ${JSON.stringify(res.body)}`);
    version = res.body.review.version;
  };
  for (let i = 0; i < 20; i++) await save(-i); // warm up
  inside = outside = heldMs = transactions = 0;
  statements.clear();
  const profileFile = process.env.SAVE_CPU_PROFILE;
  const inspector = profileFile ? new Session() : null;
  if (inspector) {
    inspector.connect();
    await inspector.post('Profiler.enable');
    await inspector.post('Profiler.start');
  }
  const cpu = process.cpuUsage();
  const started = performance.now();
  for (let i = 0; i < SAVES; i++) await save(i);
  const wall = performance.now() - started;
  const used = process.cpuUsage(cpu);
  if (inspector) {
    const { profile } = await inspector.post('Profiler.stop');
    writeFileSync(profileFile!, JSON.stringify(profile));
  }
  const per = (x: number) => (x / SAVES).toFixed(2);
  console.log(`${db().getDialect()}: ${SAVES} sequential saves (PATCH /api/reviews/:id, claimSource only)`);
  console.log(
    `  queries per save: ${per(inside + outside)} (${per(inside)} inside the write transaction, ${per(outside)} outside)`,
  );
  console.log(`  write transactions per save: ${per(transactions)}; held ${per(heldMs)} ms per save`);
  console.log(`  CPU per save: ${per((used.user + used.system) / 1000)} ms; wall per save ${per(wall)} ms`);
  console.log('  statements:');
  for (const [text, count] of [...statements].sort((a, b) => b[1] - a[1])) console.log(`    ${per(count)} × ${text}`);
  await db().close();
  process.exit(0);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
