import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Brand, Factory } from '@shared/schemas/organisation';
import type { UpdateUserInput, User } from '@shared/schemas/users';
import { brandKeys, createBrand, createFactory, factoryKeys, organisationQueries } from '@/api/organisation';
import { createUser, updateUser, userKeys, userQueries, type ListUsersQuery } from '@/api/users';

export const useUsers = (q: ListUsersQuery = {}) => useQuery({ ...userQueries.list(q), placeholderData: (prev) => prev });
export const useBrands = () => useQuery(organisationQueries.brands());
export const useFactories = () => useQuery(organisationQueries.factories());

/** One user, read from the full list (the API has no single-user read). */
export function useUser(id: string) {
  return useQuery({ ...userQueries.list({}), select: (users: User[]) => users.find((u) => u.id === id) ?? null });
}

export function useCreateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}

export function useUpdateUser(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateUserInput) => updateUser(id, input),
    onSuccess: (user) => {
      // Patch every cached list at once, then refetch in the background.
      qc.setQueriesData<User[]>({ queryKey: userKeys.lists() }, (old) => old?.map((u) => (u.id === user.id ? user : u)));
      return qc.invalidateQueries({ queryKey: userKeys.lists() });
    },
  });
}

export function useCreateBrand() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createBrand,
    onSuccess: (brand) => {
      qc.setQueryData<Brand[]>(brandKeys.list(), (old) => (old ? [...old, brand].sort((a, b) => a.name.localeCompare(b.name)) : old));
      return qc.invalidateQueries({ queryKey: brandKeys.all });
    },
  });
}

export function useCreateFactory() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createFactory,
    onSuccess: (factory) => {
      qc.setQueryData<Factory[]>(factoryKeys.list(), (old) => (old ? [...old, factory].sort((a, b) => a.name.localeCompare(b.name)) : old));
      return qc.invalidateQueries({ queryKey: factoryKeys.all });
    },
  });
}
