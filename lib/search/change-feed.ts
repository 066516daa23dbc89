import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { databaseDialect, db } from '@/lib/db';

/**
 * Tells every other app process that a review or a study changed, so each keeps its own search
 * indexes current (docs/deployment.md, "Several processes"). PostgreSQL only: NOTIFY on one
 * channel, and one LISTEN connection per process. On SQLite there is one process and nothing
 * to tell.
 *
 * A notification is delivered only to sessions listening when it is sent, so a process starts
 * listening before it builds an index; and when its listening connection drops (the database
 * restarted, the network blinked), it cannot know what it missed: it forgets its indexes
 * (`onLost`) and the next search rebuilds them from the rows.
 */

export const CHANNEL = 'loadbearing_search';

export interface Change {
  /** A review (with its mechanisms), a library study, or any publication (the verdict search; id 0). */
  kind: 'review' | 'study' | 'verdict';
  id: number;
}

type Apply = (id: number) => Promise<void>;

interface Feed {
  origin: string;
  client: pg.Client | null;
  ready: Promise<void> | null;
  /** Per kind of change, how each index of this process applies it; and how each forgets itself. */
  apply: Map<Change['kind'], Apply>;
  forget: Map<Change['kind'], () => void>;
}

const store = globalThis as unknown as { loadbearingSearchFeed?: Feed };

export const changeFeedActive = () => databaseDialect() === 'postgres';

/** Announces a change to the other processes (the caller has already updated its own indexes). */
export async function publishChange(change: Change): Promise<void> {
  if (!changeFeedActive()) return;
  const origin = feed().origin;
  await db().query('SELECT pg_notify(?, ?)', { replacements: [CHANNEL, JSON.stringify({ ...change, origin })] });
}

function feed(): Feed {
  return (store.loadbearingSearchFeed ??= {
    origin: randomUUID(),
    client: null,
    ready: null,
    apply: new Map(),
    forget: new Map(),
  });
}

/**
 * Starts listening once per process (later calls wait for the same start); resolves when the
 * LISTEN is in place. `apply` runs for every other process's change of that kind, `forget` when
 * the connection dropped and changes may have been missed.
 */
export function listenForChanges(kinds: Change['kind'][], apply: Apply, forget: () => void): Promise<void> {
  if (!changeFeedActive()) return Promise.resolve();
  const f = feed();
  for (const kind of kinds) {
    f.apply.set(kind, apply);
    f.forget.set(kind, forget);
  }
  return (f.ready ??= connect(f));
}

function forgetAll(f: Feed) {
  for (const forget of new Set(f.forget.values())) forget();
}

async function connect(f: Feed): Promise<void> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  const lost = () => {
    if (f.client !== client) return;
    f.client = null;
    f.ready = null;
    forgetAll(f);
    client.end().catch(() => {});
  };
  client.on('error', lost);
  client.on('end', lost);
  client.on('notification', (message) => {
    if (message.channel !== CHANNEL || !message.payload) return;
    const change = JSON.parse(message.payload) as Change & { origin: string };
    if (change.origin === f.origin) return;
    const apply = f.apply.get(change.kind);
    apply?.(change.id).catch((error) => {
      // The index may now be behind: forget it, the next search rebuilds it.
      console.warn('search: could not apply a change from another process:', error);
      f.forget.get(change.kind)?.();
    });
  });
  try {
    await client.connect();
    await client.query(`LISTEN ${CHANNEL}`);
  } catch (error) {
    f.ready = null;
    await client.end().catch(() => {});
    throw error;
  }
  f.client = client;
}

/** For tests: stop listening (the next search starts again). */
export async function stopListening(): Promise<void> {
  const f = store.loadbearingSearchFeed;
  if (!f?.client) return;
  const client = f.client;
  f.client = null;
  f.ready = null;
  await client.end();
}
