import type { Role } from '@/models/roles';
import { composeMail } from './layout';
import type { Mail } from './send';

export function invitationMail(opts: { to: string; teamName: string; inviterName: string; role: Role; url: string }): Mail {
  return {
    to: opts.to,
    subject: `${opts.inviterName} invited you to ${opts.teamName} on Loadbearing`,
    ...composeMail({
      paragraphs: [
        `${opts.inviterName} invited you to join ${opts.teamName} as ${opts.role === 'athlete' ? 'an' : 'a'} ${opts.role}.`,
        'The link works for 7 days. If you did not expect this, you can ignore this mail.',
      ],
      action: { label: 'Accept the invitation', url: opts.url },
    }),
  };
}

export function passwordResetMail(opts: { to: string; name: string; url: string }): Mail {
  return {
    to: opts.to,
    subject: 'Reset your Loadbearing password',
    ...composeMail({
      paragraphs: [
        `Hello ${opts.name},`,
        'Someone asked to reset the password of your Loadbearing account. The link works once, for one hour.',
        'If it was not you, ignore this mail: your password stays as it is.',
      ],
      action: { label: 'Choose a new password', url: opts.url },
    }),
  };
}
