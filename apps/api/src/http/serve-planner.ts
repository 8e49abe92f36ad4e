import express, { type Express } from 'express';
import { existsSync } from 'node:fs';
import path from 'node:path';

/**
 * Serves the built planner (PLANNER_DIST): static files, and index.html for any other GET/HEAD
 * outside /api so that client-side routes survive a reload.
 */
export function servePlanner(app: Express, plannerDist: string): void {
  const root = path.resolve(plannerDist);
  const indexHtml = path.join(root, 'index.html');
  if (!existsSync(indexHtml)) throw new Error(`PLANNER_DIST=${plannerDist} has no index.html; build the planner first.`);
  app.use(express.static(root, { index: 'index.html', maxAge: '1h', setHeaders: noCacheForIndex }));
  app.use((req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || req.path === '/api' || req.path.startsWith('/api/')) return next();
    res.set('Cache-Control', 'no-cache');
    // relative to root, so a PLANNER_DIST under a dot-folder (e.g. .millrace/) is still served
    res.sendFile('index.html', { root });
  });
}

function noCacheForIndex(res: express.Response, filePath: string): void {
  if (filePath.endsWith('index.html')) res.set('Cache-Control', 'no-cache');
}
