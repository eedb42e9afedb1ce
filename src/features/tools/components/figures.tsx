import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { colors, space } from '@/theme';

/** A row of figures between two hairlines (e.g. rated / used / remaining shots). */
export function FigureRow({ children }: { children: ReactNode }) {
  return <View style={styles.row}>{children}</View>;
}

/** A caption over a value; figures and dates in IBM Plex Mono. */
export function Figure({ label, value, mono = true, testID }: { label: string; value: ReactNode; mono?: boolean; testID?: string }) {
  return (
    <View style={styles.figure}>
      <AppText variant="caption">{label}</AppText>
      {typeof value === 'string' ? (
        <AppText variant={mono ? 'monoStrong' : 'bodyStrong'} testID={testID}>
          {value}
        </AppText>
      ) : (
        <View testID={testID}>{value}</View>
      )}
    </View>
  );
}

/** A caption over a line or two of words (narrow columns read better stacked than side by side). */
export function Stacked({ label, children, testID }: { label: string; children: ReactNode; testID?: string }) {
  return (
    <View style={styles.stacked} testID={testID}>
      <AppText variant="caption">{label}</AppText>
      {typeof children === 'string' ? <AppText variant="body">{children}</AppText> : children}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, paddingVertical: space.sm, borderTopWidth: 1, borderBottomWidth: 1, borderColor: colors.steelLight },
  figure: { flexGrow: 1, flexBasis: 96, gap: 2 },
  stacked: { gap: 2 },
});
