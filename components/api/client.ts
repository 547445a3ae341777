import type { ApiErrorBody } from '@/shared/contracts/api-error';

/**
 * Whether a parsed response body has the shape of apiErrorSchema (shared/contracts/api-error.ts).
 * A plain check, not zod: every screen's API client uses it, including sign-in, whose first load
 * should not carry the zod runtime. A test checks it agrees with apiErrorSchema.
 */
export function isApiErrorBody(json: unknown): json is ApiErrorBody {
  if (typeof json !== 'object' || json === null) return false;
  const e = (json as { error?: unknown }).error;
  if (typeof e !== 'object' || e === null) return false;
  const { code, message, field } = e as Record<string, unknown>;
  return typeof code === 'string' && typeof message === 'string' && (field === undefined || typeof field === 'string');
}

/** An API failure: HTTP status plus the server's `{ error: { code, message, field? } }` body. */
export class ApiError extends Error {
  /** HTTP status (0 when the server could not be reached). */
  readonly status: number;
  /** Machine code from the server, e.g. `invitation_invalid`, `email_taken`, `network`. */
  readonly code: string;
  /** The request field at fault, when the server names one (e.g. `email`). */
  readonly field?: string;

  constructor(status: number, code: string, message: string, field?: string) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.field = field;
  }
}

/** Options of {@link apiFetch}. */
export interface ApiFetchOptions {
  /** HTTP method; default GET. */
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** Sent as JSON. */
  body?: unknown;
  /** Appended as a query string; undefined and '' values are left out. */
  query?: Record<string, string | number | boolean | undefined | null>;
  signal?: AbortSignal;
}

/** Builds `/api/...?a=1` from a path and a query object, leaving out empty values. */
export function apiUrl(path: string, query?: ApiFetchOptions['query']): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query ?? {})) {
    if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  }
  const qs = params.toString();
  return `/api${path}${qs ? `?${qs}` : ''}`;
}

/**
 * Calls the Holonaut API on the same origin (the session cookie rides along) and returns the parsed
 * JSON body, or undefined for 204. Throws {@link ApiError} for any non-2xx status or network failure.
 */
export async function apiFetch<T>(path: string, options: ApiFetchOptions = {}): Promise<T> {
  const { method = 'GET', body, query, signal } = options;
  let res: Response;
  try {
    res = await fetch(apiUrl(path, query), {
      method,
      credentials: 'same-origin',
      headers: body === undefined ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    throw new ApiError(0, 'network', 'Holonaut could not reach its server. Check the connection and try again.');
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let json: unknown = undefined;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    // A proxy's HTML error page: fall through to the generic message below.
  }
  if (!res.ok) {
    if (isApiErrorBody(json)) {
      const { code, message, field } = json.error;
      throw new ApiError(res.status, code, message, field);
    }
    throw new ApiError(res.status, 'http_error', `The server answered ${res.status} ${res.statusText || ''}`.trim() + '.');
  }
  return json as T;
}

/** A sentence for people from any thrown value (ApiError, Error, string). */
export function errorMessage(error: unknown): string {
  if (error instanceof Error) return error.message;
  if (typeof error === 'string') return error;
  return 'Something went wrong.';
}

/** True when the error is an ApiError with one of the given statuses. */
export function isApiStatus(error: unknown, ...statuses: number[]): error is ApiError {
  return error instanceof ApiError && statuses.includes(error.status);
}
