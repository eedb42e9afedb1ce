import { useEffect, useState } from 'react';
import { useInfiniteQuery, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { Attachment, CreateRequestInput, RequestDetail, UpdateRequestInput } from '@shared/schemas/change-requests';
import {
  createRequest,
  deleteRequestAttachment,
  requestKeys,
  requestQueries,
  updateRequest,
  type RequestListFilters,
} from '@/api/requests';

export const useRequestList = (f: RequestListFilters) => useInfiniteQuery({ ...requestQueries.list(f), placeholderData: (prev) => prev });
export const useRequest = (id: string, enabled = true) => useQuery({ ...requestQueries.detail(id), enabled: enabled && !!id });
export const useImpactContext = (toolId: string | null) =>
  useQuery({ ...requestQueries.impactContext(toolId ?? ''), enabled: !!toolId });
export const useToolSearch = (q: string) => useQuery({ ...requestQueries.toolPicker(q), placeholderData: (prev) => prev });
export const useProductSearch = (q: string, enabled = true) =>
  useQuery({ ...requestQueries.productPicker(q), placeholderData: (prev) => prev, enabled });

export function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/** Puts a fresh copy of a request in the cache and lets every list refetch. */
export function storeRequest(qc: QueryClient, r: RequestDetail) {
  qc.setQueryData(requestKeys.detail(r.id), r);
  return qc.invalidateQueries({ queryKey: requestKeys.lists() });
}

export function useCreateRequest() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (input: CreateRequestInput) => createRequest(input), onSuccess: (r) => storeRequest(qc, r) });
}

export function useUpdateRequest(id: string) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (input: UpdateRequestInput) => updateRequest(id, input), onSuccess: (r) => storeRequest(qc, r) });
}

/** Adds an uploaded attachment to the cached request at once (no flicker), then refetches it. */
export function addAttachmentToCache(qc: QueryClient, requestId: string, a: Attachment) {
  qc.setQueryData<RequestDetail>(requestKeys.detail(requestId), (old) =>
    old && !old.attachments.some((x) => x.id === a.id) ? { ...old, attachments: [...old.attachments, a] } : old,
  );
  return qc.invalidateQueries({ queryKey: requestKeys.detail(requestId) });
}

export function useDeleteAttachment(requestId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (attachmentId: string) => deleteRequestAttachment(requestId, attachmentId),
    onSuccess: (_v, attachmentId) => {
      qc.setQueryData<RequestDetail>(requestKeys.detail(requestId), (old) =>
        old ? { ...old, attachments: old.attachments.filter((a) => a.id !== attachmentId) } : old,
      );
      return qc.invalidateQueries({ queryKey: requestKeys.detail(requestId) });
    },
  });
}
