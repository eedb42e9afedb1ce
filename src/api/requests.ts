// Change requests: list (keyset pages), detail, the impact context the form computes with, create,
// update (optimistic lock), and image attachments. The pickers for the request form (tools and
// products found by text) live here too, under the request keys, so they never clash with the
// registry screens' own caches.
import { infiniteQueryOptions, queryOptions } from '@tanstack/react-query';
import {
  attachmentSchema,
  impactContextSchema,
  requestDetailSchema,
  requestListResponseSchema,
  type Attachment,
  type AttachmentKind,
  type CreateRequestInput,
  type RequestStatus,
  type RequestDetail,
  type UpdateRequestInput,
} from '@shared/schemas/change-requests';
import { productListResponse, toolListResponse } from '@shared/schemas/registry';
import { apiRequest, apiUrl } from './client';
import { isApiError, type ApiError } from './errors';
import { STALE } from './query-client';
import { uploadWithProgress, type UploadFile } from './upload';

/** The list filters the app sends (cursor and limit are added per page); see listRequestsQuery. */
export interface RequestListFilters {
  status?: RequestStatus;
  toolId?: string;
  brandId?: string;
  mine?: boolean;
  irreversible?: boolean;
  q?: string;
}

export const requestKeys = {
  all: ['requests'] as const,
  lists: () => [...requestKeys.all, 'list'] as const,
  list: (f: RequestListFilters) => [...requestKeys.lists(), f] as const,
  details: () => [...requestKeys.all, 'detail'] as const,
  detail: (id: string) => [...requestKeys.details(), id] as const,
  impactContext: (toolId: string) => [...requestKeys.all, 'impact-context', toolId] as const,
  toolPicker: (q: string) => [...requestKeys.all, 'tool-picker', q] as const,
  productPicker: (q: string) => [...requestKeys.all, 'product-picker', q] as const,
};

const PAGE = 25;

export const fetchRequestPage = (f: RequestListFilters, cursor: string | undefined, signal?: AbortSignal) =>
  apiRequest('/api/requests', requestListResponseSchema, {
    query: {
      status: f.status,
      toolId: f.toolId,
      brandId: f.brandId,
      mine: f.mine === undefined ? undefined : String(f.mine),
      irreversible: f.irreversible === undefined ? undefined : String(f.irreversible),
      q: f.q?.trim() || undefined,
      cursor,
      limit: PAGE,
    },
    signal,
  });

export const fetchRequest = (id: string, signal?: AbortSignal): Promise<RequestDetail> =>
  apiRequest(`/api/requests/${encodeURIComponent(id)}`, requestDetailSchema, { signal });

export const requestQueries = {
  list: (f: RequestListFilters) =>
    infiniteQueryOptions({
      queryKey: requestKeys.list(f),
      queryFn: ({ pageParam, signal }) => fetchRequestPage(f, pageParam, signal),
      initialPageParam: undefined as string | undefined,
      getNextPageParam: (last) => last.meta.nextCursor ?? undefined,
    }),
  detail: (id: string) => queryOptions({ queryKey: requestKeys.detail(id), queryFn: ({ signal }) => fetchRequest(id, signal) }),
  impactContext: (toolId: string) =>
    queryOptions({
      queryKey: requestKeys.impactContext(toolId),
      queryFn: ({ signal }) => apiRequest('/api/requests/impact-context', impactContextSchema, { query: { toolId }, signal }),
    }),
  toolPicker: (q: string) =>
    queryOptions({
      queryKey: requestKeys.toolPicker(q),
      queryFn: ({ signal }) => apiRequest('/api/tools', toolListResponse, { query: { q: q || undefined, limit: 12 }, signal }).then((r) => r.data),
      staleTime: STALE.default,
    }),
  productPicker: (q: string) =>
    queryOptions({
      queryKey: requestKeys.productPicker(q),
      queryFn: ({ signal }) => apiRequest('/api/products', productListResponse, { query: { q: q || undefined, limit: 12 }, signal }).then((r) => r.data),
      staleTime: STALE.default,
    }),
};

export const createRequest = (input: CreateRequestInput): Promise<RequestDetail> =>
  apiRequest('/api/requests', requestDetailSchema, { method: 'POST', body: input });

/** The answer to a stale update: the server's words plus the request as it is now. */
export class StaleRequestError extends Error {
  readonly current: RequestDetail | null;
  readonly apiError: ApiError;
  constructor(apiError: ApiError, current: RequestDetail | null) {
    super(apiError.message);
    this.name = 'StaleRequestError';
    this.apiError = apiError;
    this.current = current;
  }
}

export const isStaleRequestError = (e: unknown): e is StaleRequestError => e instanceof StaleRequestError;

/**
 * PATCH with the version the editor saw. A 409 stale_version becomes a StaleRequestError carrying
 * the current copy (read again, since the shared error shape keeps only code, message and fields).
 */
export async function updateRequest(id: string, input: UpdateRequestInput): Promise<RequestDetail> {
  try {
    return await apiRequest(`/api/requests/${encodeURIComponent(id)}`, requestDetailSchema, { method: 'PATCH', body: input });
  } catch (e) {
    if (isApiError(e) && e.status === 409 && e.code === 'stale_version') {
      const current = await fetchRequest(id).catch(() => null);
      throw new StaleRequestError(e, current);
    }
    throw e;
  }
}

export interface AttachmentUpload {
  file: UploadFile;
  fileName?: string;
  kind: AttachmentKind;
  itemId?: string | null;
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
}

export const uploadRequestAttachment = (requestId: string, u: AttachmentUpload): Promise<Attachment> =>
  uploadWithProgress(`/api/requests/${encodeURIComponent(requestId)}/attachments`, attachmentSchema, {
    file: u.file,
    fileName: u.fileName,
    // Text fields first: the server reads them before the file.
    fields: { kind: u.kind, itemId: u.itemId ?? '' },
    onProgress: u.onProgress,
    signal: u.signal,
  });

export const deleteRequestAttachment = (requestId: string, attachmentId: string): Promise<void> =>
  apiRequest(`/api/requests/${encodeURIComponent(requestId)}/attachments/${encodeURIComponent(attachmentId)}`, null, { method: 'DELETE' });

/** Absolute address of an attachment's bytes or thumbnail (the API may sit on another origin in development). */
export const attachmentSrc = (a: Pick<Attachment, 'url' | 'thumbnailUrl'>, which: 'original' | 'thumbnail' = 'original') =>
  apiUrl(which === 'thumbnail' ? a.thumbnailUrl : a.url);

/** Paper sizes the cut sheet prints on. */
export type CutSheetPaper = 'a4' | 'letter';

/** Address of the request's cut sheet (PDF); the session cookie goes with it. */
export const cutSheetUrl = (requestId: string, paper: CutSheetPaper) => apiUrl(`/api/requests/${encodeURIComponent(requestId)}/cut-sheet.pdf`, { paper });
