import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UpdateProductInput } from '@shared/schemas/registry';
import { organisationQueries } from '@/api/organisation';
import { productKeys, productQueries, toolKeys, updateProduct, type ProductFilters } from '@/api/registry';
import { useSession } from '@/lib/session';

export const useProductList = (f: ProductFilters) => useInfiniteQuery({ ...productQueries.list(f), placeholderData: (prev) => prev });
export const useProduct = (id: string) => useQuery(productQueries.detail(id));
export const useBrands = () => useQuery(organisationQueries.brands());


/** Engineers and admins write to the registry; everyone else reads. */
export function useCanEditRegistry(): boolean {
  const { data: me } = useSession();
  return me?.role === 'engineer' || me?.role === 'admin';
}

/** Saves a product; its detail and every list (products and tools) are refreshed. */
export function useUpdateProduct(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateProductInput) => updateProduct(id, input),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: productKeys.all }), qc.invalidateQueries({ queryKey: toolKeys.details() })]),
  });
}
