import { Router } from 'express';
import { signInSchema, type Me, type SessionState } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { validate } from '../http/validate-request';
import { currentPerson } from './current-person';
import { allow, everyRole, open } from './guard';
import { setCookie } from './load-session';
import { signIn } from './sign-in.use-case';

/** POST /api/auth/sign-in, POST /api/auth/sign-out, GET /api/me, GET /api/session. */
export function authRouter({ dataSource, lucia }: ApiContext): Router {
  const router = Router();

  const signInInput = validate({ body: signInSchema });
  router.post('/api/auth/sign-in', open(), signInInput, async (req, res) => {
    const { body } = signInInput.from(res);
    const result = await signIn(
      { dataSource, lucia },
      { ...body, ip: req.ip ?? req.socket.remoteAddress ?? 'unknown', previousSessionId: res.locals.auth?.sessionId ?? null },
    );
    setCookie(res, result.sessionCookie);
    res.json(result.me satisfies Me);
  });

  // Open so that signing out with an expired session still clears the cookie.
  router.post('/api/auth/sign-out', open(), async (_req, res) => {
    const sessionId = res.locals.auth?.sessionId;
    if (sessionId) await lucia.invalidateSession(sessionId);
    setCookie(res, lucia.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  router.get('/api/me', allow(...everyRole), (_req, res) => {
    const { email, name, role } = currentPerson(res);
    res.json({ email, name, role } satisfies Me);
  });

  // Open: answers 200 with or without a session, so the planner can ask who is signed in
  // before anyone has (GET /api/me keeps its 401 for integrators).
  router.get('/api/session', open(), (_req, res) => {
    const person = res.locals.auth?.person;
    const state: SessionState = person ? { signedIn: true, person: { email: person.email, name: person.name, role: person.role } } : { signedIn: false };
    res.json(state);
  });

  return router;
}
