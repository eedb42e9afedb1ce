import { StyleSheet, View } from 'react-native';
import { fonts, radii, space, tones, type Tone } from '@/theme';
import { AppText } from './app-text';
import { Icon, type IconName } from './icon';

export interface StatusPillProps {
  /** The state in words: colour is never the only signal. */
  label: string;
  icon: IconName;
  tone?: Tone;
  testID?: string;
}

export function StatusPill({ label, icon, tone = 'neutral', testID }: StatusPillProps) {
  const t = tones[tone];
  return (
    <View style={[styles.pill, { backgroundColor: t.bg, borderColor: t.border }]} testID={testID}>
      <Icon name={icon} size={14} color={t.fg} strokeWidth={2.2} />
      <AppText variant="small" style={[styles.label, { color: t.fg }]} numberOfLines={1}>
        {label}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  pill: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: space.xs,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    borderRadius: radii.pill,
    borderWidth: 1,
  },
  label: { fontFamily: fonts.sansMedium, fontSize: 13, lineHeight: 18 },
});
