import { getIronSession, type IronSession } from 'iron-session';
import type { z } from 'zod';
import { badRequest } from '@/lib/api/errors';
import { errorResponse, fromZod } from '@/lib/api/respond';
import { inWriteTurn, leaveTheDoor } from '@/lib/api/write-turns';
import { env } from '@/lib/env';
import { loadActor } from './actor';
import { forwardedClient } from './client-address';
import { assertContentType, crossSiteReason, crossSiteRefusal, hasBody, isSafeMethod } from './same-origin';
import { authorize, requireActor } from './authorize';
import type { Action, Actor, Resource } from './policy';
import { sessionOptions, type SessionData } from './session';

export interface HandlerContext<P, B, Q> {
  req: Request;
  params: P;
  body: B;
  query: Q;
  session: IronSession<SessionData>;
  /** Null when signed out (only reachable with `auth: 'optional'`). */
  actor: Actor | null;
  address: string;
  authorize(action: Action, resource: Resource, what?: string): void;
  /** The actor, or a 401. */
  signedIn(): Actor;
}

interface RouteOptions<P, B, Q> {
  params?: z.ZodType<P>;
  body?: z.ZodType<B>;
  query?: z.ZodType<Q>;
  /** 'required' (default) answers 401 before the handler runs when signed out. */
  auth?: 'required' | 'optional';
  /** The route reads a multipart upload itself (documented in docs/api/); otherwise bodies are JSON. */
  multipart?: boolean;
  /**
   * A write that works for seconds (the evidence watch waited for): it gives up its place at the
   * server's door and takes no write turn (lib/api/write-turns.ts), so it never keeps the short
   * saves waiting. Uploads never take either.
   */
  slow?: boolean;
}

type NextRouteContext = { params: Promise<Record<string, string | string[]>> };

/**
 * The one wrapper of every route handler: refuses cross-site writes, gives a write its turn
 * (lib/api/write-turns.ts), reads the session, loads the actor, validates params, query and JSON
 * body with zod, hands the handler the policy, and turns whatever it throws into the error JSON
 * of docs/api/README.md. A handler returns a Response or a value to send as JSON.
 *
 * @example
 * export const GET = route({ params: teamParams }, async ({ params, authorize }) => {
 *   authorize('team.members.list', { teamId: params.teamId });
 *   return { members: await listMembers(params.teamId) };
 * });
 */
export function route<P = Record<string, never>, B = undefined, Q = Record<string, never>>(
  options: RouteOptions<P, B, Q>,
  handler: (ctx: HandlerContext<P, B, Q>) => Promise<Response | object | null>,
) {
  return async (req: Request, context?: NextRouteContext): Promise<Response> => {
    const cookieCarrier = new Response();
    if (options.slow) leaveTheDoor();
    try {
      // Before the session is read: another site's request learns nothing and changes nothing.
      if (crossSiteReason(req.method, req.headers, req.url, env().APP_URL)) throw crossSiteRefusal();
      if (!isSafeMethod(req.method) && (options.body || options.multipart || hasBody(req.headers))) {
        assertContentType(req.headers, options.multipart ? 'multipart' : 'json');
      }
      const work = async () => {
        const session = await getIronSession<SessionData>(req, cookieCarrier, sessionOptions());
        const actor = await loadActor(session);
        if (options.auth !== 'optional' && !actor) requireActor(actor);

        const params = parseWith(options.params, (await context?.params) ?? {});
        const query = parseWith(options.query, Object.fromEntries(new URL(req.url).searchParams));
        const body = options.body ? parseWith(options.body, await readJson(req)) : (undefined as B);

        return handler({
          req,
          params,
          body,
          query,
          session,
          actor,
          address: clientAddress(req),
          authorize: (action, resource, what) => authorize(actor, action, resource, what),
          signedIn: () => requireActor(actor),
        });
      };
      const takesTurn = !isSafeMethod(req.method) && !options.multipart && !options.slow;
      const result = await (takesTurn ? inWriteTurn(work) : work());
      return withCookies(result instanceof Response ? result : Response.json(result ?? {}), cookieCarrier);
    } catch (error) {
      return withCookies(errorResponse(error), cookieCarrier);
    }
  };
}

function parseWith<T>(schema: z.ZodType<T> | undefined, value: unknown): T {
  if (!schema) return value as T;
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw fromZod(parsed.error);
  return parsed.data;
}

async function readJson(req: Request): Promise<unknown> {
  const text = await req.text();
  if (!text.trim()) throw badRequest('The request needs a JSON body.', [{ path: '', message: 'Empty body.' }]);
  try {
    return JSON.parse(text);
  } catch {
    throw badRequest('The request body is not valid JSON.', [{ path: '', message: 'Malformed JSON.' }]);
  }
}

/** Resolved by the server from the socket and TRUSTED_PROXIES (lib/auth/client-address.ts). */
export function clientAddress(req: Request): string {
  return forwardedClient(req.headers);
}

function withCookies(response: Response, carrier: Response): Response {
  const cookies = carrier.headers.getSetCookie();
  if (!cookies.length) return response;
  const merged = new Response(response.body, response);
  for (const cookie of cookies) merged.headers.append('set-cookie', cookie);
  return merged;
}
