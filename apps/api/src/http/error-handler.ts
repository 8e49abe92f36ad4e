import type { ErrorRequestHandler } from 'express';
import type { ErrorBody } from '@millrace/contracts';
import { z } from 'zod';
import { AppError } from './app-error';
import { dbUnavailableMessage, isDbUnavailableError } from './db-unavailable';
import { fieldsFromZod } from './zod-fields';

interface BodyParserError {
  type?: string;
  status?: number;
  expose?: boolean;
  limit?: number;
}

/** Maps anything thrown to one JSON error body; never leaks a stack trace. */
export function toErrorResponse(err: unknown): { status: number; body: ErrorBody; headers?: Record<string, string> } {
  if (err instanceof AppError) {
    const error: ErrorBody['error'] = { code: err.code, message: err.message };
    if (err.fields) error.fields = err.fields;
    if (err.issues) error.issues = err.issues;
    return { status: err.status, body: { error }, headers: err.headers };
  }
  if (err instanceof z.ZodError) {
    return {
      status: 400,
      body: { error: { code: 'validation_failed', message: 'Some fields are not valid.', fields: fieldsFromZod(err) } },
    };
  }
  const bp = (err ?? {}) as BodyParserError;
  if (bp.type === 'entity.too.large') {
    return {
      status: 413,
      body: { error: { code: 'payload_too_large', message: `The request body is larger than the ${formatBytes(bp.limit)} limit.` } },
    };
  }
  if (bp.type === 'entity.parse.failed') {
    return { status: 400, body: { error: { code: 'validation_failed', message: 'The request body is not valid JSON.' } } };
  }
  if (bp.type === 'encoding.unsupported' || bp.type === 'charset.unsupported') {
    return { status: 415, body: { error: { code: 'validation_failed', message: 'Send the body as UTF-8 JSON.' } } };
  }
  if (isDbUnavailableError(err)) {
    return { status: 503, body: { error: { code: 'db_unavailable', message: dbUnavailableMessage } }, headers: { 'Retry-After': '5' } };
  }
  if (typeof bp.status === 'number' && bp.status >= 400 && bp.status < 500 && bp.expose) {
    return { status: bp.status, body: { error: { code: 'validation_failed', message: 'The request could not be read.' } } };
  }
  return { status: 500, body: { error: { code: 'internal_error', message: 'Something went wrong on our side. It has been logged.' } } };
}

function formatBytes(limit?: number): string {
  if (!limit) return 'allowed';
  return limit >= 1024 * 1024 ? `${Math.round(limit / 1024 / 1024)} MB` : `${Math.round(limit / 1024)} kB`;
}

export interface ErrorLogger {
  error(message: string, err: unknown): void;
}

export function errorHandler(logger: ErrorLogger = console): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const { status, body, headers } = toErrorResponse(err);
    if (status >= 500 && status !== 503) logger.error(`${req.method} ${req.originalUrl} failed`, err);
    if (status === 503) logger.error(`${req.method} ${req.originalUrl}: database unavailable`, (err as Error)?.message ?? err);
    if (headers) res.set(headers);
    res.status(status).json(body);
  };
}
