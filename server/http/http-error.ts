/** An error with an HTTP status that the error middleware turns into `{ error: { code, message, field } }`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, field?: string) => new HttpError(400, 'bad_request', message, field);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'Resource') => new HttpError(404, 'not_found', `${what} not found.`);
export const conflict = (message: string, code = 'conflict') => new HttpError(409, code, message);
