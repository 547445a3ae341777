import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';

import { HttpError } from './http-error.ts';
import { findUnsafeText } from './unsafe-text.ts';

/** Turns a zod failure into a 400 that names the first field at fault. */
export function zodToHttpError(error: z.ZodError, where: 'body' | 'query' | 'params', code = 'invalid_' + where): HttpError {
  const issue = error.issues[0];
  const field = issue?.path.length ? issue.path.map(String).join('.') : undefined;
  const message = field ? `${field}: ${issue.message}` : (issue?.message ?? `Invalid ${where}.`);
  // A schema may name its own code for an issue (e.g. `limit_exceeded`) through the issue's params.
  const own = issue?.code === 'custom' ? (issue.params as { code?: unknown } | undefined)?.code : undefined;
  return new HttpError(400, typeof own === 'string' ? own : code, message, field);
}

interface Schemas<B extends z.ZodType, Q extends z.ZodType, P extends z.ZodType> {
  body?: B;
  query?: Q;
  params?: P;
}

/** Where validate() leaves the parsed query and params (Express 5's `req.query` is read-only). */
export interface Validated<Q, P> extends Record<string, unknown> {
  query: Q;
  params: P;
}

/** A handler after validate(): `req.body` is the parsed body, `res.locals.query` / `.params` the parsed rest. */
export type ValidatedHandler<B extends z.ZodType, Q extends z.ZodType, P extends z.ZodType> =
  RequestHandler<Record<string, string>, unknown, z.output<B>, Request['query'], Validated<z.output<Q>, z.output<P>>>;

/** 400 for the first NUL or unpaired surrogate in the request's params, query or body (schemas or not). */
export function unsafeTextError(req: Pick<Request, 'params' | 'query' | 'body'>): HttpError | null {
  const parts = [['params', req.params], ['query', req.query], ['body', req.body]] as const;
  for (const [where, value] of parts) {
    const found = findUnsafeText(value);
    if (found) {
      const field = found.field || where;
      return new HttpError(400, 'invalid_' + where, `${field}: ${found.reason}.`, field);
    }
  }
  return null;
}

/**
 * The one place requests are validated. Every text in params, query and body is checked for NUL
 * and unpaired surrogates first (PostgreSQL cannot store them), whatever the schemas. The parsed body
 * replaces `req.body`; the parsed query and params are kept in `res.locals.query` / `res.locals.params`
 * (Express 5's `req.query` is read-only). The handlers after it get those types, so routes never cast
 * request data. `bodyError` names the 400's code for a body that fails (default `invalid_body`).
 */
export function validate<B extends z.ZodType = z.ZodUnknown, Q extends z.ZodType = z.ZodUnknown, P extends z.ZodType = z.ZodUnknown>(
  schemas: Schemas<B, Q, P>, opts: { bodyError?: string } = {},
): ValidatedHandler<B, Q, P> {
  return (req, res, next) => {
    const unsafe = unsafeTextError(req);
    if (unsafe) return next(unsafe);
    if (schemas.params) {
      const r = schemas.params.safeParse(req.params);
      if (!r.success) return next(zodToHttpError(r.error, 'params'));
      res.locals.params = r.data;
    }
    if (schemas.query) {
      const r = schemas.query.safeParse(req.query);
      if (!r.success) return next(zodToHttpError(r.error, 'query'));
      res.locals.query = r.data;
    }
    if (schemas.body) {
      const r = schemas.body.safeParse(req.body ?? {});
      if (!r.success) return next(zodToHttpError(r.error, 'body', opts.bodyError));
      req.body = r.data;
    }
    next();
  };
}
