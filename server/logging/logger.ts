import type { IncomingMessage, ServerResponse } from 'node:http';

import { type DestinationStream, type Logger, pino, stdSerializers } from 'pino';

/**
 * Secrets that must never reach a log line: credentials in headers and cookies, passwords and
 * tokens in bodies (logged by anyone, at any depth up to three levels), and session cookies set in
 * responses. pino's redaction replaces each with REDACTED.
 */
const SECRET_FIELDS = ['password', 'currentPassword', 'newPassword', 'token', 'authorization', 'cookie', 'secret'];
export const REDACT_PATHS = [
  'req.headers.authorization',
  'req.headers.cookie',
  'req.headers["x-csrf-token"]',
  'res.headers["set-cookie"]',
  ...SECRET_FIELDS.flatMap((f) => [f, `*.${f}`, `*.*.${f}`, `*.*.*.${f}`]),
];

export const REDACTED = '[redacted]';

/** URL segments that are secrets themselves: invitation links carry their token in the path. */
const SECRET_PATH = /(\/(?:api\/invitations|invite)\/)[^/?#\s]+/g;
/** Query parameters that carry secrets. */
const SECRET_QUERY = /([?&](?:token|access_token|password)=)[^&#\s]+/gi;
/** JSON web tokens anywhere in free text (error messages, stack traces). */
const JWT = /eyJ[A-Za-z0-9_-]{5,}\.[A-Za-z0-9_-]{5,}\.[A-Za-z0-9_-]{5,}/g;

/** Replaces tokens in a URL or message with REDACTED. */
export function redactText(text: string): string {
  return text.replace(SECRET_PATH, `$1${REDACTED}`).replace(SECRET_QUERY, `$1${REDACTED}`).replace(JWT, REDACTED);
}

/** Scrubs an error's message and stack (an Error, or one pino-http already serialized). */
function serializeError(err: unknown): Record<string, unknown> {
  const out = (err instanceof Error ? stdSerializers.err(err) : { ...(err as object) }) as Record<string, unknown>;
  for (const key of ['message', 'stack'] as const) {
    if (typeof out[key] === 'string') out[key] = redactText(out[key]);
  }
  // Query errors carry their bound parameters (hashes, e-mails): the message names the query already.
  delete out.params;
  return out;
}

/**
 * Serializers for pino-http (given the raw request and response: `wrapSerializers: false`). A request
 * line says who asked for what and how it ended: id, method, redacted URL, client address, status.
 * Headers are left out: they carry the session token and cookies, and serialising and redacting
 * them on every request took about a sixth of the server's busy time in a CPU profile under
 * npm run bench:api, besides the garbage it left.
 */
export const httpLogSerializers = {
  req: (req: IncomingMessage & { id?: unknown; originalUrl?: string }) => ({
    id: req.id,
    method: req.method,
    url: redactText(req.originalUrl ?? req.url ?? ''),
    remoteAddress: req.socket?.remoteAddress,
  }),
  res: (res: ServerResponse) => ({ statusCode: res.statusCode }),
  err: serializeError,
};

/** The server's logger; `destination` lets tests capture the output. */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = { level, redact: { paths: REDACT_PATHS, censor: REDACTED }, serializers: { err: serializeError } };
  return destination ? pino(options, destination) : pino(options);
}
