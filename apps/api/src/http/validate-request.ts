import type { RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { AppError } from './app-error';
import { fieldsFromZod } from './zod-fields';

type Schema = z.ZodType;
export interface RequestSchemas {
  body?: Schema;
  query?: Schema;
  params?: Schema;
}

type Out<S> = S extends Schema ? z.output<S> : undefined;
export interface ValidInput<S extends RequestSchemas> {
  body: Out<S['body']>;
  query: Out<S['query']>;
  params: Out<S['params']>;
}

/** The middleware, plus `.from(res)` to read the parsed, typed input in the handler. */
export type Validator<S extends RequestSchemas> = RequestHandler & { from(res: Response): ValidInput<S> };

const inputKey = 'validInput';

/**
 * Parses body, query and params with zod (use strict objects so unknown fields are rejected).
 * Any failure answers 400 `validation_failed` with every bad field by path: body fields as they
 * are (`rows.3.qty`, so forms can map them), query and params prefixed (`query.week`, `params.id`).
 * Parsed values are kept in res.locals (Express 5's req.query is read-only); req.body is also
 * replaced by the parsed body.
 *
 *   const input = validate({ body: personCreateSchema });
 *   router.post('/api/people', allow('admin'), input, async (req, res) => {
 *     const { body } = input.from(res); …
 */
export function validate<S extends RequestSchemas>(schemas: S): Validator<S> {
  const middleware: RequestHandler = (req, res, next) => {
    const fields: ReturnType<typeof fieldsFromZod> = [];
    const result: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const raw = part === 'body' ? (req.body ?? {}) : part === 'query' ? { ...req.query } : { ...req.params };
      const parsed = schema.safeParse(raw);
      if (parsed.success) result[part] = parsed.data;
      else fields.push(...fieldsFromZod(parsed.error, part === 'body' ? undefined : part));
    }
    if (fields.length > 0) {
      next(AppError.validation(describe(fields.length), fields));
      return;
    }
    res.locals[inputKey] = result;
    if (schemas.body) req.body = result.body;
    next();
  };
  return Object.assign(middleware, {
    from(res: Response): ValidInput<S> {
      const input = res.locals[inputKey] as ValidInput<S> | undefined;
      if (!input) throw new Error('validate(...).from(res) called on a route that did not run this validator');
      return input;
    },
  });
}

function describe(count: number): string {
  return count === 1 ? 'One field is not valid.' : `${count} fields are not valid.`;
}
