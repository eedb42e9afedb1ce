import { StyleSheet, View } from 'react-native';
import { constructionLabels, type Tool } from '@shared/schemas/registry';
import { LifeGauge } from '@/components/registry/life-gauge';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { formatShots } from '@/lib/registry-format';
import { colors, space } from '@/theme';
import { Figure, FigureRow, Stacked } from './figures';

/** How much of the tool's rated life its shots have used, and where the rating comes from. */
export function LifeCard({ tool }: { tool: Tool }) {
  const { life } = tool;
  return (
    <Card accent={life.band === 'worn' ? 'due' : life.band === 'spent' ? 'info' : undefined} testID="tool-life">
      <View style={styles.head}>
        <Icon name="gauge" size={20} color={colors.inkSoft} />
        <AppText variant="heading" role="heading" aria-level={2}>
          Tool life
        </AppText>
      </View>
      <LifeGauge life={life} testID="tool-life-gauge" />
      <AppText variant="body" testID="tool-life-sentence">
        {life.sentence}
      </AppText>
      <FigureRow>
        <Figure label="Rated shots" value={formatShots(life.ratedShots)} testID="tool-life-rated" />
        <Figure label="Shots used" value={formatShots(life.shotCount)} testID="tool-life-used" />
        {life.overShots > 0 ? (
          <Figure label="Past rating by" value={formatShots(life.overShots)} testID="tool-life-over" />
        ) : (
          <Figure label="Remaining" value={formatShots(life.remainingShots)} testID="tool-life-remaining" />
        )}
      </FigureRow>
      <Stacked label="Mold class">{`${tool.moldClass} · ${constructionLabels[tool.construction]}`}</Stacked>
      <Stacked label="Source of the rated shots">
        <AppText variant="small" testID="tool-life-source">
          {tool.ratedShotsSource}
        </AppText>
      </Stacked>
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
