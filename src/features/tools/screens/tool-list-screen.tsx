import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { lifeBandLabels, lifeBands, toolStatusLabels, toolStatuses, type LifeBandValue, type ToolStatus } from '@shared/schemas/registry';
import { toolsExportUrl, type ToolFilters } from '@/api/registry';
import { FilterBar, type SelectFilter } from '@/components/registry/filter-bar';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PagedResults } from '@/components/registry/paged-results';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { startDownload } from '@/lib/download';
import { plural } from '@/lib/registry-format';
import { useSession } from '@/lib/session';
import { useDebounced } from '@/lib/use-debounced';
import { space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { ToolRows, ToolTable } from '../components/tool-list-views';
import { useBrands, useCanEditRegistry, useFactories, useRetentionDue, useToolList } from '../hooks';

const RETENTION_DAYS = 90;
type Picks = Omit<ToolFilters, 'q' | 'retentionDays'>;

/** The tool register: search, filter chips, keyset pages; a list on phones and a table on wide screens. */
export function ToolListScreen() {
  const wide = useWide();
  const { data: me } = useSession();
  const canEdit = useCanEditRegistry();
  const brands = useBrands();
  const factories = useFactories();
  const due = useRetentionDue(RETENTION_DAYS);
  const [search, setSearch] = useState('');
  const [picks, setPicks] = useState<Picks>({});
  const q = useDebounced(search.trim(), 300);
  const filters: ToolFilters = { ...picks, q: q || undefined, retentionDays: picks.retentionDue ? RETENTION_DAYS : undefined };
  const list = useToolList(filters);
  const tools = list.data?.pages.flatMap((p) => p.data) ?? [];
  const filtering = !!q || Object.values(picks).some((v) => v !== undefined && v !== false);
  const toolmaker = me?.role === 'toolmaker';
  const ownFactory = toolmaker ? factories.data?.find((x) => x.id === me?.factoryId) : undefined;

  const set = <K extends keyof Picks>(k: K) => (v: Picks[K] | undefined) => setPicks((p) => ({ ...p, [k]: v }));
  const selects: SelectFilter[] = [
    {
      key: 'brand',
      label: 'Brand',
      options: (brands.data ?? []).map((b) => ({ value: b.id, label: b.name })),
      value: picks.brandId,
      onChange: set('brandId'),
    },
    ...(toolmaker
      ? []
      : [{ key: 'factory', label: 'Factory', options: (factories.data ?? []).map((x) => ({ value: x.id, label: x.name })), value: picks.factoryId, onChange: set('factoryId') }]),
    {
      key: 'status',
      label: 'Status',
      options: toolStatuses.map((s) => ({ value: s, label: toolStatusLabels[s] })),
      value: picks.status,
      onChange: (v) => set('status')(v as ToolStatus | undefined),
    },
    {
      key: 'life',
      label: 'Life',
      options: lifeBands.map((b) => ({ value: b, label: lifeBandLabels[b] })),
      value: picks.lifeBand,
      onChange: (v) => set('lifeBand')(v as LifeBandValue | undefined),
    },
  ];
  const dueCount = due.data?.data.length ?? 0;

  return (
    <Screen
      title="Tools"
      subtitle="Molds: where they sit, what they make, how much life is left"
      width={wide ? 'full' : 'content'}
      actions={
        canEdit ? (
          <>
            <Button title={wide ? 'New tool' : 'New'} accessibilityLabel="New tool" icon="plus" href="/tools/new" testID="tools-new" />
            <Button title={wide ? 'Import CSV' : 'Import'} accessibilityLabel="Import from CSV" icon="upload" variant="secondary" href="/tools/import" testID="tools-import" />
            <Button
              title={wide ? 'Export CSV' : 'Export'}
              accessibilityLabel="Export these tools as CSV"
              icon="download"
              variant="secondary"
              onPress={() => startDownload(toolsExportUrl(filters))}
              testID="tools-export"
            />
          </>
        ) : null
      }
      testID="tools-screen"
    >
      {toolmaker && ownFactory ? (
        <Banner kind="info" icon="factory" message={`You see the tools at ${ownFactory.name} only.`} testID="tools-factory-scope" />
      ) : null}
      {dueCount > 0 && !picks.retentionDue ? (
        <Banner kind="due" icon="clock" title={`${plural(dueCount, 'tool')} ${dueCount === 1 ? 'needs' : 'need'} a keep-or-scrap decision within ${RETENTION_DAYS} days`} testID="tools-retention-due">
          <Button title="Show them" variant="secondary" iconRight="arrow-right" onPress={() => setPicks((p) => ({ ...p, retentionDue: true }))} testID="tools-retention-show" />
        </Banner>
      ) : null}
      <View style={styles.controls}>
        <TextField
          label="Search"
          placeholder="Tool code or name, part, product or SKU"
          value={search}
          onChangeText={setSearch}
          leadingIcon="search"
          autoCapitalize="none"
          autoCorrect={false}
          returnKeyType="search"
          testID="tools-search"
        />
        <FilterBar
          selects={selects}
          toggles={[
            {
              key: 'retention',
              label: `Decision due (${RETENTION_DAYS} days)`,
              icon: 'clock',
              value: !!picks.retentionDue,
              onChange: (v) => setPicks((p) => ({ ...p, retentionDue: v || undefined })),
            },
          ]}
          onClear={() => setPicks({})}
          testID="tools-filter"
        />
      </View>

      {list.isPending ? (
        <Loading label="Loading tools…" />
      ) : list.isError ? (
        <ErrorState error={list.error} onRetry={() => void list.refetch()} />
      ) : tools.length === 0 ? (
        filtering ? (
          <EmptyState
            icon="search"
            title={q ? `No tool matches “${q}”` : 'No tool matches these filters'}
            body="The search looks at tool codes and names, part names, and product names and SKUs. Check the spelling, or remove a filter."
            action={{ title: 'Clear search and filters', icon: 'close', onPress: () => { setSearch(''); setPicks({}); } }}
            testID="tools-empty"
          />
        ) : (
          <EmptyState
            icon="tool"
            title="No tools in the register yet"
            body={
              canEdit
                ? 'Add tools one by one, or load the whole register from a CSV file: tools first, then their parts, products and bill of parts.'
                : toolmaker
                  ? 'No tools are registered at your factory yet. The tooling engineer adds them.'
                  : 'The tooling engineer adds tools with their factory, mold class, shot count and parts. Check back later.'
            }
            action={canEdit ? { title: 'Import from CSV', href: '/tools/import', icon: 'upload' } : undefined}
            testID="tools-empty"
          />
        )
      ) : (
        <PagedResults list={list} count={tools.length} noun="tool" testID="tools">
          {wide ? <ToolTable tools={tools} /> : <ToolRows tools={tools} />}
        </PagedResults>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  controls: { gap: space.xs },
});
