import type { ReactNode } from 'react';
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, radii, space, touch } from '@/theme';

export interface Column<T> {
  key: string;
  header: string;
  /** Relative width (flex grow); `width` fixes it instead. */
  flex?: number;
  width?: number;
  align?: 'left' | 'right';
  render: (row: T) => ReactNode;
}

export interface DataTableProps<T> {
  columns: readonly Column<T>[];
  rows: readonly T[];
  rowKey: (row: T) => string;
  rowHref: (row: T) => Href;
  /** Read aloud for each row link (e.g. "Open tool KB-T-0412"). */
  rowLabel: (row: T) => string;
  rowTestID?: (row: T) => string;
  caption: string;
  testID?: string;
}

/** A wide-screen table: a header row and one link per row (the whole row opens the record). */
export function DataTable<T>({ columns, rows, rowKey, rowHref, rowLabel, rowTestID, caption, testID }: DataTableProps<T>) {
  const cell = (c: Column<T>): ViewStyle => ({
    ...(c.width ? { width: c.width } : { flex: c.flex ?? 1, minWidth: 0 }),
    // Stretch, so one-line text is cut with an ellipsis at the column's edge instead of overflowing.
    alignItems: c.align === 'right' ? 'flex-end' : 'stretch',
  });
  return (
    <View style={styles.table} role="table" aria-label={caption} testID={testID}>
      <View style={[styles.row, styles.head]} role="row">
        {columns.map((c) => (
          <View key={c.key} style={cell(c)} role="columnheader">
            <AppText variant="caption" align={c.align}>
              {c.header}
            </AppText>
          </View>
        ))}
        <View style={styles.chevron} />
      </View>
      {rows.map((r, i) => (
        <Link key={rowKey(r)} href={rowHref(r)} asChild>
          <Pressable
            role="link"
            accessibilityLabel={rowLabel(r)}
            testID={rowTestID?.(r)}
            style={StyleSheet.flatten([styles.row, styles.body, i === rows.length - 1 && styles.last])}
          >
            {columns.map((c) => (
              <View key={c.key} style={cell(c)} role="cell">
                {c.render(r)}
              </View>
            ))}
            <View style={styles.chevron}>
              <Icon name="chevron-right" size={18} color={colors.steel} />
            </View>
          </Pressable>
        </Link>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { backgroundColor: colors.card, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.steelLight, overflow: 'hidden' },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingHorizontal: space.lg },
  head: { paddingVertical: space.sm, backgroundColor: colors.steelWash, borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  body: { minHeight: touch + 16, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.steelLight, backgroundColor: colors.card },
  last: { borderBottomWidth: 0 },
  chevron: { width: 18 },
});
