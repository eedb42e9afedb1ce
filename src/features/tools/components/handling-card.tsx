import { StyleSheet, View } from 'react-native';
import type { ToolDetail } from '@shared/schemas/registry';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { formatKg } from '@/lib/registry-format';
import { colors, space } from '@/theme';

/** Weight and the lifting caution (DESIGN.md section 6): a caution, deferring to riggers and local codes. */
export function HandlingCard({ handling }: { handling: ToolDetail['handling'] }) {
  return (
    <Card testID="tool-handling">
      <View style={styles.head}>
        <Icon name="weight" size={20} color={colors.inkSoft} />
        <AppText variant="heading" role="heading" aria-level={2}>
          Handling
        </AppText>
      </View>
      <View style={styles.weight}>
        <AppText variant="small">Weight</AppText>
        <AppText variant="monoStrong" testID="tool-handling-weight">
          {handling.weightKnown ? formatKg(handling.weightKg) : 'Not recorded'}
        </AppText>
      </View>
      <AppText variant="body">{handling.summary}</AppText>
      {handling.heavy ? (
        <Banner kind="due" icon="warning" title="Lifting caution" testID="tool-handling-caution">
          <AppText variant="body">{handling.caution}</AppText>
          <AppText variant="small">Toolgate does not plan lifts: follow your site's lifting plan, qualified riggers and local codes.</AppText>
        </Banner>
      ) : (
        <AppText variant="small">{handling.caution}</AppText>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  weight: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
});
