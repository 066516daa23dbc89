import { composeMail } from './layout';
import type { Mail } from './send';

/** Mails of publishing. Each carries the cautions and a working unsubscribe link. */

const CAUTION =
  'A verdict is education, not a diagnosis or treatment plan. Stop on pain and see a licensed clinician (physiotherapist, sports physician), and defer to local professional regulation.';

export function newVerdictMail(opts: {
  to: string;
  teamName: string;
  title: string;
  claim: string;
  verdictLabel: string;
  summary: string;
  version: number;
  changeNote: string | null;
  url: string;
  unsubscribeUrl: string;
}): Mail {
  const isNew = opts.version === 1;
  const paragraphs = [
    isNew
      ? `${opts.teamName} published a new verdict: “${opts.claim}”`
      : `${opts.teamName} published version ${opts.version} of the verdict on “${opts.claim}”.`,
    `Verdict: ${opts.verdictLabel}. ${opts.summary}`,
    ...(opts.changeNote ? [`What changed: ${opts.changeNote}`] : []),
    CAUTION,
  ];
  return {
    to: opts.to,
    subject: isNew
      ? `New verdict from ${opts.teamName}: ${opts.title}`
      : `Updated verdict from ${opts.teamName}: ${opts.title} (version ${opts.version})`,
    ...composeMail({
      paragraphs,
      action: { label: 'Read the verdict', url: opts.url },
      footer: `You get this because you follow ${opts.teamName} on Loadbearing. Stop these mails: ${opts.unsubscribeUrl}`,
    }),
  };
}
