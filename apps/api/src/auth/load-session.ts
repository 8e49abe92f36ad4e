import type { RequestHandler, Response } from 'express';
import type { AppLucia } from './lucia';

/**
 * Runs on every /api request: validates the session cookie with lucia, refreshes the cookie
 * when lucia extended the session, clears it when the session is gone, and drops the session
 * of a deactivated person at once. Result in res.locals.auth.
 */
export function loadSession(lucia: AppLucia): RequestHandler {
  return async (req, res, next) => {
    res.locals.auth = { person: null, sessionId: null };
    const sessionId = lucia.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const { session, user } = await lucia.validateSession(sessionId);
    if (!session || !user) {
      setCookie(res, lucia.createBlankSessionCookie().serialize());
      return next();
    }
    if (!user.active) {
      await lucia.invalidateUserSessions(user.id);
      setCookie(res, lucia.createBlankSessionCookie().serialize());
      return next();
    }
    if (session.fresh) setCookie(res, lucia.createSessionCookie(session.id).serialize());
    res.locals.auth = {
      person: { id: user.id, email: user.email, name: user.name, role: user.role },
      sessionId: session.id,
    };
    next();
  };
}

export function setCookie(res: Response, serialized: string): void {
  res.append('Set-Cookie', serialized);
}
