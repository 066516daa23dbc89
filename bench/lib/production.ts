import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createWriteStream, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startFakeDoiServer } from '../../lib/citations/fake-doi-server';
import { startFakeCrossrefServer } from '../../lib/citations/fake-crossref-server';
import { startFakeSmtp, type FakeSmtp } from '../../lib/mail/fake-smtp';
import { freePort } from '../../tests/helpers/pg-cluster';

/**
 * The production build served by `npm start`'s server (scripts/start.ts) on a free port, over a
 * throwaway SQLite file with the demo seed, with the mail, DOI and Crossref fakes — the setup of
 * tests/e2e/global-setup.ts, outside vitest, for the probes and the single-process benchmarks.
 * Builds first when .next has no build (PROBE_REBUILD=1 forces one); PROBE_KEEP=1 keeps the
 * work folder (database, mail, server log); PROBE_CPU_PROFILE=folder has the server write a CPU
 * profile (node --cpu-prof) there when it stops.
 */
export interface Production {
  url: string;
  databaseFile: string;
  /** The first demo review, the one the workbench benchmarks open. */
  firstReviewId: number;
  /** The server's process, for the CPU it spends. */
  pid: number;
  smtp: FakeSmtp;
  /** The server's stderr, where it logs what became a 500. */
  logFile: string;
  stop(): Promise<void>;
}

const ROOT = process.cwd();

export interface ProductionOptions {
  /** Names the work folder under the system's temporary folder. */
  name?: string;
  /** Set on the server on top of (or instead of) the ones below. */
  env?: Record<string, string>;
}

export async function startProduction(options: ProductionOptions = {}): Promise<Production> {
  if (process.env.PROBE_REBUILD === '1' || !existsSync(path.join(ROOT, '.next', 'BUILD_ID'))) {
    console.log('Building the app (next build)…');
    const build = spawnSync(process.execPath, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'build'], {
      cwd: ROOT,
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' },
    });
    if (build.status !== 0) throw new Error('next build failed');
  }
  const work = mkdtempSync(path.join(tmpdir(), `loadbearing-${options.name ?? 'probe'}-`));
  const databaseFile = path.join(work, 'probe.sqlite');
  process.env.DATABASE_URL = databaseFile;
  process.env.ALLOW_DEMO_SEED = '1';
  const { db } = await import('../../lib/db');
  const { migrate, seed } = await import('../../db/migrate');
  await migrate(db());
  await seed(db());
  const [rows] = await db().query('SELECT id FROM reviews ORDER BY id LIMIT 1');
  const firstReviewId = (rows as { id: number }[])[0]?.id ?? 1;
  await db().close();

  const smtp = await startFakeSmtp({ dropDir: path.join(work, 'mail') });
  const doi = await startFakeDoiServer({ port: await freePort() });
  const crossref = await startFakeCrossrefServer({ port: await freePort() });
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const logFile = path.join(work, 'server.log');
  const log = createWriteStream(logFile);
  // PROBE_CPU_PROFILE=folder: the server writes a CPU profile there when it stops.
  const profile = process.env.PROBE_CPU_PROFILE
    ? ['--cpu-prof', `--cpu-prof-dir=${process.env.PROBE_CPU_PROFILE}`]
    : [];
  const server: ChildProcess = spawn(
    process.execPath,
    [...profile, '--import', 'tsx', path.join(ROOT, 'scripts/start.ts')],
    {
      cwd: ROOT,
      env: {
        ...process.env,
        NODE_ENV: 'production',
        NEXT_TELEMETRY_DISABLED: '1',
        PORT: String(port),
        HOST: '127.0.0.1',
        DATABASE_URL: databaseFile,
        SESSION_SECRET: 'probe-secret-that-is-long-enough-for-iron-session-000',
        COOKIE_SECURE: 'false',
        APP_URL: url,
        SMTP_HOST: '127.0.0.1',
        SMTP_PORT: String(smtp.port),
        MAIL_DROP_DIR: path.join(work, 'mail'),
        STORAGE_DIR: path.join(work, 'uploads'),
        DOI_BASE_URL: doi.url,
        CROSSREF_BASE_URL: crossref.url,
        // Each actor sends its own x-forwarded-for, so the sign-in throttle counts them apart.
        TRUSTED_PROXIES: '127.0.0.1,::1',
        ...options.env,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  server.stdout?.pipe(log);
  server.stderr?.pipe(log);

  const stop = async () => {
    // Stopped by its own PID: the server, not a wrapper around it.
    if (server.exitCode === null) {
      server.kill('SIGTERM');
      await new Promise((r) => server.once('exit', r));
    }
    await Promise.all([smtp.close(), doi.close(), crossref.close()]);
    if (process.env.PROBE_KEEP !== '1') rmSync(work, { recursive: true, force: true });
  };
  const started = Date.now();
  for (;;) {
    if (server.exitCode !== null) {
      await stop();
      throw new Error(`the server exited with ${server.exitCode}`);
    }
    try {
      if ((await fetch(`${url}/sign-in`, { redirect: 'manual' })).status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() - started > 120_000) {
      await stop();
      throw new Error(`nothing answered at ${url}`);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return { url, databaseFile, firstReviewId, pid: server.pid!, smtp, logFile, stop };
}

/** A request as a signed-in person: method, path and an optional JSON body. */
export type SignedInCall = (method: string, path: string, body?: unknown) => Promise<Response>;

/** Signs in as one of the demo seed's people (all share the demo password): their cookie, and calls as them. */
export async function signInDemo(
  base: string,
  email = 'owner@granite-hollow.test',
): Promise<{ cookie: string; call: SignedInCall }> {
  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: 'loadbearing-demo' }),
  });
  if (signIn.status !== 200) throw new Error(`sign-in as ${email}: ${signIn.status}`);
  const cookie = signIn.headers.getSetCookie()[0].split(';')[0];
  const call: SignedInCall = (method, path, body) =>
    fetch(`${base}${path}`, {
      method,
      headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  return { cookie, call };
}
