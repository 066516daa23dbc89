import { AppError } from '@/lib/api/errors';

/** Sign-in throttling: 5 failures within 15 minutes per e-mail or per address. */
export const MAX_FAILURES = 5;
export const WINDOW_MS = 15 * 60 * 1000;

// In memory: the app runs as one Node process on one SQLite file. A restart forgets failures,
// which only ever lets a person in sooner.
const failures = new Map<string, number[]>();

function recent(key: string, now: number): number[] {
  const kept = (failures.get(key) ?? []).filter((t) => now - t < WINDOW_MS);
  if (kept.length) failures.set(key, kept);
  else failures.delete(key);
  return kept;
}

function keys(email: string, address: string): string[] {
  return [`email:${email.trim().toLowerCase()}`, `addr:${address}`];
}

/** Throws 429 with Retry-After when either key has had too many recent failures. */
export function assertNotLimited(email: string, address: string, now = Date.now()): void {
  for (const key of keys(email, address)) {
    const times = recent(key, now);
    if (times.length >= MAX_FAILURES) {
      const retryAfterSeconds = Math.ceil((times[0] + WINDOW_MS - now) / 1000);
      throw new AppError(
        'rate_limited',
        `Too many failed sign-ins. Try again in ${Math.ceil(retryAfterSeconds / 60)} minutes or reset your password.`,
        { retryAfterSeconds },
      );
    }
  }
}

export function recordFailure(email: string, address: string, now = Date.now()): void {
  for (const key of keys(email, address)) failures.set(key, [...recent(key, now), now]);
}

export function clearFailures(email: string): void {
  failures.delete(keys(email, '')[0]);
}

export function resetRateLimits(): void {
  failures.clear();
}
