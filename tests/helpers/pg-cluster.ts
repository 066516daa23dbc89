import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

/**
 * A throwaway PostgreSQL server for tests and benchmarks: initdb into a temporary folder, start
 * it on a free port (loopback and a socket in that folder), and remove it all on stop. Uses
 * Debian's binaries (/usr/lib/postgresql/<version>/bin, package `postgresql`); PostgreSQL refuses
 * to run as root, so as root the server runs as the `postgres` user the package creates.
 */

export interface Cluster {
  /** The maintenance database's URL (user postgres, no password: trust on loopback only). */
  url: string;
  port: number;
  bin: string;
  stop(): void;
}

export function postgresBin(): string | null {
  const root = '/usr/lib/postgresql';
  if (!existsSync(root)) return null;
  const versions = readdirSync(root)
    .filter((v) => existsSync(path.join(root, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(root, versions[0], 'bin') : null;
}

export function freePort(): Promise<number> {
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

export async function startCluster(): Promise<Cluster> {
  const bin = postgresBin();
  if (!bin) throw new Error('PostgreSQL is not installed (Debian: apt-get install postgresql)');
  const dir = mkdtempSync(path.join(tmpdir(), 'loadbearing-pg-'));
  const data = path.join(dir, 'data');
  const asRoot = process.getuid?.() === 0;
  const run = (program: string, args: string[]) => {
    const command = path.join(bin, program);
    const result = asRoot
      ? spawnSync('runuser', ['-u', 'postgres', '--', command, ...args], { encoding: 'utf8' })
      : spawnSync(command, args, { encoding: 'utf8' });
    if (result.status !== 0) throw new Error(`${program} failed: ${result.stderr || result.stdout}`);
  };
  if (asRoot) {
    const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
    const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
    chownSync(dir, uid, gid);
    chmodSync(dir, 0o700);
  }
  run('initdb', ['-D', data, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--no-instructions']);
  const port = await freePort();
  // Durability off: a throwaway database for tests, never a real one.
  const options = `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=300`;
  run('pg_ctl', ['-D', data, '-o', options, '-l', path.join(dir, 'server.log'), '-w', 'start']);
  return {
    url: `postgres://postgres@127.0.0.1:${port}/postgres`,
    port,
    bin,
    stop() {
      try {
        run('pg_ctl', ['-D', data, '-m', 'fast', '-w', 'stop']);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}
