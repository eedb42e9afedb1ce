import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateToolInput, ImportKind, RetentionDecisionInput, Tool, ToolDetail, UpdateToolInput } from '@shared/schemas/registry';
import { organisationQueries } from '@/api/organisation';
import {
  createTool,
  importRegistryCsv,
  productKeys,
  recordRetentionDecision,
  toolKeys,
  toolQueries,
  updateTool,
  type ToolFilters,
} from '@/api/registry';
import { useSession } from '@/lib/session';

export const useToolList = (f: ToolFilters) => useInfiniteQuery({ ...toolQueries.list(f), placeholderData: (prev) => prev });
export const useTool = (id: string) => useQuery(toolQueries.detail(id));
export const useRetentionDue = (days = 90) => useQuery(toolQueries.retentionDue(days));
export const useBrands = () => useQuery(organisationQueries.brands());
export const useFactories = () => useQuery(organisationQueries.factories());

/** Engineers and admins write to the registry; everyone else reads. */
export function useCanEditRegistry(): boolean {
  const { data: me } = useSession();
  return me?.role === 'engineer' || me?.role === 'admin';
}


/** After a tool changes: patch its detail in place, refetch lists and the products that use it. */
function useToolSaved() {
  const qc = useQueryClient();
  return (tool: Tool) => {
    qc.setQueryData<ToolDetail>(toolKeys.detail(tool.id), (old) => (old ? { ...old, ...tool } : old));
    return Promise.all([
      qc.invalidateQueries({ queryKey: toolKeys.all }),
      qc.invalidateQueries({ queryKey: productKeys.all }),
    ]);
  };
}

export function useCreateTool() {
  const saved = useToolSaved();
  return useMutation({ mutationFn: (input: CreateToolInput) => createTool(input), onSuccess: saved });
}

export function useUpdateTool(id: string) {
  const saved = useToolSaved();
  return useMutation({ mutationFn: (input: UpdateToolInput) => updateTool(id, input), onSuccess: saved });
}

export function useRecordRetention(id: string) {
  const saved = useToolSaved();
  return useMutation({ mutationFn: (input: RetentionDecisionInput) => recordRetentionDecision(id, input), onSuccess: saved });
}

export function useImportCsv() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { kind: ImportKind; csv: string; dryRun: boolean }) => importRegistryCsv(v.kind, v.csv, v.dryRun),
    onSuccess: (report) => {
      if (!report.applied) return;
      return Promise.all([qc.invalidateQueries({ queryKey: toolKeys.all }), qc.invalidateQueries({ queryKey: productKeys.all })]);
    },
  });
}
