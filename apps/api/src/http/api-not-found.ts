import type { RequestHandler } from 'express';
import { AppError } from './app-error';

/** Deny by default: any /api path no router answered is a JSON 404. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(AppError.notFound(`There is no API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};
