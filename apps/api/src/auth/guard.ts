import type { RequestHandler } from 'express';
import { roles as allRoles, type Role } from '@millrace/contracts';
import { AppError } from '../http/app-error';

/** Marker on every route's first handler, read by the route-matrix test. */
export type GuardMarker = { kind: 'allow'; roles: readonly Role[] } | { kind: 'open'; roles: readonly Role[] };
export type GuardedHandler = RequestHandler & { guard: GuardMarker };

/**
 * Only signed-in people with one of `roles` pass: 401 `unauthenticated` without a session,
 * 403 `forbidden` for any other role. Put it first on every route: `router.get(path, allow(...), …)`.
 */
export function allow(...roles: Role[]): GuardedHandler {
  if (roles.length === 0) throw new Error('allow() needs at least one role; use open() for public routes');
  const handler: RequestHandler = (_req, res, next) => {
    const person = res.locals.auth?.person;
    if (!person) return next(new AppError(401, 'unauthenticated', 'Sign in to continue.'));
    if (!roles.includes(person.role)) {
      return next(new AppError(403, 'forbidden', 'Your role does not allow this. Ask an admin if you need it.'));
    }
    next();
  };
  return Object.assign(handler, { guard: { kind: 'allow', roles: [...roles] } as GuardMarker });
}

/** Every role: any signed-in person. */
export const everyRole: readonly Role[] = allRoles;

/** Marks one of the few public routes (health, sign-in, token pages). */
export function open(): GuardedHandler {
  const handler: RequestHandler = (_req, _res, next) => next();
  return Object.assign(handler, { guard: { kind: 'open', roles: [] } as GuardMarker });
}
