import { StyleSheet, View } from 'react-native';
import { WORN_FROM_PERCENT } from '@shared/domain/tool-life';
import { lifeBandLabels, type ToolLifeDto } from '@shared/schemas/registry';
import { AppText } from '@/components/ui/app-text';
import { Icon, type IconName } from '@/components/ui/icon';
import { colors, fonts, radii, space } from '@/theme';

/**
 * How each life band looks. Never colour alone: a word and an icon go with every bar. Worn tools
 * are amber; a tool past its rated life is drawn in ink with a warning word (the orange-red is kept
 * for "cannot be undone").
 */
export const lifeBandLook: Record<ToolLifeDto['band'], { fill: string; text: string; icon: IconName }> = {
  fresh: { fill: colors.go, text: colors.go, icon: 'gauge' },
  worn: { fill: colors.due, text: colors.due, icon: 'warning' },
  spent: { fill: colors.ink, text: colors.ink, icon: 'alert' },
};

export interface LifeGaugeProps {
  life: ToolLifeDto;
  /** Table cells and list rows: one line, smaller type. */
  compact?: boolean;
  testID?: string;
}

/** Bar + percent used + band word. The tick on the track marks the 80 % warning line. */
export function LifeGauge({ life, compact, testID }: LifeGaugeProps) {
  const look = lifeBandLook[life.band];
  const pct = Math.min(100, Math.max(0, Number(life.percentUsed)));
  const word = lifeBandLabels[life.band];
  return (
    <View
      style={[styles.wrap, compact && styles.wrapCompact]}
      testID={testID}
      role="meter"
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={pct}
      accessibilityLabel={`Life used ${life.percentUsed} %: ${word}`}
    >
      <View style={styles.top}>
        <AppText variant={compact ? 'monoSmall' : 'monoStrong'} style={[styles.percent, { color: colors.ink }]} testID={testID ? `${testID}-percent` : undefined}>
          {life.percentUsed} %
        </AppText>
        <View style={styles.band}>
          <Icon name={look.icon} size={compact ? 14 : 16} color={look.text} strokeWidth={2.2} />
          <AppText variant="small" style={[styles.word, compact && styles.wordCompact, { color: look.text }]} numberOfLines={1} testID={testID ? `${testID}-band` : undefined}>
            {word}
          </AppText>
        </View>
      </View>
      <View style={[styles.track, compact && styles.trackCompact]}>
        <View style={[styles.fill, { width: `${pct}%`, backgroundColor: look.fill }]} />
        <View style={[styles.tick, { left: `${WORN_FROM_PERCENT}%` }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, alignSelf: 'stretch' },
  wrapCompact: { gap: 3 },
  top: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  percent: { fontVariant: ['tabular-nums'] },
  band: { flexDirection: 'row', alignItems: 'center', gap: space.xs, flexShrink: 1 },
  word: { fontFamily: fonts.sansMedium },
  wordCompact: { fontSize: 13, lineHeight: 18 },
  track: { height: 10, borderRadius: radii.pill, backgroundColor: colors.steelWash, borderWidth: 1, borderColor: colors.steelLight, overflow: 'hidden' },
  trackCompact: { height: 6 },
  fill: { position: 'absolute', left: 0, top: 0, bottom: 0, borderRadius: radii.pill },
  tick: { position: 'absolute', top: 0, bottom: 0, width: 2, marginLeft: -1, backgroundColor: colors.steel },
});
