// The tool registry: tools, parts, products, the bill of parts, retention and CSV import/export.
// Fetchers, key factories and queryOptions; features own the cache effects (hooks.ts).
import { infiniteQueryOptions, queryOptions } from '@tanstack/react-query';
import {
  billEntrySchema,
  importReportSchema,
  partSchema,
  productDetailSchema,
  productListResponse,
  productSchema,
  retentionDueResponse,
  retentionSettingsSchema,
  toolDetailSchema,
  toolListResponse,
  toolSchema,
  type BillEntry,
  type CreateBillEntryInput,
  type CreatePartInput,
  type CreateProductInput,
  type CreateToolInput,
  type ImportKind,
  type ImportReport,
  type LifeBandValue,
  type Part,
  type Product,
  type ProductStatus,
  type RetentionDecisionInput,
  type Tool,
  type ToolStatus,
  type UpdateBillEntryInput,
  type UpdatePartInput,
  type UpdateProductInput,
  type UpdateToolInput,
} from '@shared/schemas/registry';
import { apiRequest, apiUrl } from './client';
import { STALE } from './query-client';

/** Tool list filters as the screens hold them (the cursor is the query's page parameter). */
export interface ToolFilters {
  q?: string;
  brandId?: string;
  factoryId?: string;
  status?: ToolStatus;
  lifeBand?: LifeBandValue;
  /** Only tools whose keep-or-scrap decision falls due within `retentionDays` (overdue included). */
  retentionDue?: boolean;
  retentionDays?: number;
}

export interface ProductFilters {
  q?: string;
  brandId?: string;
  status?: ProductStatus;
  toolId?: string;
}

export const PAGE_SIZE = 25;

/** Drops empty values so equal filters make equal query keys. */
function clean<T extends object>(f: T): T {
  return Object.fromEntries(Object.entries(f).filter(([, v]) => v !== undefined && v !== '' && v !== false)) as T;
}

const toolQueryString = (f: ToolFilters) => {
  const c = clean({ ...f, q: f.q?.trim() });
  return { ...c, retentionDue: c.retentionDue ? 'true' : undefined };
};

export const toolKeys = {
  all: ['tools'] as const,
  lists: () => [...toolKeys.all, 'list'] as const,
  list: (f: ToolFilters) => [...toolKeys.lists(), clean({ ...f, q: f.q?.trim() })] as const,
  details: () => [...toolKeys.all, 'detail'] as const,
  detail: (id: string) => [...toolKeys.details(), id] as const,
  retentionDue: (days: number) => [...toolKeys.all, 'retention-due', days] as const,
};

export const productKeys = {
  all: ['products'] as const,
  lists: () => [...productKeys.all, 'list'] as const,
  list: (f: ProductFilters) => [...productKeys.lists(), clean({ ...f, q: f.q?.trim() })] as const,
  details: () => [...productKeys.all, 'detail'] as const,
  detail: (id: string) => [...productKeys.details(), id] as const,
};

export const retentionKeys = { settings: () => ['settings', 'retention'] as const };

const id = (s: string) => encodeURIComponent(s);

export const toolQueries = {
  /** Keyset pages of 25: pass `meta.nextCursor` back for the next page. */
  list: (f: ToolFilters = {}) =>
    infiniteQueryOptions({
      queryKey: toolKeys.list(f),
      queryFn: ({ pageParam, signal }) =>
        apiRequest('/api/tools', toolListResponse, { query: { ...toolQueryString(f), cursor: pageParam, limit: PAGE_SIZE }, signal }),
      initialPageParam: undefined as string | undefined,
      getNextPageParam: (last) => last.meta.nextCursor ?? undefined,
    }),
  detail: (toolId: string) =>
    queryOptions({
      queryKey: toolKeys.detail(toolId),
      queryFn: ({ signal }) => apiRequest(`/api/tools/${id(toolId)}`, toolDetailSchema, { signal }),
    }),
  retentionDue: (days = 90) =>
    queryOptions({
      queryKey: toolKeys.retentionDue(days),
      queryFn: ({ signal }) => apiRequest('/api/retention/due', retentionDueResponse, { query: { days }, signal }),
    }),
};

