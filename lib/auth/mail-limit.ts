import { AppError } from '@/lib/api/errors';
import { writeTransaction } from '@/lib/reviews/transaction';
import { MailRequest } from '@/models';

/**
 * Limits on the mails anyone can make the app send without signing in — sign-up links, their
 * resends, password resets — kept in the database (table `mail_requests`) so that every server
 * process counts the same requests:
 * - per client address (lib/auth/client-address.ts): at most PER_ADDRESS requests in WINDOW_MS,
 *   then 429 with Retry-After. The answer does not depend on the e-mail address asked for, so it
 *   tells nothing about who has an account;
 * - per recipient: at most PER_RECIPIENT mails in WINDOW_MS, from any number of client addresses.
 *   Past that the request is answered exactly as before but no mail goes out, so nobody can fill
 *   a stranger's inbox, and the answer still tells nothing.
 * Fixed windows (common practice, OWASP Forgot Password Cheat Sheet: limit reset requests; the
 * figures are ours).
 */
export const WINDOW_MS = 60 * 60 * 1000;
export const PER_ADDRESS = 10;
export const PER_RECIPIENT = 5;

const addressKey = (address: string) => `mail-addr:${address}`;
const recipientKey = (email: string) => `mail-to:${email.trim().toLowerCase()}`;

/** Counts one request under `key`; false (nothing counted) when the window's limit is reached. */
async function take(key: string, limit: number, now: number): Promise<{ ok: boolean; retryMs: number }> {
  return writeTransaction(
    async (transaction) => {
      const row = await MailRequest.findByPk(key, { transaction });
      const started = row?.windowStartedAt.getTime() ?? 0;
      if (row && now - started < WINDOW_MS) {
        if (row.count >= limit) return { ok: false, retryMs: started + WINDOW_MS - now };
        await row.update({ count: row.count + 1 }, { transaction });
      } else {
        await MailRequest.upsert({ key, count: 1, windowStartedAt: new Date(now) }, { transaction });
      }
      return { ok: true, retryMs: 0 };
    },
    { keys: [key] },
  );
}

/** Takes one account-mail request for this client address, or throws 429 with Retry-After. */
export async function takeMailRequest(address: string, now = Date.now()): Promise<void> {
  const { ok, retryMs } = await take(addressKey(address), PER_ADDRESS, now);
  if (ok) return;
  const minutes = Math.max(1, Math.ceil(retryMs / 60_000));
  throw new AppError(
    'rate_limited',
    `Too many e-mails asked for from this network. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
    { retryAfterSeconds: Math.max(1, Math.ceil(retryMs / 1000)) },
  );
}

/** Whether one more account mail may go to this address in the window (and counts it if so). */
export async function mayMailRecipient(email: string, now = Date.now()): Promise<boolean> {
  return (await take(recipientKey(email), PER_RECIPIENT, now)).ok;
}
