import type { CookieOptions, Request, Response } from 'express';
import type { AppConfig } from '../config/app-config';
import type { MeView } from '@limbus/schema';
import type { Session } from './auth.service';

export const REFRESH_COOKIE = 'limbus_refresh';

/**
 * Carries no secret, only "a refresh cookie was set and has not been cleared", readable by the client's
 * script (the refresh cookie is httpOnly), so that a first page load without a session does not try a
 * refresh only to log a 401.
 */
export const SESSION_HINT_COOKIE = 'limbus_session';

/** Path-scoped so the refresh token travels only to /api/auth, never with ordinary API calls. */
function options(secure: boolean): CookieOptions {
  return { httpOnly: true, sameSite: 'strict', secure, path: '/api/auth' };
}

function hintOptions(secure: boolean): CookieOptions {
  return { httpOnly: false, sameSite: 'strict', secure, path: '/' };
}

/** Sets the refresh cookie and the session hint, with the same lifetime. */
export function setRefreshCookie(res: Response, token: string, maxAgeSeconds: number, secure: boolean): void {
  res.cookie(REFRESH_COOKIE, token, { ...options(secure), maxAge: maxAgeSeconds * 1000 });
  res.cookie(SESSION_HINT_COOKIE, '1', { ...hintOptions(secure), maxAge: maxAgeSeconds * 1000 });
}

/** Clears both cookies: on sign-out and when a refresh fails. */
export function clearRefreshCookie(res: Response, secure: boolean): void {
  res.clearCookie(REFRESH_COOKIE, options(secure));
  res.clearCookie(SESSION_HINT_COOKIE, hintOptions(secure));
}

/** Reads one cookie from the header ourselves; one cookie does not justify a parser dependency. */
export function readRefreshCookie(req: Request): string | null {
  const header = req.headers.cookie;
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq < 0) continue;
    if (part.slice(0, eq).trim() !== REFRESH_COOKIE) continue;
    const value = part.slice(eq + 1).trim();
    try {
      return decodeURIComponent(value) || null;
    } catch {
      return null;
    }
  }
  return null;
}

export interface SessionView {
  accessToken: string;
  user: MeView;
}

/** Cookies marked Secure are dropped over plain http, so only an https deployment sets the flag. */
export function secureCookies(config: AppConfig): boolean {
  return config.publicUrl.startsWith('https:');
}

/**
 * Used by sign-in, refresh and invitation accept: the refresh token goes in the cookie, never the body,
 * and the session hint cookie goes with it.
 */
export function sendSession(res: Response, session: Session, config: AppConfig): SessionView {
  setRefreshCookie(res, session.refreshToken, config.refreshTokenTtlSeconds, secureCookies(config));
  return { accessToken: session.accessToken, user: session.user };
}
