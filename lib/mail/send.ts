import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

let transporter: Transporter | null = null;
let transporterKey = '';

function transport(): Transporter {
  const { SMTP_HOST, SMTP_PORT, SMTP_USER, SMTP_PASSWORD } = env();
  const key = `${SMTP_HOST}:${SMTP_PORT}`;
  if (!transporter || key !== transporterKey) {
    // Plain SMTP to the configured relay; in development and tests that is the local fake.
    transporter = nodemailer.createTransport({
      host: SMTP_HOST,
      port: SMTP_PORT,
      secure: false,
      ignoreTLS: SMTP_HOST === '127.0.0.1' || SMTP_HOST === 'localhost',
      auth: SMTP_USER ? { user: SMTP_USER, pass: SMTP_PASSWORD ?? '' } : undefined,
    });
    transporterKey = key;
  }
  return transporter;
}

/** Sends one mail with its text and HTML parts. Throws when the relay refuses it. */
export async function sendMail(mail: Mail): Promise<void> {
  await transport().sendMail({ from: env().MAIL_FROM, ...mail });
}

const pending = new Set<Promise<void>>();

/**
 * Sends after the answer: for mail whose sending (or failing) must not show in the response,
 * such as a password reset (how long it takes, or an error, would tell whether the address has
 * an account). A relay failure is logged, never thrown.
 */
export function sendMailLater(mail: Mail): void {
  composeMailLater(async () => mail);
}

/**
 * Like sendMailLater, for a mail whose recipient and words depend on work that must not show in
 * the answer either (a sign-up: whether the address has an account decides which mail goes out,
 * and storing the pending sign-up is a write whose wait would differ). `compose` runs after the
 * answer; it returns the mail to send, or null for none. A failure is logged, never thrown.
 */
export function composeMailLater(compose: () => Promise<Mail | null>): void {
  const sending = new Promise<void>((resolve) => setImmediate(resolve))
    .then(compose)
    .then((mail) => (mail ? sendMail(mail) : undefined))
    .catch((error) => console.error('A mail sent after the answer failed:', error))
    .finally(() => pending.delete(sending));
  pending.add(sending);
}

/** Resolves when every mail handed to sendMailLater has been tried (tests, a graceful shutdown). */
export async function mailQueueDrained(): Promise<void> {
  while (pending.size) await Promise.all([...pending]);
}
