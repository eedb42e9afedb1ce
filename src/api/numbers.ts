// The numbers behind a change request (estimate, plan, computed figures) and a tool's life against
// all its open plans. Saving moves the request's version on, so the request's own caches are
// refreshed by the feature hooks (src/features/numbers/hooks.ts).
import { queryOptions } from '@tanstack/react-query';
import { requestNumbersSchema, toolOpenPlansSchema, type RequestNumbers, type SaveNumbersInput, type ToolOpenPlans } from '@shared/schemas/numbers';
import { apiRequest } from './client';
import { isApiError, type ApiError } from './errors';

export const numbersKeys = {
  all: ['numbers'] as const,
  request: (id: string) => [...numbersKeys.all, 'request', id] as const,
  openPlans: (toolId: string) => [...numbersKeys.all, 'open-plans', toolId] as const,
};

export const fetchRequestNumbers = (id: string, signal?: AbortSignal): Promise<RequestNumbers> =>
  apiRequest(`/api/requests/${encodeURIComponent(id)}/numbers`, requestNumbersSchema, { signal });

export const fetchToolOpenPlans = (toolId: string, signal?: AbortSignal): Promise<ToolOpenPlans> =>
  apiRequest(`/api/tools/${encodeURIComponent(toolId)}/open-plans`, toolOpenPlansSchema, { signal });

export const numbersQueries = {
  request: (id: string) => queryOptions({ queryKey: numbersKeys.request(id), queryFn: ({ signal }) => fetchRequestNumbers(id, signal) }),
  openPlans: (toolId: string) => queryOptions({ queryKey: numbersKeys.openPlans(toolId), queryFn: ({ signal }) => fetchToolOpenPlans(toolId, signal) }),
};

/** The answer to a stale save: the server's words plus the figures as they are now. */
export class StaleNumbersError extends Error {
  readonly current: RequestNumbers | null;
  readonly apiError: ApiError;
  constructor(apiError: ApiError, current: RequestNumbers | null) {
    super(apiError.message);
    this.name = 'StaleNumbersError';
    this.apiError = apiError;
    this.current = current;
  }
}

export const isStaleNumbersError = (e: unknown): e is StaleNumbersError => e instanceof StaleNumbersError;

/** PUT with the request version the engineer saw; a 409 stale_version comes back with the current figures. */
export async function saveRequestNumbers(id: string, input: SaveNumbersInput): Promise<RequestNumbers> {
  try {
    return await apiRequest(`/api/requests/${encodeURIComponent(id)}/numbers`, requestNumbersSchema, { method: 'PUT', body: input });
  } catch (e) {
    if (isApiError(e) && e.status === 409 && e.code === 'stale_version') {
      throw new StaleNumbersError(e, await fetchRequestNumbers(id).catch(() => null));
    }
    throw e;
  }
}