export const productQueries = {
  list: (f: ProductFilters = {}) =>
    infiniteQueryOptions({
      queryKey: productKeys.list(f),
      queryFn: ({ pageParam, signal }) =>
        apiRequest('/api/products', productListResponse, { query: { ...clean({ ...f, q: f.q?.trim() }), cursor: pageParam, limit: PAGE_SIZE }, signal }),
      initialPageParam: undefined as string | undefined,
      getNextPageParam: (last) => last.meta.nextCursor ?? undefined,
    }),
  detail: (productId: string) =>
    queryOptions({
      queryKey: productKeys.detail(productId),
      queryFn: ({ signal }) => apiRequest(`/api/products/${id(productId)}`, productDetailSchema, { signal }),
    }),
};

export const retentionQueries = {
  settings: () =>
    queryOptions({
      queryKey: retentionKeys.settings(),
      queryFn: ({ signal }) => apiRequest('/api/settings/retention', retentionSettingsSchema, { signal }),
      staleTime: STALE.reference,
    }),
};

// Writes (engineers and admins; the server checks)

export const createTool = (input: CreateToolInput): Promise<Tool> => apiRequest('/api/tools', toolSchema, { method: 'POST', body: input });

export const updateTool = (toolId: string, input: UpdateToolInput): Promise<Tool> =>
  apiRequest(`/api/tools/${id(toolId)}`, toolSchema, { method: 'PATCH', body: input });

export const recordRetentionDecision = (toolId: string, input: RetentionDecisionInput): Promise<Tool> =>
  apiRequest(`/api/tools/${id(toolId)}/retention-decision`, toolSchema, { method: 'POST', body: input });

export const createPart = (toolId: string, input: CreatePartInput): Promise<Part> =>
  apiRequest(`/api/tools/${id(toolId)}/parts`, partSchema, { method: 'POST', body: input });

export const updatePart = (partId: string, input: UpdatePartInput): Promise<Part> =>
  apiRequest(`/api/parts/${id(partId)}`, partSchema, { method: 'PATCH', body: input });

export const createProduct = (input: CreateProductInput): Promise<Product> =>
  apiRequest('/api/products', productSchema, { method: 'POST', body: input });

export const updateProduct = (productId: string, input: UpdateProductInput): Promise<Product> =>
  apiRequest(`/api/products/${id(productId)}`, productSchema, { method: 'PATCH', body: input });

export const createBillEntry = (productId: string, input: CreateBillEntryInput): Promise<BillEntry> =>
  apiRequest(`/api/products/${id(productId)}/bill`, billEntrySchema, { method: 'POST', body: input });

export const updateBillEntry = (entryId: string, input: UpdateBillEntryInput): Promise<BillEntry> =>
  apiRequest(`/api/bill-entries/${id(entryId)}`, billEntrySchema, { method: 'PATCH', body: input });

export const deleteBillEntry = (entryId: string): Promise<void> => apiRequest(`/api/bill-entries/${id(entryId)}`, null, { method: 'DELETE' });

/**
 * Checks (dryRun) or applies a CSV. Sent as text/csv, so a file of a few thousand rows fits.
 * A real run with bad rows answers 400 with the report in `error.report` and writes nothing.
 */
export const importRegistryCsv = (kind: ImportKind, csv: string, dryRun: boolean, signal?: AbortSignal): Promise<ImportReport> =>
  apiRequest('/api/registry/import', importReportSchema, {
    method: 'POST',
    query: { kind, dryRun },
    text: { body: csv, contentType: 'text/csv' },
    signal,
  });

/** The report carried by a refused real run (400), if the error has one. */
export function importReportOf(error: unknown): ImportReport | null {
  const details = (error as { details?: Record<string, unknown> } | null)?.details;
  const parsed = importReportSchema.safeParse(details?.report);
  return parsed.success ? parsed.data : null;
}

/** Download addresses (the browser sends the session cookie). */
export const toolsExportUrl = (f: ToolFilters): string => apiUrl('/api/tools/export.csv', toolQueryString(f));
export const importTemplateUrl = (kind: ImportKind): string => apiUrl('/api/registry/import/template', { kind });
