import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startFakeSmtp, type FakeSmtp } from '../../lib/mail/fake-smtp';
import { freePort, startCluster, type Cluster } from './pg-cluster';

/**
 * The deployment of docs/deployment.md on one machine, for the several-processes test and the
 * benchmark: a throwaway PostgreSQL server, the S3 fake (npm `s3rver`), `npm run db:migrate` as
 * its own step, two `npm start` processes and Debian's nginx with the repository's
 * deploy/nginx/loadbearing.conf (only its ports and cache folder changed). Needs a production
 * build in .next.
 */

export interface Stack {
  /** nginx's address: what readers and coaches use. */
  url: string;
  /** The app processes' own addresses (behind nginx). */
  apps: string[];
  /** Their process ids (for the benchmark's CPU figures). */
  appPids: number[];
  databaseUrl: string;
  /** A folder nginx serves as it is under /static/ (for the benchmark's static file). */
  staticDir: string;
  smtp: FakeSmtp;
  stop(): Promise<void>;
}

const ROOT = process.cwd();

function nginxBinary(): string {
  for (const candidate of ['/usr/sbin/nginx', '/usr/bin/nginx']) if (existsSync(candidate)) return candidate;
  throw new Error('nginx is not installed (Debian: apt-get install nginx)');
}

async function waitFor(url: string, child?: ChildProcess, timeoutMs = 90_000): Promise<void> {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    if (child && child.exitCode !== null) throw new Error(`${url}: the process exited with ${child.exitCode}`);
    try {
      const res = await fetch(url, { redirect: 'manual' });
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`Nothing answered at ${url} within ${timeoutMs} ms`);
}

function run(script: string, env: NodeJS.ProcessEnv): void {
  const result = spawnSync(process.execPath, ['--import', 'tsx', path.join(ROOT, script)], {
    cwd: ROOT,
    env,
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(`${script} failed:\n${result.stdout}\n${result.stderr}`);
}

/** The repository's nginx site with this run's ports and folders. */
export function nginxConfig(work: string, port: number, appPorts: number[]): string {
  let site = readFileSync(path.join(ROOT, 'deploy/nginx/loadbearing.conf'), 'utf8');
  site = site.replace(
    /(upstream loadbearing_app \{\n)(?:\s*server [^\n]+\n)+/,
    (_, head: string) => head + appPorts.map((p) => `    server 127.0.0.1:${p};\n`).join(''),
  );
  site = site.replace(/listen 80;/, `listen 127.0.0.1:${port};`);
  site = site.replace('/var/cache/nginx/loadbearing', path.join(work, 'cache'));
  site = site.replace(/(server_name _;\n)/, `$1\n    location /static/ { alias ${path.join(work, 'static')}/; }\n`);
  const temp = (name: string) => `${name}_temp_path ${path.join(work, `${name}-temp`)};`;
  return `${process.getuid?.() === 0 ? 'user root;\n' : ''}worker_processes 2;
pid ${path.join(work, 'nginx.pid')};
error_log ${path.join(work, 'error.log')} warn;
daemon off;
events { worker_connections 4096; }
http {
  include /etc/nginx/mime.types;
  access_log off;
  ${temp('client_body')} ${temp('proxy')} ${temp('fastcgi')} ${temp('uwsgi')} ${temp('scgi')}
${site}
}
`;
}

export async function startStack(options: { apps?: number } = {}): Promise<Stack> {
  if (!existsSync(path.join(ROOT, '.next', 'BUILD_ID'))) {
    const build = spawnSync(process.execPath, [path.join(ROOT, 'node_modules/next/dist/bin/next'), 'build'], {
      cwd: ROOT,
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' },
    });
    if (build.status !== 0) throw new Error('next build failed');
  }
  const work = mkdtempSync(path.join(tmpdir(), 'loadbearing-stack-'));
  for (const dir of ['cache', 'static', 's3']) mkdirSync(path.join(work, dir));
  const children: ChildProcess[] = [];
  let cluster: Cluster | undefined;
  let s3: { close(): Promise<void> } | undefined;
  const smtp = await startFakeSmtp({ dropDir: path.join(work, 'mail') });

  const stop = async () => {
    for (const child of children) child.kill('SIGTERM');
    await Promise.all(
      children.map((c) => (c.exitCode === null ? new Promise((r) => c.once('exit', r)) : Promise.resolve())),
    );
    await s3?.close();
    await smtp.close();
    cluster?.stop();
    rmSync(work, { recursive: true, force: true });
  };

  try {
    cluster = await startCluster();
    const admin = spawnSync(path.join(cluster.bin, 'psql'), [cluster.url, '-qc', 'CREATE DATABASE loadbearing'], {
      encoding: 'utf8',
    });
    if (admin.status !== 0) throw new Error(admin.stderr);
    const databaseUrl = cluster.url.replace(/\/postgres$/, '/loadbearing');

    // The object store's fake, with the bucket the app is told about.
    const { default: S3rver } = await import('s3rver');
    const s3Port = await freePort();
    const s3rver = new S3rver({
      port: s3Port,
      address: '127.0.0.1',
      silent: true,
      directory: path.join(work, 's3'),
      configureBuckets: [{ name: 'loadbearing-files', configs: [] }],
    });
    await s3rver.run();
    s3 = s3rver;

    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'stack-secret-that-is-long-enough-for-iron-session-0',
      COOKIE_SECURE: 'false',
      APP_URL: url,
      TRUSTED_PROXIES: '127.0.0.1',
      SMTP_PORT: String(smtp.port),
      MAIL_DROP_DIR: path.join(work, 'mail'),
      S3_BUCKET: 'loadbearing-files',
      S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
      S3_FORCE_PATH_STYLE: 'true',
    };
    // Deployment order: migrations as their own step, then the processes (which never migrate on PostgreSQL).
    run('scripts/migrate.ts', env);
    run('scripts/seed.ts', { ...env, NODE_ENV: 'development' });

    const appPorts: number[] = [];
    for (let i = 0; i < (options.apps ?? 2); i++) {
      const appPort = await freePort();
      appPorts.push(appPort);
      const child = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'scripts/start.ts')], {
        cwd: ROOT,
        env: { ...env, PORT: String(appPort), HOST: '127.0.0.1' },
        stdio: ['ignore', 'ignore', 'inherit'],
      });
      children.push(child);
      await waitFor(`http://127.0.0.1:${appPort}/sign-in`, child);
    }

    writeFileSync(path.join(work, 'nginx.conf'), nginxConfig(work, port, appPorts));
    const nginx = spawn(nginxBinary(), ['-c', path.join(work, 'nginx.conf'), '-p', work], {
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    children.push(nginx);
    await waitFor(`${url}/sign-in`, nginx);
    return {
      url,
      apps: appPorts.map((p) => `http://127.0.0.1:${p}`),
      appPids: children.filter((c) => c !== nginx).map((c) => c.pid!),
      databaseUrl,
      staticDir: path.join(work, 'static'),
      smtp,
      stop,
    };
  } catch (error) {
    await stop();
    throw error;
  }
}
