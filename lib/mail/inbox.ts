import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { env } from '@/lib/env';
import type { ReceivedMail } from './fake-smtp';

/** The mails the local fake has received, newest first (development only: /dev/mail). */
export async function readDropInbox(dir = env().MAIL_DROP_DIR): Promise<ReceivedMail[]> {
  // turbopackIgnore: a runtime data path, not source; without it the build traces the whole project.
  const folder = path.resolve(/*turbopackIgnore: true*/ process.cwd(), dir);
  let names: string[];
  try {
    names = (await readdir(folder)).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  const mails = await Promise.all(
    names.map(async (n) => JSON.parse(await readFile(path.join(folder, n), 'utf8')) as ReceivedMail),
  );
  return mails.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}
