import { StyleSheet, View } from 'react-native';
import type { ToolDetail } from '@shared/schemas/registry';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { plural } from '@/lib/registry-format';
import { colors, space } from '@/theme';

/** The parts this tool molds: resin and cavities per shot. */
export function PartsCard({ tool }: { tool: ToolDetail }) {
  const used = tool.parts.reduce((n, p) => n + p.cavitiesPerShot, 0);
  return (
    <Card padded={false} testID="tool-parts">
      <View style={styles.head}>
        <Icon name="layers" size={20} color={colors.inkSoft} />
        <View style={styles.titles}>
          <AppText variant="heading" role="heading" aria-level={2}>
            Parts
          </AppText>
          <AppText variant="small">
            {tool.parts.length === 0
              ? `${plural(tool.cavityCount, 'cavity', 'cavities')}; no parts recorded`
              : `${plural(tool.parts.length, 'part')} in ${used} of ${plural(tool.cavityCount, 'cavity', 'cavities')}`}
          </AppText>
        </View>
      </View>
      {tool.parts.length === 0 ? (
        <AppText variant="body" tone="soft" style={styles.empty}>
          No parts recorded for this tool yet. Add them with a parts CSV from the Tools tab.
        </AppText>
      ) : (
        tool.parts.map((p, i) => (
          <View key={p.id} style={[styles.row, i < tool.parts.length - 1 && styles.divider]} testID={`tool-part-${p.name}`}>
            <View style={styles.name}>
              <AppText variant="bodyStrong">{p.name}</AppText>
              <AppText variant="small">
                {p.productCount === 0 ? 'No product uses it' : `Used by ${plural(p.productCount, 'product')}`}
              </AppText>
            </View>
            <View style={styles.figure}>
              <AppText variant="caption">Resin</AppText>
              <AppText variant="mono">{p.resin}</AppText>
            </View>
            <View style={styles.figure}>
              <AppText variant="caption">Per shot</AppText>
              <AppText variant="mono" accessibilityLabel={`${p.cavitiesPerShot} cavities per shot`}>
                {p.cavitiesPerShot}
              </AppText>
            </View>
          </View>
        ))
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, padding: space.lg, borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  titles: { gap: 2 },
  empty: { padding: space.lg },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.lg, paddingHorizontal: space.lg, paddingVertical: space.md },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  name: { flex: 1, gap: 2 },
  figure: { alignItems: 'flex-end', minWidth: 64 },
});
