import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useQuery } from '@tanstack/react-query';
import { requestStates, type RequestState } from '@shared/domain/lifecycle';
import { organisationQueries } from '@/api/organisation';
import type { RequestListFilters } from '@/api/requests';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { useSession } from '@/lib/session';
import { colors, radii, space, touch } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { RequestRow } from '../components/request-row';
import { useDebounced, useRequestList } from '../hooks';
import { stateLook } from '@/lib/requests/status';

type StateFilter = RequestState | 'any';
type Toggle = 'mine' | 'irreversible';

/** Every change request the caller may see, newest change first, with filters and "Load more". */
export function RequestListScreen() {
  const { data: me } = useSession();
  const wide = useWide();
  const isDesigner = me?.role === 'designer';
  const [search, setSearch] = useState('');
  const [state, setState] = useState<StateFilter>('any');
  const [toggles, setToggles] = useState<Toggle[]>([]);
  const [brandId, setBrandId] = useState<string>('any');
  const [showFilters, setShowFilters] = useState(false);
  const q = useDebounced(search.trim(), 250);
  const brands = useQuery({ ...organisationQueries.brands(), enabled: showFilters });

  const filters: RequestListFilters = useMemo(
    () => ({
      q: q || undefined,
      status: state === 'any' ? undefined : state,
      mine: toggles.includes('mine') ? true : undefined,
      irreversible: toggles.includes('irreversible') ? true : undefined,
      brandId: brandId === 'any' ? undefined : brandId,
    }),
    [q, state, toggles, brandId],
  );
  const list = useRequestList(filters);
  const rows = list.data?.pages.flatMap((p) => p.data) ?? [];
  const narrowed = !!(q || state !== 'any' || toggles.length || brandId !== 'any');
  const activeCount = (state !== 'any' ? 1 : 0) + (brandId !== 'any' ? 1 : 0);

  return (
    <Screen
      title="Requests"
      subtitle="Changes proposed to tools"
      actions={isDesigner ? <Button title="New request" icon="plus" href="/requests/new" testID="request-new" /> : null}
      testID="requests-screen"
    >
      <View style={styles.filters}>
        <View style={[styles.topFilters, wide && styles.topFiltersWide]}>
          <View style={wide ? styles.searchWide : undefined}>
            <TextField
              label="Search"
              placeholder="Title, tool code or CR number"
              value={search}
              onChangeText={setSearch}
              leadingIcon="search"
              autoCapitalize="none"
              autoCorrect={false}
              testID="request-search"
            />
          </View>
          <ChoiceGroup<Toggle>
            label="Show only"
            multiple
            options={[
              { value: 'mine', label: isDesigner ? 'Written by me' : 'Mine' },
              { value: 'irreversible', label: 'Cannot be undone' },
            ]}
            value={toggles}
            onChange={setToggles}
            testID="request-toggles"
          />
        </View>
        <Pressable
          role="button"
          aria-expanded={showFilters}
          onPress={() => setShowFilters((v) => !v)}
          style={({ pressed }) => [styles.disclosure, pressed && { backgroundColor: colors.steelWash }]}
          testID="request-more-filters"
        >
          <Icon name={showFilters ? 'chevron-down' : 'chevron-right'} size={18} color={colors.inkSoft} />
          <AppText variant="label">
            {showFilters ? 'Fewer filters' : 'State and brand'}
            {activeCount > 0 ? ` (${activeCount} set)` : ''}
          </AppText>
        </Pressable>
        {showFilters ? (
          <View style={styles.more}>
            <ChoiceGroup<StateFilter>
              label="State"
              options={[{ value: 'any', label: 'Any state' }, ...requestStates.map((s) => ({ value: s, label: stateLook(s).label }))]}
              value={state}
              onChange={setState}
              testID="request-state-filter"
            />
            {brands.data && brands.data.length > 1 ? (
              <ChoiceGroup<string>
                label="Brand"
                options={[{ value: 'any', label: 'Any brand' }, ...brands.data.map((b) => ({ value: b.id, label: b.name }))]}
                value={brandId}
                onChange={setBrandId}
                testID="request-brand-filter"
              />
            ) : null}
          </View>
        ) : null}
      </View>

      {list.isPending ? (
        <Loading label="Loading requests…" />
      ) : list.isError && rows.length === 0 ? (
        <ErrorState error={list.error} onRetry={() => void list.refetch()} />
      ) : rows.length === 0 ? (
        narrowed ? (
          <EmptyState
            icon="search"
            title="No request matches"
            body="Nothing fits these filters. Clear the search or pick another state."
            action={{
              title: 'Clear filters',
              icon: 'close',
              onPress: () => {
                setSearch('');
                setState('any');
                setToggles([]);
                setBrandId('any');
              },
            }}
            testID="requests-empty"
          />
        ) : (
          <EmptyState
            icon="requests"
            title="No change requests yet"
            body={
              isDesigner
                ? 'Propose a change to a tool: pick the tool, add before and after images and the cut items. Toolgate shows what the change ends as you type.'
                : 'Change requests arrive here when a designer proposes a change to a tool. Each one shows its stage and whether it can be undone.'
            }
            action={isDesigner ? { title: 'New request', href: '/requests/new', icon: 'plus' } : undefined}
            testID="requests-empty"
          />
        )
      ) : (
        <>
          <Card padded={false} testID="request-rows">
            {rows.map((r, i) => (
              <RequestRow key={r.id} r={r} divider={i < rows.length - 1} />
            ))}
          </Card>
          {list.isError ? <AppText variant="small" tone="due">Some requests did not load: {String(list.error.message)}</AppText> : null}
          {list.hasNextPage ? (
            <Button
              title="Load more"
              variant="secondary"
              icon="chevron-down"
              busy={list.isFetchingNextPage}
              busyTitle="Loading…"
              onPress={() => void list.fetchNextPage()}
              testID="request-load-more"
            />
          ) : (
            <AppText variant="small" tone="faint" testID="request-list-end">
              {rows.length === 1 ? 'One request' : `${rows.length} requests`}, all shown.
            </AppText>
          )}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.xs },
  topFilters: { gap: space.xs },
  topFiltersWide: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  searchWide: { flex: 1 },
  disclosure: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: space.xs,
    minHeight: touch,
    paddingHorizontal: space.sm,
    marginLeft: -space.sm,
    borderRadius: radii.md,
  },
  more: { gap: space.xs },
});
