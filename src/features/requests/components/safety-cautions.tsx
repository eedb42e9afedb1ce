import { StyleSheet, View } from 'react-native';
import { formatReference, type SafetyReview } from '@shared/domain/safety';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, radii, space, tones } from '@/theme';

/**
 * The usual cautions for flagged items, with the reference values and their sources, ending with
 * the sentence that defers to accredited laboratories and each market's rules.
 */
export function SafetyCautions({ review, retestNote, testID = 'safety' }: { review: SafetyReview; retestNote?: string | null; testID?: string }) {
  if (review.cautions.length === 0) return null;
  return (
    <View style={styles.box} testID={testID} role="region" aria-label="Safety cautions">
      <View style={styles.head}>
        <Icon name="warning" size={22} color={colors.due} strokeWidth={2} />
        <View style={styles.shrink}>
          <AppText variant="bodyStrong" tone="due">
            Safety: a re-test is required
          </AppText>
          <AppText variant="small">
            {review.flaggedItems === 1 ? 'One cut item carries' : `${review.flaggedItems} cut items carry`} a safety flag. The request needs a note on the
            re-test before it can close.
          </AppText>
        </View>
      </View>
      {review.cautions.map((c) => (
        <View key={c.flag} style={styles.caution} testID={`${testID}-${c.flag}`}>
          <AppText variant="label">{c.title}</AppText>
          {c.sentences.map((s) => (
            <AppText key={s} variant="small" style={styles.sentence}>
              {s}
            </AppText>
          ))}
          {c.references.length > 0 ? (
            <View style={styles.refs}>
              <AppText variant="caption">Reference values</AppText>
              {c.references.map((r) => (
                <AppText key={r.id} variant="monoSmall" testID={`${testID}-ref-${r.id}`}>
                  {formatReference(r)}
                </AppText>
              ))}
            </View>
          ) : null}
        </View>
      ))}
      {retestNote ? (
        <View style={styles.caution}>
          <AppText variant="label">Re-test note</AppText>
          <AppText variant="body">{retestNote}</AppText>
        </View>
      ) : null}
      <AppText variant="small" style={styles.closing} testID={`${testID}-closing`}>
        {review.closing}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.md,
    padding: space.lg,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: tones.due.border,
    borderLeftWidth: 4,
    backgroundColor: colors.card,
  },
  head: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start' },
  shrink: { flex: 1, gap: space.xxs },
  caution: { gap: space.xs, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.steelLight },
  sentence: { color: colors.ink },
  refs: { gap: space.xs, padding: space.sm, borderRadius: radii.md, backgroundColor: colors.paper },
  closing: { color: colors.ink },
});
