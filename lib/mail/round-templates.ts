import { composeMail } from './layout';
import type { Mail } from './send';

/**
 * The mails of peer review. Each links to the page it is about: reviewers to their
 * scorecard, the author to the round's page. Dates are written in UTC because a mail does not
 * know the reader's time zone.
 */

export function dueText(due: Date): string {
  const date = due.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
  const time = due.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: 'UTC' });
  return `${date}, ${time} UTC`;
}

export function roundInvitationMail(opts: {
  to: string;
  reviewerName: string;
  authorName: string;
  reviewTitle: string;
  dueAt: Date;
  note: string;
  url: string;
}): Mail {
  return {
    to: opts.to,
    subject: `Peer review requested: ${opts.reviewTitle}`,
    ...composeMail({
      paragraphs: [
        `Hello ${opts.reviewerName},`,
        `${opts.authorName} asks you to score the mechanisms of “${opts.reviewTitle}” before ${dueText(opts.dueAt)}.`,
        'You score blind: the engine’s probabilities and your colleagues’ scores stay hidden until you submit. Your draft is saved as you go; submitting is final.',
        ...(opts.note ? [`Their note: ${opts.note}`] : []),
      ],
      action: { label: 'Open your scorecard', url: opts.url },
    }),
  };
}

export function roundReminderMail(opts: {
  to: string;
  reviewerName: string;
  reviewTitle: string;
  dueAt: Date;
  url: string;
}): Mail {
  return {
    to: opts.to,
    subject: `Due within a day: your scorecard for ${opts.reviewTitle}`,
    ...composeMail({
      paragraphs: [
        `Hello ${opts.reviewerName},`,
        `Your scorecard for “${opts.reviewTitle}” is due ${dueText(opts.dueAt)} and has not been submitted yet.`,
        'Whatever you have already entered is kept as a draft.',
      ],
      action: { label: 'Finish your scorecard', url: opts.url },
    }),
  };
}

export function scorecardSubmittedMail(opts: {
  to: string;
  authorName: string;
  reviewerName: string;
  reviewTitle: string;
  submitted: number;
  invited: number;
  url: string;
}): Mail {
  return {
    to: opts.to,
    subject: `${opts.reviewerName} submitted a scorecard for ${opts.reviewTitle}`,
    ...composeMail({
      paragraphs: [
        `Hello ${opts.authorName},`,
        `${opts.reviewerName} submitted their scorecard for “${opts.reviewTitle}”. ${opts.submitted} of ${opts.invited} invited reviewers have now submitted.`,
      ],
      action: { label: 'See the round', url: opts.url },
    }),
  };
}

export function commentReplyMail(opts: {
  to: string;
  recipientName: string;
  replierName: string;
  reviewTitle: string;
  excerpt: string;
  url: string;
}): Mail {
  return {
    to: opts.to,
    subject: `${opts.replierName} replied to your comment on ${opts.reviewTitle}`,
    ...composeMail({
      paragraphs: [
        `Hello ${opts.recipientName},`,
        `${opts.replierName} replied in the discussion of “${opts.reviewTitle}”:`,
        `“${opts.excerpt}”`,
      ],
      action: { label: 'Open the discussion', url: opts.url },
    }),
  };
}

export function roundClosedMail(opts: {
  to: string;
  recipientName: string;
  closerName: string;
  reviewTitle: string;
  outcome: 'approved' | 'draft';
  url: string;
}): Mail {
  return {
    to: opts.to,
    subject: `Peer review closed: ${opts.reviewTitle}`,
    ...composeMail({
      paragraphs: [
        `Hello ${opts.recipientName},`,
        `${opts.closerName} closed the peer-review round of “${opts.reviewTitle}”.`,
        opts.outcome === 'approved'
          ? 'No “do not publish” sign-off stood at the close, so the review is now approved.'
          : 'A “do not publish” sign-off stood at the close, so the review went back to draft for more work.',
      ],
      action: { label: 'See the outcome', url: opts.url },
    }),
  };
}
