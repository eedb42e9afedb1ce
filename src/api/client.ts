// The only fetch caller in the app. Same-origin cookie session (credentials: 'include'); every
// success body is parsed with the shared zod schema; every failure becomes an ApiError.
import type { z } from 'zod';
import { apiErrorSchema } from '@shared/errors';
import { env } from '@/config/env';
import { ApiError, BAD_DATA_MESSAGE, NETWORK_MESSAGE } from './errors';

export interface ApiInit {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  /** Sent as JSON. */
  body?: unknown;
  query?: Record<string, string | number | boolean | undefined | null>;
  signal?: AbortSignal;
  headers?: Record<string, string>;
  /** Sent as is with its own content type (e.g. a CSV file) instead of a JSON body. */
  text?: { body: string; contentType: string };
}

export function apiUrl(path: string, query?: ApiInit['query']): string {
  const qs = query
    ? Object.entries(query)
        .filter(([, v]) => v !== undefined && v !== null && v !== '')
        .map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(String(v))}`)
        .join('&')
    : '';
  return `${env.EXPO_PUBLIC_API_URL}${path}${qs ? `?${qs}` : ''}`;
}

/** Turns a non-2xx answer (already read as text) into an ApiError. */
export function errorFromResponse(status: number, text: string): ApiError {
  let body: unknown;
  try {
    body = text ? JSON.parse(text) : undefined;
  } catch {
    body = undefined;
  }
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fieldErrors } = parsed.data.error;
    // Keep the rest of the error body (e.g. `current` on stale_version) for screens that use it.
    return new ApiError(status, code, message, fieldErrors, (body as { error: Record<string, unknown> }).error);
  }
  if (status === 401) return new ApiError(status, 'unauthorized', 'Sign in to continue.');
  if (status === 403) return new ApiError(status, 'forbidden', 'Your role may not do this.');
  if (status === 404) return new ApiError(status, 'not_found', 'Not found.');
  if (status >= 500) return new ApiError(status, 'unavailable', 'Toolgate is not answering properly right now. Try again in a minute.');
  return new ApiError(status, 'bad_data', BAD_DATA_MESSAGE);
}

/** Parses a 2xx body; `schema: null` means the answer has no body (204). */
export function parseSuccess<S extends z.ZodType>(status: number, text: string, schema: S | null): z.output<S> | undefined {
  if (schema === null) return undefined;
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new ApiError(status, 'bad_data', BAD_DATA_MESSAGE);
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw new ApiError(status, 'bad_data', BAD_DATA_MESSAGE);
  return parsed.data;
}

export async function apiRequest<S extends z.ZodType>(path: string, schema: S, init?: ApiInit): Promise<z.output<S>>;
export async function apiRequest(path: string, schema: null, init?: ApiInit): Promise<void>;
export async function apiRequest<S extends z.ZodType>(path: string, schema: S | null, init: ApiInit = {}): Promise<z.output<S> | void> {
  const headers: Record<string, string> = { Accept: 'application/json', ...init.headers };
  if (init.body !== undefined) headers['Content-Type'] = 'application/json';
  else if (init.text) headers['Content-Type'] = init.text.contentType;
  let res: Response;
  try {
    res = await fetch(apiUrl(path, init.query), {
      method: init.method ?? (init.body !== undefined || init.text ? 'POST' : 'GET'),
      credentials: 'include',
      headers,
      body: init.body !== undefined ? JSON.stringify(init.body) : init.text?.body,
      signal: init.signal,
    });
  } catch (e) {
    if (e instanceof Error && e.name === 'AbortError') throw e;
    throw new ApiError(0, 'network', NETWORK_MESSAGE);
  }
  let text: string;
  try {
    text = await res.text();
  } catch {
    throw new ApiError(0, 'network', NETWORK_MESSAGE);
  }
  if (!res.ok) throw errorFromResponse(res.status, text);
  return parseSuccess(res.status, text, schema);
}
