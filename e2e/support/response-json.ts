import type { APIResponse } from '@playwright/test';

import { type ApiErrorBody, apiErrorSchema } from '../../shared/contracts/api-error.ts';

/** A response's JSON read as the type the web client reads it as (the views in shared/contracts). */
export async function jsonOf<T>(res: APIResponse): Promise<T> {
  return (await res.json()) as T;
}

/** The `error` of an API error response, checked against the error contract every route answers with. */
export async function apiErrorOf(res: APIResponse): Promise<ApiErrorBody['error']> {
  return apiErrorSchema.parse(await res.json()).error;
}
