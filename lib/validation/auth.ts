import { z } from 'zod';
import { idParam } from './ids';
import { ROLES } from '@/models/roles';

/** Schemas shared by the forms (inline errors) and the route handlers (400s). */

export const email = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }));

/** The longest password an account can have (sign-up, reset, invitation). */
const MAX_PASSWORD = 200;

export const newPassword = z
  .string({ error: 'Choose a password.' })
  .min(10, { error: 'Use at least 10 characters.' })
  .max(MAX_PASSWORD, { error: `Use at most ${MAX_PASSWORD} characters.` });

const name = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(1, { error: 'Enter your name.' })
  .max(120, { error: 'Keep the name under 120 characters.' });

export const signUpSchema = z.object({
  name,
  email,
  password: newPassword,
  teamName: z
    .string({ error: 'Name your team.' })
    .trim()
    .min(2, { error: 'Name your team (2 characters or more).' })
    .max(120, { error: 'Keep the team name under 120 characters.' }),
});

export const signInSchema = z.object({
  email,
  // Longer than any account's password cannot be right: refused as bad input before the throttle
  // counts a try or the hash reads it (docs/api/README.md, "Errors").
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, { error: 'Enter your password.' })
    .max(MAX_PASSWORD, { error: 'That password is longer than any account can have.' }),
});

export const resetRequestSchema = z.object({ email });

export const resetConfirmSchema = z.object({
  token: z.string({ error: 'The reset link is incomplete.' }).min(10, { error: 'The reset link is incomplete.' }),
  password: newPassword,
});

const linkToken = (what: string) =>
  z.string({ error: `The ${what} link is incomplete.` }).min(10, { error: `The ${what} link is incomplete.` });

export const signUpConfirmSchema = z.object({ token: linkToken('sign-up') });

export const signUpResendSchema = z.object({ email });

export const changePasswordSchema = z
  .object({
    currentPassword: z
      .string({ error: 'Enter your current password.' })
      .min(1, { error: 'Enter your current password.' }),
    newPassword,
  })
  .refine((v) => v.newPassword !== v.currentPassword, {
    path: ['newPassword'],
    error: 'Choose a password different from the current one.',
  });

export const role = z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(', ')}.` });

export const inviteSchema = z.object({ email, role });

export const roleChangeSchema = z.object({ role });

/** Accepting as the signed-in user needs nothing; a new account needs a name and a password. */
export const acceptInvitationSchema = z.union([z.object({ name, password: newPassword }), z.object({}).strict()]);

export { idParam } from './ids';
export const teamParams = z.object({ teamId: idParam });
export const memberParams = z.object({ teamId: idParam, membershipId: idParam });
export const tokenParams = z.object({ token: z.string().min(10) });
