import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Sequelize } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { backupSqlite } from '@/lib/backup/backup';
import { databaseFile, db, isPostgres } from '@/lib/db';
import { useTestApp } from '../../helpers/app';

useTestApp();

/** One acknowledged write: an audit event, the table every change of the app appends to. */
async function write(n: number): Promise<number> {
  await db()
    .getQueryInterface()
    .bulkInsert('audit_events', [{ action: 'backup.probe', subjectId: n, createdAt: new Date() }]);
  return n;
}

// SQLite's online backup (VACUUM INTO); on PostgreSQL the backup is pg_dump's (docs/deployment.md).
describe.skipIf(isPostgres())('npm run db:backup on SQLite', () => {
  it('copies, while writes go on, every row acknowledged before the backup began', async () => {
    const acknowledged: number[] = [];
    let next = 0;
    let writing = true;
    // Writers that keep going through the whole backup, each write awaited (acknowledged) before the next.
    const writers = Array.from({ length: 4 }, async () => {
      while (writing) acknowledged.push(await write(next++));
    });
    while (acknowledged.length < 200) await new Promise((r) => setTimeout(r, 5));

    const before = [...acknowledged];
    const target = path.join(mkdtempSync(path.join(tmpdir(), 'loadbearing-backup-')), 'copy.sqlite');
    await backupSqlite(databaseFile(), target);
    const duringOrAfter = acknowledged.length;
    writing = false;
    await Promise.all(writers);
    // The backup was taken under load: writes were acknowledged while it ran.
    expect(duringOrAfter).toBeGreaterThan(before.length);

    // Restore: open the copy as the app's database would be opened, and look for every row.
    const restored = new Sequelize({ dialect: 'sqlite', storage: target, logging: false });
    const [rows] = (await restored.query(
      "SELECT subjectId FROM audit_events WHERE action = 'backup.probe'",
    )) as [{ subjectId: number }[], unknown];
    const present = new Set(rows.map((r) => r.subjectId));
    expect(before.filter((n) => !present.has(n))).toEqual([]);
    // And the copy is a whole, migrated database: its integrity check passes.
    const [[check]] = (await restored.query('PRAGMA integrity_check')) as [{ integrity_check: string }[], unknown];
    expect(check.integrity_check).toBe('ok');
    await restored.close();
  });
});
