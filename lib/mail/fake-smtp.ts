import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface ReceivedMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

export interface FakeSmtp {
  port: number;
  messages: ReceivedMail[];
  /** Resolves with the first mail (already here or still to come) that matches. */
  waitFor(match: (mail: ReceivedMail) => boolean, timeoutMs?: number): Promise<ReceivedMail>;
  close(): Promise<void>;
}

/**
 * A local stand-in for the hosted mail relay: accepts every message, keeps it in memory and,
 * when `dropDir` is given, writes it there as JSON (what /dev/mail and the browser tests read).
 */
export async function startFakeSmtp(opts: { port?: number; host?: string; dropDir?: string } = {}): Promise<FakeSmtp> {
  const messages: ReceivedMail[] = [];
  const waiters: { match: (m: ReceivedMail) => boolean; resolve: (m: ReceivedMail) => void }[] = [];
  let counter = 0;

  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const mail: ReceivedMail = {
            id: `${Date.now()}-${++counter}`,
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
          };
          messages.push(mail);
          if (opts.dropDir) {
            await mkdir(opts.dropDir, { recursive: true });
            await writeFile(path.join(opts.dropDir, `${mail.id}.json`), JSON.stringify(mail, null, 2));
          }
          for (const waiter of [...waiters]) {
            if (waiter.match(mail)) {
              waiters.splice(waiters.indexOf(waiter), 1);
              waiter.resolve(mail);
            }
          }
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, opts.host ?? '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : (opts.port ?? 0);

  return {
    port,
    messages,
    waitFor(match, timeoutMs = 10_000) {
      const found = messages.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = { match, resolve: (m: ReceivedMail) => (clearTimeout(timer), resolve(m)) };
        const timer = setTimeout(() => {
          waiters.splice(waiters.indexOf(waiter), 1);
          reject(new Error('No matching mail arrived in time.'));
        }, timeoutMs);
        waiters.push(waiter);
      });
    },
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
