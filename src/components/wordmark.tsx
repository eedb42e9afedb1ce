import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, fonts, space } from '@/theme';

/** The product's mark (a boom gate) and name. `inverse` on ink backgrounds; `small` for the side rail. */
export function Wordmark({ inverse, small }: { inverse?: boolean; small?: boolean }) {
  const box = small ? 34 : 44;
  return (
    <View style={styles.row} accessibilityLabel="Toolgate" role="img">
      <View style={[styles.mark, { width: box, height: box }, inverse && styles.markInverse]}>
        <Icon name="gate" size={small ? 20 : 26} color={inverse ? colors.ink : colors.onColour} strokeWidth={2} />
      </View>
      <AppText style={[styles.name, small && styles.nameSmall, inverse && { color: colors.onColour }]}>Toolgate</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  mark: { borderRadius: 8, backgroundColor: colors.ink, alignItems: 'center', justifyContent: 'center' },
  markInverse: { backgroundColor: colors.paper },
  name: { fontFamily: fonts.monoSemiBold, fontSize: 24, lineHeight: 30, letterSpacing: 0.5, color: colors.ink },
  nameSmall: { fontSize: 19, lineHeight: 24 },
});
