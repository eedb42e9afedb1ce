import { queryOptions } from '@tanstack/react-query';
import {
  meSchema,
  signInResult,
  type Me,
  type SetPasswordInput,
  type SignInInput,
  type SignInResult,
} from '@shared/schemas/users';
import { apiRequest } from './client';
import { isApiError } from './errors';
import { STALE } from './query-client';

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

/** The signed-in user, or null when nobody is signed in (401 is an answer here, not an error). */
export async function fetchMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await apiRequest('/api/me', meSchema, { signal });
  } catch (e) {
    if (isApiError(e) && e.status === 401) return null;
    throw e;
  }
}

export const sessionQueries = {
  me: () =>
    queryOptions({
      queryKey: sessionKeys.me(),
      queryFn: ({ signal }) => fetchMe(signal),
      staleTime: STALE.session,
    }),
};

export const signIn = (input: SignInInput): Promise<SignInResult> =>
  apiRequest('/api/auth/sign-in', signInResult, { method: 'POST', body: input });

export const signOut = (): Promise<void> => apiRequest('/api/auth/sign-out', null, { method: 'POST' });

export const setPassword = (input: SetPasswordInput): Promise<SignInResult> =>
  apiRequest('/api/auth/set-password', signInResult, { method: 'POST', body: input });
