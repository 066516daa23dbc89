import type { SessionOptions } from 'iron-session';
import { env } from '@/lib/env';

export interface SessionData {
  userId?: number;
  /** The user's session generation when this session began (lib/auth/sessions.ts). */
  generation?: number;
}

export const SESSION_COOKIE = 'loadbearing_session';

/**
 * Cookie settings for every session read. The password comes from SESSION_SECRET only: the dev
 * runner writes a random one into .env.local on first start; production must set it.
 */
export function sessionOptions(): SessionOptions {
  const { SESSION_SECRET: password, COOKIE_SECURE, NODE_ENV } = env();
  if (!password || password.length < 32) {
    throw new Error('SESSION_SECRET must be set to at least 32 characters.');
  }
  return {
    password,
    cookieName: SESSION_COOKIE,
    ttl: 60 * 60 * 24 * 14,
    cookieOptions: {
      httpOnly: true,
      sameSite: 'lax',
      // COOKIE_SECURE=false only for a production build served over plain http on this machine (browser tests).
      secure: COOKIE_SECURE ? COOKIE_SECURE === 'true' : NODE_ENV === 'production',
      path: '/',
    },
  };
}
