import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { userSchema, type CreateUserInput, type Role, type UpdateUserInput, type User } from '@shared/schemas/users';
import { apiRequest } from './client';

export interface ListUsersQuery {
  search?: string;
  role?: Role;
}

const userListSchema = z.object({ data: z.array(userSchema) });

export const userKeys = {
  all: ['users'] as const,
  lists: () => [...userKeys.all, 'list'] as const,
  list: (q: ListUsersQuery) => [...userKeys.lists(), q] as const,
};

export const fetchUsers = (q: ListUsersQuery, signal?: AbortSignal): Promise<User[]> =>
  apiRequest('/api/users', userListSchema, { query: { search: q.search?.trim(), role: q.role }, signal }).then((r) => r.data);

export const userQueries = {
  list: (q: ListUsersQuery = {}) =>
    queryOptions({ queryKey: userKeys.list(q), queryFn: ({ signal }) => fetchUsers(q, signal) }),
};

/** Admin only. The server also queues the invitation e-mail. */
export const createUser = (input: CreateUserInput): Promise<User> =>
  apiRequest('/api/users', userSchema, { method: 'POST', body: input });

export const updateUser = (id: string, input: UpdateUserInput): Promise<User> =>
  apiRequest(`/api/users/${encodeURIComponent(id)}`, userSchema, { method: 'PATCH', body: input });
