import { Op } from 'sequelize';
import { AppError } from '@/lib/api/errors';
import { writeTransaction } from '@/lib/reviews/transaction';
import { SignInThrottle } from '@/models';

/**
 * Sign-in throttling, kept in the database (table `sign_in_throttles`) so that every server
 * process counts the same tries. The choice, documented in DEVELOPERS.md:
 * - per client address: at most MAX_FAILURES failed tries within WINDOW_MS, then 429 until the
 *   window has passed (the address is the socket's, or a trusted proxy's, lib/auth/client-address.ts);
 * - per account: no lock. After MAX_FAILURES failures, each next try waits a delay that doubles
 *   (FIRST_DELAY_MS, 2×, 4× … at most MAX_DELAY_MS) after the last failure. A stranger guessing
 *   therefore gets about one try per MAX_DELAY_MS, and the real owner typing the right password
 *   waits at most that long, never a whole lock period; a password reset clears the account's count.
 * Common practice (the OWASP Authentication Cheat Sheet's "account lockout" and "exponential
 * back-off" advice), not a published figure.
 *
 * A try is taken before the password is checked, in one write transaction (serialised across
 * processes by SQLite's BEGIN IMMEDIATE): two processes cannot both grant the fifth try.
 */
export const MAX_FAILURES = 5;
export const WINDOW_MS = 15 * 60 * 1000;
export const FIRST_DELAY_MS = 30 * 1000;
export const MAX_DELAY_MS = 5 * 60 * 1000;

const emailKey = (email: string) => `email:${email.trim().toLowerCase()}`;
const addressKey = (address: string) => `addr:${address}`;

/** How long an account waits after its last failure, given its failures in the window. */
export function accountDelayMs(failures: number): number {
  if (failures < MAX_FAILURES) return 0;
  return Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** (failures - MAX_FAILURES));
}

function limited(retryMs: number, message: string): AppError {
  const retryAfterSeconds = Math.max(1, Math.ceil(retryMs / 1000));
  return new AppError('rate_limited', message.replace('{wait}', waitText(retryAfterSeconds)), { retryAfterSeconds });
}

function waitText(seconds: number): string {
  return seconds < 90 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`;
}

/** Forgotten once quiet for a whole window. */
const live = (row: SignInThrottle | null, now: number) =>
  row && now - row.lastFailureAt.getTime() < WINDOW_MS ? row : null;

/**
 * Takes one try for this e-mail from this address, or throws 429 with Retry-After. The try
 * counts as a failure until `succeeded` gives it back.
 */
export async function takeTry(email: string, address: string, clock?: number): Promise<TryCounts> {
  // Read, check, then write: on PostgreSQL the two rows' locks make concurrent tries (from any
  // process) count one after another (lib/reviews/transaction.ts). The clock is read once the
  // try has its turn, so it is never earlier than the last failure another try wrote.
  return writeTransaction(
    async (transaction) => {
      const now = clock ?? Date.now();
      const [byEmail, byAddress] = await Promise.all(
        [emailKey(email), addressKey(address)].map(async (key) =>
          live(await SignInThrottle.findByPk(key, { transaction }), now),
        ),
      );
      assertNotLimited(byEmail, byAddress, now);
      const counts: TryCounts = {
        email: (byEmail?.failures ?? 0) + 1,
        address: (byAddress?.failures ?? 0) + 1,
        firstAddressFailureAt: byAddress?.firstFailureAt.getTime() ?? now,
      };
      for (const [key, row] of [
        [emailKey(email), byEmail],
        [addressKey(address), byAddress],
      ] as const) {
        const at = new Date(now);
        // A stale row (older than the window) starts over.
        if (row) await row.update({ failures: row.failures + 1, lastFailureAt: at }, { transaction });
        else await SignInThrottle.upsert({ key, failures: 1, firstFailureAt: at, lastFailureAt: at }, { transaction });
      }
      return counts;
    },
    { keys: [emailKey(email), addressKey(address)] },
  );
}

export interface TryCounts {
  /** Failures counted so far, this try included. */
  email: number;
  address: number;
  firstAddressFailureAt: number;
}

/** After a wrong password: the try that reached the limit is told so at once (429, not 401). */
export function assertNotLimitedAfter(counts: TryCounts, now = Date.now()): void {
  if (counts.address >= MAX_FAILURES) {
    throw limited(counts.firstAddressFailureAt + WINDOW_MS - now, ADDRESS_MESSAGE);
  }
  if (counts.email >= MAX_FAILURES) throw limited(accountDelayMs(counts.email), ACCOUNT_MESSAGE);
}

const ADDRESS_MESSAGE = 'Too many failed sign-ins from this network. Try again in {wait}, or reset your password.';
const ACCOUNT_MESSAGE = 'Too many failed sign-ins for this account. Try again in {wait}, or reset your password.';

function assertNotLimited(byEmail: SignInThrottle | null, byAddress: SignInThrottle | null, now: number): void {
  if (byAddress && byAddress.failures >= MAX_FAILURES && now - byAddress.firstFailureAt.getTime() < WINDOW_MS) {
    throw limited(byAddress.firstFailureAt.getTime() + WINDOW_MS - now, ADDRESS_MESSAGE);
  }
  // Below the limit there is no delay at all, whichever try's clock read first.
  const delay = byEmail ? accountDelayMs(byEmail.failures) : 0;
  const wait = byEmail && delay > 0 ? byEmail.lastFailureAt.getTime() + delay - now : 0;
  if (wait > 0) throw limited(wait, ACCOUNT_MESSAGE);
}

/** The password was right: the account's count is cleared and the address gets its try back. */
export async function succeeded(email: string, address: string): Promise<void> {
  await writeTransaction(
    async (transaction) => {
      await SignInThrottle.destroy({ where: { key: emailKey(email) }, transaction });
      await SignInThrottle.decrement('failures', {
        by: 1,
        where: { key: addressKey(address), failures: { [Op.gt]: 0 } },
        transaction,
      });
    },
    { keys: [emailKey(email), addressKey(address)] },
  );
}

/** After a password reset: the account starts with a clean slate. */
export async function clearFailures(email: string): Promise<void> {
  await SignInThrottle.destroy({ where: { key: emailKey(email) } });
}

/** For tests: forgets every count. */
export async function resetRateLimits(): Promise<void> {
  await SignInThrottle.destroy({ where: {} });
}
