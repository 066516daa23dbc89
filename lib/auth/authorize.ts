import { AppError, forbidden, notFound, unauthorized } from '@/lib/api/errors';
import { decide, type Action, type Actor, type Resource } from './policy';

/** Applies the policy and throws the matching AppError; the wrappers hand this to every handler. */
export function authorize(actor: Actor | null, action: Action, resource: Resource, what = 'That'): void {
  const decision = decide(actor, action, resource);
  if (decision === 'allow') return;
  throw decisionError(decision, what);
}

function decisionError(decision: Exclude<ReturnType<typeof decide>, 'allow'>, what: string): AppError {
  if (decision === 'unauthorized') return unauthorized();
  if (decision === 'not_found') return notFound(what);
  return forbidden();
}

export function requireActor(actor: Actor | null): Actor {
  if (!actor) throw unauthorized();
  return actor;
}
