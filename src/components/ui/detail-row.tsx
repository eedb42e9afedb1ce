import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { colors, space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { AppText } from './app-text';

export interface DetailRowProps {
  label: string;
  /** Text, or any content (pills, links). An empty string shows "—" with "not set" for screen readers. */
  value: ReactNode;
  /** Set text values in IBM Plex Mono (codes, figures, dates). */
  mono?: boolean;
  divider?: boolean;
  testID?: string;
}

/** Label / value pair; label above on phones, beside on wide screens. Use inside a Card. */
export function DetailRow({ label, value, mono, divider = true, testID }: DetailRowProps) {
  const wide = useWide();
  const empty = value === '' || value === null || value === undefined;
  return (
    <View style={[styles.row, wide && styles.rowWide, divider && styles.divider]}>
      <AppText variant="small" style={wide ? styles.labelWide : undefined}>
        {label}
      </AppText>
      <View style={styles.value} testID={testID}>
        {empty ? (
          <AppText variant="body" tone="faint" accessibilityLabel="not set">
            —
          </AppText>
        ) : typeof value === 'string' || typeof value === 'number' ? (
          <AppText variant={mono ? 'mono' : 'body'}>{value}</AppText>
        ) : (
          value
        )}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.md, gap: space.xxs },
  rowWide: { flexDirection: 'row', gap: space.lg, alignItems: 'baseline' },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  labelWide: { width: 180 },
  value: { flex: 1 },
});
