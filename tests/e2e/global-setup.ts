import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { startFakeSmtp, type FakeSmtp } from '../../lib/mail/fake-smtp';
import { startFakeCrossrefServer, type FakeCrossrefServer } from '../../lib/citations/fake-crossref-server';

declare module 'vitest' {
  export interface ProvidedContext {
    baseURL: string;
    mailDir: string;
    databaseFile: string;
    /** The registry fake of the evidence watch (POST <url>/__control to change what it answers). */
    crossrefURL: string;
  }
}

let server: ChildProcess | undefined;
let smtp: FakeSmtp | undefined;
let crossref: FakeCrossrefServer | undefined;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

async function waitUntilUp(url: string, child: ChildProcess, timeoutMs = 60_000): Promise<void> {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}`);
    try {
      const res = await fetch(url, { redirect: 'manual' });
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The app did not answer at ${url} within ${timeoutMs} ms`);
}

/**
 * Builds the app for production (unless E2E_REUSE_BUILD=1 and a build exists), prepares a fresh
 * seeded database and a mail fake, and serves the build with `npm start`'s server on a free port.
 */
export default async function setup(project: TestProject) {
  const root = process.cwd();
  const work = mkdtempSync(path.join(tmpdir(), 'loadbearing-e2e-'));
  const databaseFile = path.join(work, 'e2e.sqlite');
  const mailDir = path.join(work, 'mail');
  process.env.DATABASE_URL = databaseFile;

  const { db } = await import('../../lib/db');
  const { migrate, seed } = await import('../../db/migrate');
  await migrate(db());
  await seed(db());
  await db().close();

  smtp = await startFakeSmtp({ dropDir: mailDir });
  crossref = await startFakeCrossrefServer();

  const env = { ...process.env, NODE_ENV: 'production' as const, NEXT_TELEMETRY_DISABLED: '1' };
  if (!(process.env.E2E_REUSE_BUILD === '1' && existsSync(path.join(root, '.next', 'BUILD_ID')))) {
    console.log('Building the app for the browser tests (next build)…');
    const build = spawnSync(process.execPath, [path.join(root, 'node_modules/next/dist/bin/next'), 'build'], {
      cwd: root,
      env,
      stdio: 'inherit',
    });
    if (build.status !== 0) throw new Error('next build failed');
  }

  const port = await freePort();
  const baseURL = `http://127.0.0.1:${port}`;
  // The production server of `npm start` (`next start` after migrating the SQLite file).
  server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'scripts/start.ts')], {
    cwd: root,
    env: {
      ...env,
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: databaseFile,
      SESSION_SECRET: 'e2e-secret-that-is-long-enough-for-iron-session-0000',
      COOKIE_SECURE: 'false',
      APP_URL: baseURL,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtp.port),
      MAIL_DROP_DIR: mailDir,
      STORAGE_DIR: path.join(work, 'uploads'),
      // The browser contexts each send their own x-forwarded-for (a proxy's word, trusted from loopback).
      TRUSTED_PROXIES: '127.0.0.1,::1',
      CROSSREF_BASE_URL: crossref.url,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  await waitUntilUp(`${baseURL}/`, server);

  project.provide('baseURL', baseURL);
  project.provide('mailDir', mailDir);
  project.provide('databaseFile', databaseFile);
  project.provide('crossrefURL', crossref.url);

  return async () => {
    // Stopped by its own PID: the server, not a wrapper around it.
    server?.kill('SIGTERM');
    await smtp?.close();
    await crossref?.close();
  };
}
