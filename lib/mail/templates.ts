import type { Role } from '@/models/roles';
import { composeMail } from './layout';
import type { Mail } from './send';

export function invitationMail(opts: {
  to: string;
  teamName: string;
  inviterName: string;
  role: Role;
  url: string;
}): Mail {
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

export function confirmSignUpMail(opts: { to: string; name: string; teamName: string; url: string }): Mail {
  return {
    to: opts.to,
    subject: 'Confirm your Loadbearing account',
    ...composeMail({
      paragraphs: [
        `Hello ${opts.name},`,
        `Open the link to create your account and the team ${opts.teamName}. It works once, for 24 hours.`,
        'If you did not sign up, ignore this mail: nothing is created without the link.',
      ],
      action: { label: 'Create my account', url: opts.url },
    }),
  };
}

/** Sent instead of a confirmation when the address already has an account (docs/api/README.md). */
export function accountExistsMail(opts: { to: string; name: string; signInUrl: string; resetUrl: string }): Mail {
  return {
    to: opts.to,
    subject: 'You already have a Loadbearing account',
    ...composeMail({
      paragraphs: [
        `Hello ${opts.name},`,
        'Someone tried to create a new Loadbearing account with this address, but you already have one. Nothing was changed.',
        `Sign in with your password, or choose a new one if you have forgotten it: ${opts.resetUrl}`,
        'If it was not you, ignore this mail.',
      ],
      action: { label: 'Sign in', url: opts.signInUrl },
    }),
  };
}
