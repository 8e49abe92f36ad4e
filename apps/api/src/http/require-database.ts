import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { DatabaseNotReadyError } from './db-unavailable';

/**
 * While the data source has not been initialised yet (the server retries in the background),
 * every request that needs the database gets 503 `db_unavailable` instead of a crash.
 */
export function requireDatabase(dataSource: DataSource): RequestHandler {
  return (_req, _res, next) => {
    next(dataSource.isInitialized ? undefined : new DatabaseNotReadyError());
  };
}
