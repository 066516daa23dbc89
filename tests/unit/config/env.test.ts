import { afterEach, describe, expect, it } from 'vitest';
import { env } from '@/lib/env';

const saved = { ...process.env };
afterEach(() => {
  process.env = { ...saved };
});

describe('env()', () => {
  it('sees a variable changed after an earlier read, and reuses the parse while nothing changed', () => {
    process.env.PG_POOL_MAX = '7';
    const first = env();
    expect(first.PG_POOL_MAX).toBe(7);
    expect(env()).toBe(first);
    process.env.PG_POOL_MAX = '12';
    expect(env().PG_POOL_MAX).toBe(12);
    delete process.env.PG_POOL_MAX;
    expect(env().PG_POOL_MAX).toBe(10);
  });

  it('refuses an invalid value on every read, not only the first', () => {
    process.env.SMTP_PORT = 'not-a-port';
    expect(() => env()).toThrow(/SMTP_PORT/);
    expect(() => env()).toThrow(/SMTP_PORT/);
  });
});
