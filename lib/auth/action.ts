import { headers } from 'next/headers';
import type { z } from 'zod';
import { AppError } from '@/lib/api/errors';
import { busyError } from '@/lib/api/respond';
import { inWriteTurn } from '@/lib/api/write-turns';
import { loadActor } from './actor';
import { forwardedClient } from './client-address';
import { authorize, requireActor } from './authorize';
import { currentSession } from './current';
import type { Action, Actor, Resource } from './policy';

/** What every form's server action returns: field errors inline, one message for the rest. */
export interface FormState {
  ok?: boolean;
  message?: string;
  errors?: Record<string, string[]>;
  /** The submitted text fields, so a failed submit does not empty the form. */
  values?: Record<string, string>;
}

export interface ActionContext {
  session: Awaited<ReturnType<typeof currentSession>>;
  actor: Actor | null;
  address: string;
  authorize(action: Action, resource: Resource, what?: string): void;
  signedIn(): Actor;
}

/**
 * The one wrapper of every server action: validates the form with zod (field errors come back
 * for inline display), waits for a write turn (lib/api/write-turns.ts), loads the session and
 * actor, hands over the policy, and turns an AppError into a message. Anything else (including
 * redirect()) propagates to Next.
 *
 * @example
 * export const inviteAction = formAction(inviteSchema, async (data, { authorize }) => { ... });
 */
export function formAction<T>(schema: z.ZodType<T>, fn: (data: T, ctx: ActionContext) => Promise<FormState | void>) {
  return async (_previous: FormState, formData: FormData): Promise<FormState> => {
    const values = textFields(formData);
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      const errors: Record<string, string[]> = {};
      for (const issue of parsed.error.issues) {
        const key = issue.path.map(String).join('.') || 'form';
        (errors[key] ??= []).push(issue.message);
      }
      return { errors, values: withoutSecrets(values), message: 'Please correct the highlighted fields.' };
    }
    try {
      return await inWriteTurn(async () => {
        const session = await currentSession();
        const actor = await loadActor(session);
        const address = forwardedClient(await headers());
        return (
          (await fn(parsed.data, {
            session,
            actor,
            address,
            authorize: (action, resource, what) => authorize(actor, action, resource, what),
            signedIn: () => requireActor(actor),
          })) ?? { ok: true }
        );
      });
    } catch (thrown) {
      const error = busyError(thrown) ?? thrown;
      if (error instanceof AppError) {
        // A domain error that names its field ("Already a member") shows under that field too.
        const errors: Record<string, string[]> = {};
        for (const issue of error.extra.issues ?? []) if (issue.path) (errors[issue.path] ??= []).push(issue.message);
        return { message: error.message, errors, values: withoutSecrets(values) };
      }
      throw error;
    }
  };
}

function textFields(formData: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (typeof value === 'string' && !key.startsWith('$ACTION')) out[key] = value;
  }
  return out;
}

function withoutSecrets(values: Record<string, string>): Record<string, string> {
  const { password: _password, currentPassword: _current, newPassword: _new, ...rest } = values;
  return rest;
}
