import type { SessionOptions } from 'iron-session';

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
  const password = process.env.SESSION_SECRET;
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
      secure: process.env.COOKIE_SECURE ? process.env.COOKIE_SECURE === 'true' : process.env.NODE_ENV === 'production',
      path: '/',
    },
  };
}
