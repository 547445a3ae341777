import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';

import { HttpError } from './http-error.ts';
import { findUnsafeText } from './unsafe-text.ts';

/** Turns a zod failure into a 400 that names the first field at fault. */
export function zodToHttpError(error: z.ZodError, where: 'body' | 'query' | 'params'): HttpError {
  const issue = error.issues[0];
  const field = issue?.path.length ? issue.path.map(String).join('.') : undefined;
  const message = field ? `${field}: ${issue.message}` : (issue?.message ?? `Invalid ${where}.`);
  return new HttpError(400, 'invalid_' + where, message, field);
}

interface Schemas<B extends z.ZodType, Q extends z.ZodType, P extends z.ZodType> {
  body?: B;
  query?: Q;
  params?: P;
}

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
 * and unpaired surrogates first (PostgreSQL cannot store them), whatever the schemas. Parsed body replaces `req.body`; parsed query and params
 * are kept in `res.locals.query` / `res.locals.params` (Express 5's `req.query` is read-only).
 */
export function validate<B extends z.ZodType, Q extends z.ZodType, P extends z.ZodType>(schemas: Schemas<B, Q, P>) {
  return (req: Request, res: Response, next: NextFunction) => {
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
      if (!r.success) return next(zodToHttpError(r.error, 'body'));
      req.body = r.data;
    }
    next();
  };
}
