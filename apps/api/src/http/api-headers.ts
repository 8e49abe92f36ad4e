import type { RequestHandler } from 'express';

/** API answers are never cached and never sniffed as another content type. */
export const apiHeaders: RequestHandler = (_req, res, next) => {
  res.set({ 'Cache-Control': 'no-store', 'X-Content-Type-Options': 'nosniff' });
  next();
};
