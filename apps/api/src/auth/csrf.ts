import type { RequestHandler } from 'express';
import { AppError } from '../http/app-error';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(value: string | undefined): string | null {
  if (!value || value === 'null') return null;
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * CSRF check: every state-changing request must carry an Origin (or, failing that, a Referer)
 * whose origin is PUBLIC_URL's or the request's own host. Otherwise 403 `origin_mismatch`.
 */
export function checkOrigin(publicUrl: string): RequestHandler {
  const publicOrigin = new URL(publicUrl).origin;
  return (req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    const sent = originOf(req.get('origin')) ?? originOf(req.get('referer'));
    const ownOrigin = originOf(`${req.protocol}://${req.get('host') ?? ''}`);
    if (sent !== null && (sent === publicOrigin || sent === ownOrigin)) return next();
    next(
      new AppError(
        403,
        'origin_mismatch',
        sent === null
          ? 'This request carries no Origin or Referer header, so it was refused (cross-site request protection).'
          : `Requests from ${sent} are not accepted (cross-site request protection).`,
      ),
    );
  };
}
