import type { IncomingMessage, ServerResponse } from 'node:http';
import { getIronSession } from 'iron-session';
import { loadActor } from './actor';
import { sessionOptions, type SessionData } from './session';

/**
 * The signed-in actor of a Pages Router request (getServerSideProps has Node's req/res, not
 * next/headers), or null. Same cookie, same rules as currentActor.
 */
export async function actorFromRequest(req: IncomingMessage, res: ServerResponse) {
  const session = await getIronSession<SessionData>(req, res, sessionOptions());
  return loadActor(session);
}
