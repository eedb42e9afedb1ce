import type { ReactNode } from 'react';
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { colors, radii, space, tones, type Tone } from '@/theme';

export interface CardProps {
  children: ReactNode;
  /** Inner padding; false for edge-to-edge lists (ListRow brings its own). */
  padded?: boolean;
  /** A coloured rule on the left edge (the card's state also needs words and an icon inside). */
  accent?: Tone;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}

/** White surface on the paper background, hairline border, no shadow. */
export function Card({ children, padded = true, accent, style, testID }: CardProps) {
  return (
    <View
      testID={testID}
      style={[styles.card, padded && styles.padded, accent && { borderLeftWidth: 4, borderLeftColor: tones[accent].border }, style]}
    >
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.steelLight,
    overflow: 'hidden',
  },
  padded: { padding: space.lg, gap: space.md },
});
