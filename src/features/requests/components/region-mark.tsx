import { StyleSheet, View } from 'react-native';
import type { MarkShape } from '@shared/schemas/change-items';
import { AppText } from '@/components/ui/app-text';
import { colors, fonts, radii } from '@/theme';

export interface MarkBox {
  shape: MarkShape;
  /** Fractions (0..1) of the image: top-left corner and size. */
  x: number;
  y: number;
  w: number;
  h: number;
}

const pct = (f: number) => `${Math.max(0, Math.min(1, f)) * 100}%` as const;

/**
 * A box or circle drawn over an image from fractional coordinates, so it lands on the same spot at
 * any displayed size. A dark line with a white halo reads on light and dark pictures; the label
 * (the item's number) says which cut item it belongs to.
 */
export function RegionMark({ mark, label, testID }: { mark: MarkBox; label?: string; testID?: string }) {
  const round = mark.shape === 'circle' ? ({ borderRadius: 9999 } as const) : null;
  return (
    <View
      pointerEvents="none"
      style={[styles.outer, round, { left: pct(mark.x), top: pct(mark.y), width: pct(mark.w), height: pct(mark.h) }]}
      testID={testID}
      accessibilityLabel={label ? `Marked region of item ${label}` : 'Marked region'}
    >
      <View style={[styles.inner, round]} />
      {label ? (
        <View style={styles.tag}>
          <AppText style={styles.tagText}>{label}</AppText>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  outer: { position: 'absolute', borderWidth: 2, borderColor: colors.onColour, borderRadius: radii.sm },
  inner: { ...StyleSheet.absoluteFill, borderWidth: 2.5, borderColor: colors.ink, borderRadius: radii.sm },
  tag: {
    position: 'absolute',
    top: -12,
    left: -12,
    minWidth: 24,
    height: 24,
    paddingHorizontal: 4,
    borderRadius: 12,
    backgroundColor: colors.ink,
    borderWidth: 2,
    borderColor: colors.onColour,
    alignItems: 'center',
    justifyContent: 'center',
  },
  tagText: { color: colors.onColour, fontFamily: fonts.monoSemiBold, fontSize: 12, lineHeight: 16 },
});
