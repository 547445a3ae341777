import { type ApiErrorBody, apiErrorSchema } from '../../shared/contracts/api-error.ts';

/** The `error` of an API error response, checked against the error contract every route answers with. */
export function apiError(res: { body: unknown }): ApiErrorBody['error'] {
  return apiErrorSchema.parse(res.body).error;
}

/** The error code of a response that may or may not be an API error. */
export function errorCode(res: { body: unknown }): string | undefined {
  const parsed = apiErrorSchema.safeParse(res.body);
  return parsed.success ? parsed.data.error.code : undefined;
}

/**
 * A response's JSON read as the type the web client reads it as (the views in shared/contracts, or
 * the shape a test spells out); the test's expectations then check the values.
 */
export function bodyOf<T>(res: { body: unknown }): T {
  return res.body as T;
}
