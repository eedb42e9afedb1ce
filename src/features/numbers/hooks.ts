import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RequestNumbers, SaveNumbersInput } from '@shared/schemas/numbers';
import { numbersKeys, numbersQueries, saveRequestNumbers } from '@/api/numbers';
import { requestKeys } from '@/api/requests';

export const useRequestNumbers = (requestId: string, enabled = true) => useQuery({ ...numbersQueries.request(requestId), enabled });
export const useToolOpenPlans = (toolId: string) => useQuery(numbersQueries.openPlans(toolId));

/**
 * Saves the estimate and plan. The request's version moves on and its impact shows the new costs of
 * the ways to keep ended products, so the request and every tool's open plans are fetched again.
 */
export function useSaveNumbers(requestId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveNumbersInput) => saveRequestNumbers(requestId, input),
    onSuccess: (n: RequestNumbers) => {
      qc.setQueryData(numbersKeys.request(requestId), n);
      void qc.invalidateQueries({ queryKey: requestKeys.detail(requestId) });
      void qc.invalidateQueries({ queryKey: requestKeys.lists() });
      void qc.invalidateQueries({ queryKey: numbersKeys.openPlans(n.facts.tool.id) });
    },
  });
}
