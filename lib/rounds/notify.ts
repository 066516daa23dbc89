import { env } from '@/lib/env';
import { sendMail, type Mail } from '@/lib/mail/send';

/**
 * Mail after the data is committed: a relay that is down must not undo a round, a submission or
 * a close. A failure is logged and reported back to the caller, who tells the person.
 */
export async function deliver(mails: Mail[]): Promise<{ sent: string[]; failed: string[] }> {
  const sent: string[] = [];
  const failed: string[] = [];
  for (const mail of mails) {
    try {
      await sendMail(mail);
      sent.push(mail.to);
    } catch (error) {
      console.error(`Peer-review mail to ${mail.to} failed:`, error);
      failed.push(mail.to);
    }
  }
  return { sent, failed };
}

export const scorecardUrl = (reviewId: number, roundId: number) =>
  `${env().APP_URL}/reviews/${reviewId}/round/${roundId}`;
export const roundsUrl = (reviewId: number, roundId?: number) =>
  `${env().APP_URL}/reviews/${reviewId}/rounds${roundId ? `#round-${roundId}` : ''}`;
