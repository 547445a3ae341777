import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';

import { HttpError } from './http-error.ts';
import { zodToHttpError } from './validate.ts';

/** Maps every error to the JSON error body; never leaks a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let httpError: HttpError;
  if (err instanceof HttpError) httpError = err;
  else if (err instanceof ZodError) httpError = zodToHttpError(err, 'body');
  else if (err?.type === 'entity.parse.failed') httpError = new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
  else if (err?.type === 'entity.too.large') httpError = new HttpError(413, 'too_large', 'The request body is too large.');
  else if (err?.code === 'P0001') httpError = new HttpError(409, 'immutable', String(err.message));
  else if (err?.code === '23505') httpError = new HttpError(409, 'duplicate', 'That record already exists.');
  else {
    req.log?.error({ err }, 'unhandled error');
    httpError = new HttpError(500, 'internal', 'Something went wrong on the server. The error was logged.');
  }
  if (res.headersSent) return;
  const body: { code: string; message: string; field?: string } = { code: httpError.code, message: httpError.message };
  if (httpError.field) body.field = httpError.field;
  res.status(httpError.status).json({ error: body });
};
