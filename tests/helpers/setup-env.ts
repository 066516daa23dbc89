import { randomBytes } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';

// Runs before each test file's imports: every file gets its own fresh database, so files can run
// in parallel and no test sees another's rows. Models bind to DATABASE_URL at import.
// SQLite (the default): a new file. PostgreSQL (`npm run test:pg` sets TEST_POSTGRES_URL to a
// server's maintenance database): a new database on that server, created here.
const dir = mkdtempSync(path.join(tmpdir(), 'loadbearing-test-'));
process.env.DATABASE_URL = path.join(dir, 'test.sqlite');
process.env.SESSION_SECRET = 'test-secret-that-is-long-enough-for-iron-session-000';
process.env.APP_URL = 'http://app.test';
process.env.MAIL_DROP_DIR = path.join(dir, 'mail');

const server = process.env.TEST_POSTGRES_URL;
if (server) {
  const name = `loadbearing_test_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: server });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name}`);
  await admin.end();
  const url = new URL(server);
  url.pathname = `/${name}`;
  process.env.DATABASE_URL = url.toString();
}
