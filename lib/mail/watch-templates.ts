import { composeMail } from './layout';
import type { Mail } from './send';

/** Mails of the evidence watch (lib/watch). */

/** To a flagged verdict's author and the team's owners: a study it cites received a notice. */
export function evidenceChangedMail(opts: {
  to: string;
  teamName: string;
  title: string;
  citation: string;
  /** "retracted on 20 Nov 2026" */
  what: string;
  noticeDoi: string;
  dryRun: string | null;
  verdictUrl: string;
  reviewUrl: string;
}): Mail {
  return {
    to: opts.to,
    subject: `Evidence changed: ${opts.title}`,
    ...composeMail({
      paragraphs: [
        `A study that the published verdict “${opts.title}” (${opts.teamName}) cites was ${opts.what}: ${opts.citation} (notice doi:${opts.noticeDoi}).`,
        ...(opts.dryRun ? [opts.dryRun] : []),
        `The public page now tells readers that the team is re-reviewing the verdict, until you publish a new version. Review the appraisals of this study: ${opts.reviewUrl}`,
      ],
      action: { label: 'Open the verdict', url: opts.verdictUrl },
      footer: `You get this because you wrote this verdict or own ${opts.teamName} on Loadbearing.`,
    }),
  };
}
