import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import {
  brandSchema,
  factorySchema,
  type Brand,
  type CreateBrandInput,
  type CreateFactoryInput,
  type Factory,
} from '@shared/schemas/organisation';
import { apiRequest } from './client';
import { STALE } from './query-client';

export const brandKeys = { all: ['brands'] as const, list: () => [...brandKeys.all, 'list'] as const };
export const factoryKeys = { all: ['factories'] as const, list: () => [...factoryKeys.all, 'list'] as const };

const brandList = z.object({ data: z.array(brandSchema) });
const factoryList = z.object({ data: z.array(factorySchema) });

export const organisationQueries = {
  brands: () =>
    queryOptions({
      queryKey: brandKeys.list(),
      queryFn: ({ signal }) => apiRequest('/api/brands', brandList, { signal }).then((r) => r.data),
      staleTime: STALE.reference,
    }),
  factories: () =>
    queryOptions({
      queryKey: factoryKeys.list(),
      queryFn: ({ signal }) => apiRequest('/api/factories', factoryList, { signal }).then((r) => r.data),
      staleTime: STALE.reference,
    }),
};

export const createBrand = (input: CreateBrandInput): Promise<Brand> =>
  apiRequest('/api/brands', brandSchema, { method: 'POST', body: input });

export const createFactory = (input: CreateFactoryInput): Promise<Factory> =>
  apiRequest('/api/factories', factorySchema, { method: 'POST', body: input });
