import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';

import { StoredDataError } from '../../db/stored-json.ts';
import { DATABASE_RETRY_AFTER_S, isDatabaseUnavailable } from './database-unavailable.ts';
import { HttpError } from './http-error.ts';
import { unfinishedSimulation } from './unfinished-simulation.ts';
import { zodToHttpError } from './validate.ts';

/** The PostgreSQL error behind an error (drizzle wraps driver errors in DrizzleQueryError with `cause`). */
function pgError(err: unknown): { code?: string; message?: string } | undefined {
  for (let e = err, depth = 0; e && typeof e === 'object' && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    if (typeof (e as { code?: unknown }).code === 'string') return e;
  }
  return undefined;
}

/** Maps every error to the JSON error body; never leaks a stack trace. */
export const errorHandler: ErrorRequestHandler = (thrown, req, res, _next) => {
  const err: unknown = thrown;
  // body-parser marks its own errors with a `type`.
  const parserType = err && typeof err === 'object' && 'type' in err ? err.type : undefined;
  let httpError: HttpError;
  if (err instanceof HttpError) {
    httpError = err;
    // A 500 we name ourselves (a stored value that cannot be read) is still a fault to look into.
    if (err.status === 500) req.log?.error({ err }, err.message);
  }
  else if (err instanceof StoredDataError) {
    // Like an unreadable stored version: the fault is ours, named (row, column, field) and logged.
    req.log?.error({ err }, err.message);
    httpError = new HttpError(500, 'stored_value_unreadable', `A stored value cannot be read: ${err.message}.`);
  }
  else if (err instanceof ZodError) httpError = zodToHttpError(err, 'body');
  else if (parserType === 'entity.parse.failed') httpError = new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
  else if (parserType === 'entity.too.large') httpError = new HttpError(413, 'too_large', 'The request body is too large.');
  else if (pgError(err)?.code === 'P0001') httpError = new HttpError(409, 'immutable', String(pgError(err)?.message));
  else if (pgError(err)?.code === '23505') httpError = new HttpError(409, 'duplicate', 'That record already exists.');
  else if (unfinishedSimulation(err)) httpError = unfinishedSimulation(err)!;
  else if (isDatabaseUnavailable(err)) {
    req.log?.warn({ err: { message: err instanceof Error ? err.message : undefined, code: pgError(err)?.code } }, 'database unavailable');
    res.setHeader('Retry-After', String(DATABASE_RETRY_AFTER_S));
    httpError = new HttpError(503, 'database_unavailable', `The database is unavailable for a moment. Try again in ${DATABASE_RETRY_AFTER_S} seconds.`);
  } else {
    req.log?.error({ err }, 'unhandled error');
    httpError = new HttpError(500, 'internal', 'Something went wrong on the server. The error was logged.');
  }
  if (res.headersSent) return;
  const body: { code: string; message: string; field?: string } = { code: httpError.code, message: httpError.message };
  if (httpError.field) body.field = httpError.field;
  res.status(httpError.status).json({ error: body });
};
