import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { plural } from '@/lib/registry-format';

/** The parts of an infinite query a keyset-paged list needs. */
export interface PagedList {
  hasNextPage: boolean;
  isFetching: boolean;
  isFetchingNextPage: boolean;
  isFetchNextPageError: boolean;
  fetchNextPage: () => Promise<unknown>;
}

/**
 * A keyset-paged result: how many are shown, the rows (children), "Load more" and its error.
 * Test IDs: `${testID}-count`, `${testID}-more`.
 */
export function PagedResults({ list, count, noun, testID, children }: { list: PagedList; count: number; noun: string; testID: string; children: ReactNode }) {
  const more = `Load more ${noun}s`;
  return (
    <>
      <AppText variant="small" testID={`${testID}-count`} aria-live="polite">
        {list.hasNextPage ? `Showing the first ${plural(count, noun)}` : plural(count, noun)}
        {list.isFetching && !list.isFetchingNextPage ? ' · updating…' : ''}
      </AppText>
      {children}
      {list.hasNextPage ? (
        <View style={styles.more}>
          <Button
            title={more}
            icon="chevron-down"
            variant="secondary"
            busy={list.isFetchingNextPage}
            busyTitle="Loading…"
            onPress={() => void list.fetchNextPage()}
            testID={`${testID}-more`}
          />
        </View>
      ) : null}
      {list.isFetchNextPageError ? <Banner kind="due" title={`The next ${noun}s did not load`} message={`Try “${more}” again.`} /> : null}
    </>
  );
}

const styles = StyleSheet.create({ more: { alignItems: 'center' } });
