import sqlite3 from 'sqlite3';
import { inject } from 'vitest';

/** Stands in for a closed peer-review round: the review becomes "approved" so it may be published. */
export function markApproved(reviewId: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const database = new sqlite3.Database(inject('databaseFile'));
    database.configure('busyTimeout', 5000);
    database.run("UPDATE reviews SET status = 'approved' WHERE id = ?", [reviewId], (err) => {
      database.close();
      if (err) reject(err);
      else resolve();
    });
  });
}
