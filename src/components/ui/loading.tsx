import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { colors, space } from '@/theme';
import { AppText } from './app-text';

export interface LoadingProps {
  /** Words beside the spinner: what is loading. */
  label?: string;
  /** Fill the screen and centre (route-level loading). */
  fill?: boolean;
  testID?: string;
}

export function Loading({ label = 'Loading…', fill, testID = 'loading' }: LoadingProps) {
  return (
    <View style={[styles.wrap, fill && styles.fill]} testID={testID} role="progressbar" aria-busy accessibilityLabel={label}>
      <ActivityIndicator color={colors.inkSoft} />
      <AppText variant="small">{label}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flexDirection: 'row', alignItems: 'center', justifyContent: 'center', gap: space.sm, padding: space.xl },
  fill: { flex: 1, backgroundColor: colors.paper },
});
