import { spawnSync } from 'node:child_process';
import { startCluster } from '../tests/helpers/pg-cluster';

/**
 * `npm run test:pg`: the integration suite on PostgreSQL. Uses the server in TEST_POSTGRES_URL
 * (a maintenance database URL, e.g. postgres://postgres@127.0.0.1:5432/postgres) or starts a
 * throwaway one (tests/helpers/pg-cluster.ts); each test file gets its own database
 * (tests/helpers/setup-env.ts). Extra arguments go to vitest (default: tests/integration).
 */
async function main() {
  const cluster = process.env.TEST_POSTGRES_URL ? null : await startCluster();
  const url = process.env.TEST_POSTGRES_URL ?? cluster!.url;
  const args = process.argv.slice(2);
  console.log(`Integration tests on PostgreSQL (${url})`);
  // Longer limits than on SQLite: every file creates its database and talks to it over TCP, and
  // the seeded files write the whole demo that way (timeouts only, never a timed assertion).
  const limits = ['--testTimeout=60000', '--hookTimeout=120000'];
  const result = spawnSync('npx', ['vitest', 'run', ...limits, ...(args.length ? args : ['tests/integration'])], {
    stdio: 'inherit',
    env: { ...process.env, TEST_POSTGRES_URL: url },
  });
  cluster?.stop();
  process.exit(result.status ?? 1);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
