import { getIronSession } from 'iron-session';
import { cookies } from 'next/headers';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import { loadActor } from './actor';
import { sessionOptions, type SessionData } from './session';

/** The session of the current request, for server components and server actions. */
export async function currentSession() {
  return getIronSession<SessionData>(await cookies(), sessionOptions());
}

/** The signed-in actor for this render (loaded once per request), or null. */
export const currentActor = cache(async () => loadActor(await currentSession()));

/** For signed-in pages: the actor, or a redirect to /sign-in that comes back here. */
export async function requirePageActor(returnTo: string) {
  const actor = await currentActor();
  if (!actor) redirect(`/sign-in?next=${encodeURIComponent(returnTo)}`);
  return actor;
}
