import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

// Runs before each test file's imports: every file gets its own fresh SQLite database, so files
// can run in parallel and no test sees another's rows. Models bind to DATABASE_URL at import.
const dir = mkdtempSync(path.join(tmpdir(), 'loadbearing-test-'));
process.env.DATABASE_URL = path.join(dir, 'test.sqlite');
process.env.SESSION_SECRET = 'test-secret-that-is-long-enough-for-iron-session-000';
process.env.APP_URL = 'http://app.test';
process.env.MAIL_DROP_DIR = path.join(dir, 'mail');
