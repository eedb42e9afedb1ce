// The sign-off workflow: what waits for me (inbox), the sign-off record of a request and its check,
// and taking an action (sign, send back, record the cut...). Taking an action sends the version
// the signer saw (optimistic locking) and an Idempotency-Key, so a retried or doubled press never
// signs twice.
import { queryOptions } from '@tanstack/react-query';
import { requestDetailSchema, type RequestDetail } from '@shared/schemas/change-requests';
import { inboxResponseSchema } from '@shared/schemas/inbox';
import { takeActionResponseSchema, type TakeActionInput, type TakeActionResponse } from '@shared/schemas/request-actions';
import { signOffListResponseSchema, verifyResultSchema } from '@shared/schemas/sign-offs';
import { apiRequest } from './client';
import { isApiError } from './errors';

export const workflowKeys = {
  all: ['workflow'] as const,
  inbox: () => [...workflowKeys.all, 'inbox'] as const,
  signOffs: (requestId: string) => [...workflowKeys.all, 'sign-offs', requestId] as const,
  verify: (requestId: string) => [...workflowKeys.all, 'verify', requestId] as const,
};

const path = (requestId: string, rest: string) => `/api/requests/${encodeURIComponent(requestId)}${rest}`;

export const workflowQueries = {
  inbox: () =>
    queryOptions({
      queryKey: workflowKeys.inbox(),
      queryFn: ({ signal }) => apiRequest('/api/inbox', inboxResponseSchema, { signal }),
    }),
  signOffs: (requestId: string) =>
    queryOptions({
      queryKey: workflowKeys.signOffs(requestId),
      queryFn: ({ signal }) => apiRequest(path(requestId, '/sign-offs'), signOffListResponseSchema, { signal }),
    }),
  /** Recomputes the hash chain on the server: always asked fresh (staleTime 0, never kept long). */
  verify: (requestId: string) =>
    queryOptions({
      queryKey: workflowKeys.verify(requestId),
      queryFn: ({ signal }) => apiRequest(path(requestId, '/sign-offs/verify'), verifyResultSchema, { signal }),
      staleTime: 0,
      gcTime: 60_000,
    }),
};

/**
 * Takes an action. `idempotencyKey` names the user's intent: send a fresh one per intent and the
 * SAME one when the press is repeated or retried (the server then answers with the first result).
 */
export const takeRequestAction = (requestId: string, input: TakeActionInput, idempotencyKey: string): Promise<TakeActionResponse> =>
  apiRequest(path(requestId, '/actions'), takeActionResponseSchema, {
    method: 'POST',
    body: input,
    headers: { 'Idempotency-Key': idempotencyKey },
  });

/** A refusal because the request moved on: someone else acted first (409 stale_version or wrong_state). */
export const isMovedOn = (e: unknown): boolean => isApiError(e) && e.status === 409 && (e.code === 'stale_version' || e.code === 'wrong_state');

/** The fresh request a 409 carries in `error.current`, checked against the shared schema (null when absent or malformed). */
export function currentOf(e: unknown): RequestDetail | null {
  if (!isApiError(e) || !e.details) return null;
  const parsed = requestDetailSchema.safeParse(e.details.current);
  return parsed.success ? parsed.data : null;
}

/**
 * A new UUID (v4) for an Idempotency-Key. `crypto.randomUUID` exists only in secure contexts, and
 * a plain-HTTP install on a LAN address is not one, so fall back to `getRandomValues`.
 */
export function newIdempotencyKey(): string {
  const c = globalThis.crypto;
  if (c && typeof c.randomUUID === 'function') {
    try {
      return c.randomUUID();
    } catch {
      // not a secure context: fall through
    }
  }
  const bytes = new Uint8Array(16);
  if (c && typeof c.getRandomValues === 'function') c.getRandomValues(bytes);
  else for (let i = 0; i < 16; i += 1) bytes[i] = Math.floor(Math.random() * 256);
  bytes[6] = (bytes[6]! & 0x0f) | 0x40;
  bytes[8] = (bytes[8]! & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
