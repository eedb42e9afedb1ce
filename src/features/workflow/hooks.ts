import { useCallback, useState } from 'react';
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { TakeActionInput } from '@shared/schemas/request-actions';
import { numbersKeys } from '@/api/numbers';
import { productKeys, toolKeys, toolQueries } from '@/api/registry';
import { requestKeys } from '@/api/requests';
import { currentOf, isMovedOn, newIdempotencyKey, takeRequestAction, workflowKeys, workflowQueries } from '@/api/workflow';

export const useSignOffs = (requestId: string, enabled = true) => useQuery({ ...workflowQueries.signOffs(requestId), enabled });
/** The chain check runs only when asked for (the "Check record" button). */
export const useVerify = (requestId: string, asked: boolean) => useQuery({ ...workflowQueries.verify(requestId), enabled: asked });

/** Everything that shows a request's state, after it moved on. */
function afterMove(qc: QueryClient, r: RequestDetail) {
  qc.setQueryData(requestKeys.detail(r.id), r);
  void qc.invalidateQueries({ queryKey: requestKeys.lists() });
  void qc.invalidateQueries({ queryKey: workflowKeys.inbox() });
  void qc.invalidateQueries({ queryKey: workflowKeys.signOffs(r.id) });
  qc.removeQueries({ queryKey: workflowKeys.verify(r.id) });
  void qc.invalidateQueries({ queryKey: numbersKeys.request(r.id) });
  // Approval puts the tool "in change"; closing moves it to a new revision and re-binds products.
  void qc.invalidateQueries({ queryKey: toolKeys.detail(r.tool.id) });
  void qc.invalidateQueries({ queryKey: toolKeys.lists() });
  void qc.invalidateQueries({ queryKey: productKeys.all });
}

export interface ActionCall {
  input: TakeActionInput;
  /** The intent's Idempotency-Key (see useIntentKey). */
  key: string;
}

/**
 * Takes an action on a request. Success puts the fresh request in the cache and refreshes the
 * lists; a 409 (someone acted first) puts the fresh copy the server sent in the cache, so the
 * screen shows the request as it is now.
 */
export function useTakeAction(requestId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ input, key }: ActionCall) => takeRequestAction(requestId, input, key),
    onSuccess: (res) => afterMove(qc, res.request),
    onError: (e) => {
      if (!isMovedOn(e)) return;
      const current = currentOf(e);
      if (current) afterMove(qc, current);
      else void qc.invalidateQueries({ queryKey: requestKeys.detail(requestId) });
    },
  });
}

/**
 * One Idempotency-Key per intent: kept while the signer retries the same action (a second press,
 * a retry after a lost answer), renewed once the intent is settled (done, or the request moved on).
 */
export function useIntentKey() {
  const [key, setKey] = useState(newIdempotencyKey);
  const renew = useCallback(() => setKey(newIdempotencyKey()), []);
  return { key, renew };
}

/** The currency of a tool's money (cut costs are kept in it); USD until known. */
export function useToolCurrency(toolId: string, enabled = true): string {
  const q = useQuery({ ...toolQueries.detail(toolId), enabled });
  return q.data?.currency ?? 'USD';
}
