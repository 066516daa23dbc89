import { createHash } from 'node:crypto';
import sqlite3 from 'sqlite3';

/**
 * A read-only look at the server's SQLite file beside the running server (WAL lets it read while
 * the server writes): the probes take real row ids from it and compare every table before and
 * after. Raw SQL names tables, never models (docs/architecture.md).
 */
export class ReadOnlyDb {
  private constructor(private readonly handle: sqlite3.Database) {}

  static open(file: string): Promise<ReadOnlyDb> {
    return new Promise((resolve, reject) => {
      const handle = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (error) =>
        error ? reject(error) : resolve(new ReadOnlyDb(handle)),
      );
    });
  }

  all<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
    return new Promise((resolve, reject) =>
      this.handle.all(sql, params, (error, rows) => (error ? reject(error) : resolve(rows as T[]))),
    );
  }

  async first<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T | undefined> {
    return (await this.all<T>(sql, params))[0];
  }

  /** Row count and a SHA-256 of every row, per table. */
  async snapshot(): Promise<Map<string, { rows: number; sum: string }>> {
    const tables = await this.all<{ name: string }>(
      "SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name",
    );
    const out = new Map<string, { rows: number; sum: string }>();
    for (const { name } of tables) {
      const rows = await this.all(`SELECT * FROM "${name}" ORDER BY rowid`);
      const hash = createHash('sha256');
      for (const row of rows) hash.update(JSON.stringify(row) + '\n');
      out.set(name, { rows: rows.length, sum: hash.digest('hex').slice(0, 16) });
    }
    return out;
  }

  close(): Promise<void> {
    return new Promise((resolve) => this.handle.close(() => resolve()));
  }
}

/** The tables whose rows or checksum differ between two snapshots, with the row counts. */
export function changedTables(
  before: Map<string, { rows: number; sum: string }>,
  after: Map<string, { rows: number; sum: string }>,
): { table: string; before: number; after: number }[] {
  const names = new Set([...before.keys(), ...after.keys()]);
  return [...names]
    .filter((t) => before.get(t)?.sum !== after.get(t)?.sum)
    .map((t) => ({ table: t, before: before.get(t)?.rows ?? 0, after: after.get(t)?.rows ?? 0 }));
}
