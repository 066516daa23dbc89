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
