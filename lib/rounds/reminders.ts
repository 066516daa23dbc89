import { Op } from 'sequelize';
import { recordEvent } from '@/lib/audit/record';
import { roundReminderMail } from '@/lib/mail/round-templates';
import { Review, ReviewRound, RoundInvitation, User } from '@/models';
import { deliver, scorecardUrl } from './notify';

export const REMINDER_WINDOW_MS = 24 * 60 * 60 * 1000;

/**
 * The 24-hour reminder: every invited reviewer of an open round due within the next 24 hours
 * who has not submitted gets one mail, once (`remindedAt` records it). A mail the relay refuses
 * is not recorded, so the next run tries again. Run by `npm run rounds:remind`
 * (scripts/remind-due-rounds.ts), e.g. hourly from cron.
 */
export async function remindDueRounds(now = new Date()): Promise<{ reminded: string[]; failed: string[] }> {
  const rounds = await ReviewRound.findAll({
    where: { status: 'open', dueAt: { [Op.gt]: now, [Op.lte]: new Date(now.getTime() + REMINDER_WINDOW_MS) } },
  });
  const reminded: string[] = [];
  const failed: string[] = [];
  for (const round of rounds) {
    const invitations = await RoundInvitation.findAll({
      where: { roundId: round.id, submittedAt: null, remindedAt: null, closedWithoutReason: null },
    });
    if (!invitations.length) continue;
    const review = await Review.findByPk(round.reviewId, { attributes: ['id', 'title'] });
    if (!review) continue;
    for (const invitation of invitations) {
      const person = await User.findByPk(invitation.reviewerId, { attributes: ['id', 'name', 'email'] });
      if (!person) continue;
      const outcome = await deliver([
        roundReminderMail({
          to: person.email,
          reviewerName: person.name,
          reviewTitle: review.title,
          dueAt: round.dueAt,
          url: scorecardUrl(round.reviewId, round.id),
        }),
      ]);
      if (outcome.failed.length) {
        failed.push(person.email);
        continue;
      }
      await invitation.update({ remindedAt: now });
      await recordEvent({
        teamId: round.teamId,
        actorId: null,
        action: 'round.reminder_sent',
        subjectType: 'review',
        subjectId: round.reviewId,
        data: { roundId: round.id, reviewerId: invitation.reviewerId },
      });
      reminded.push(person.email);
    }
  }
  return { reminded, failed };
}
