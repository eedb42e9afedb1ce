import { StyleSheet, View } from 'react-native';
import type { ImpactResult } from '@shared/domain/impact';
import { formatCents } from '@shared/domain/money';
import { steelActionLabels, undoPathLabels } from '@shared/domain/steel-direction';
import type { ImpactProductDto } from '@shared/schemas/change-requests';
import { productStatusLabels } from '@shared/schemas/registry';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Icon } from '@/components/ui/icon';
import { colors, radii, space } from '@/theme';
import { formatUnits } from '@/lib/requests/format';
import { IrreversibleBanner } from './irreversible-banner';

export interface ImpactPanelProps {
  impact: ImpactResult<ImpactProductDto>;
  toolCode: string;
  /** Show the loud banner at the top of the panel (off where the screen already shows it above). */
  withBanner?: boolean;
  /** Show the per-item steel lines (the detail lists them with the items instead). */
  withItems?: boolean;
  testID?: string;
}

/** What the change does: the products it ends, keeps and leaves alone, and the ways to keep the ended ones. */
export function ImpactPanel({ impact, toolCode, withBanner = true, withItems = true, testID = 'impact' }: ImpactPanelProps) {
  const none = impact.items.length === 0;
  return (
    <View style={styles.panel} testID={testID}>
      {withBanner && impact.irreversible ? <IrreversibleBanner toolCode={toolCode} ended={impact.endedProducts} removesSteel={impact.removesSteel} testID={`${testID}-banner`} /> : null}
      {withBanner && !impact.irreversible && !none ? (
        <Banner kind="go" title="This change can be undone" message="The current insert is kept and can be swapped back." testID={`${testID}-reversible`} />
      ) : null}
      <AppText variant="body" testID={`${testID}-summary`}>
        {impact.summary}
      </AppText>

      {withItems && impact.items.length > 0 ? (
        <Group title="Steel, item by item">
          {impact.items.map((i, n) => (
            <View key={`${i.partId}-${n}`} style={styles.line} testID={`${testID}-item-${n + 1}`}>
              <View style={styles.lineHead}>
                <AppText variant="monoStrong">{n + 1}</AppText>
                <AppText variant="bodyStrong">{i.partName}</AppText>
              </View>
              <SteelLine steelAction={steelActionLabels[i.direction.steelAction]} undo={undoPathLabels[i.direction.undoPath]} irreversible={i.direction.irreversible} />
            </View>
          ))}
        </Group>
      ) : null}

      {impact.endedProducts.length > 0 ? (
        <Group title={`Ends ${impact.endedProducts.length === 1 ? 'this product' : `these ${impact.endedProducts.length} products`}`} testID={`${testID}-ended`}>
          {impact.endedProducts.map((p) => (
            <View key={p.id} style={[styles.line, styles.endedLine]} testID={`${testID}-ended-${p.sku}`}>
              <View style={styles.lineHead}>
                <Icon name="irreversible" size={18} color={colors.irreversible} />
                <AppText variant="monoStrong">{p.sku}</AppText>
                <AppText variant="bodyStrong" style={styles.shrink}>
                  {p.name}
                </AppText>
              </View>
              <AppText variant="small">
                {productStatusLabels[p.status]}
                {p.plannedUnits > 0 ? ` · ${formatUnits(p.plannedUnits)} planned units` : ''} · needs {p.affectedParts.map((a) => a.name).join(', ')}
              </AppText>
            </View>
          ))}
          {impact.endedPlannedUnits > 0 ? (
            <AppText variant="small" tone="irreversible">
              {formatUnits(impact.endedPlannedUnits)} planned units in all could no longer be made from this tool.
            </AppText>
          ) : null}
        </Group>
      ) : null}

      {impact.waysToKeep.length > 0 ? (
        <Group title="Ways to keep them" testID={`${testID}-ways`}>
          {impact.waysToKeep.map((w) => (
            <View key={w.kind} style={styles.line} testID={`${testID}-way-${w.kind}`}>
              <View style={styles.lineHead}>
                <Icon name={w.kind === 'new_insert' ? 'returned' : 'tool'} size={18} color={colors.inkSoft} />
                <AppText variant="bodyStrong" style={styles.shrink}>
                  {w.kind === 'new_insert' ? 'Replacement insert' : 'Duplicate tool'}
                </AppText>
                <AppText variant={w.costCents === null ? 'small' : 'monoStrong'}>{w.costCents === null ? 'No estimate yet' : formatCents(w.costCents)}</AppText>
              </View>
              <AppText variant="small">{w.sentence}</AppText>
            </View>
          ))}
        </Group>
      ) : null}

      {impact.keptProducts.length > 0 ? (
        <Group title="Moves to the new revision" testID={`${testID}-kept`}>
          {impact.keptProducts.map((p) => (
            <View key={p.id} style={styles.line} testID={`${testID}-kept-${p.sku}`}>
              <View style={styles.lineHead}>
                <Icon name="arrow-right" size={18} color={colors.go} />
                <AppText variant="monoStrong">{p.sku}</AppText>
                <AppText variant="bodyStrong" style={styles.shrink}>
                  {p.name}
                </AppText>
              </View>
              <AppText variant="small">Built from the changed {p.affectedParts.map((a) => a.name).join(', ')} after the change.</AppText>
            </View>
          ))}
        </Group>
      ) : null}

      {impact.unaffectedProducts.length > 0 ? (
        <Group title="Not affected" testID={`${testID}-unaffected`}>
          {impact.unaffectedProducts.map((p) => (
            <View key={p.id} style={styles.line} testID={`${testID}-unaffected-${p.sku}`}>
              <View style={styles.lineHead}>
                <Icon name="done" size={18} color={colors.inkSoft} />
                <AppText variant="monoStrong">{p.sku}</AppText>
                <AppText variant="bodyStrong" style={styles.shrink}>
                  {p.name}
                </AppText>
              </View>
              <AppText variant="small">{p.reasonText}</AppText>
            </View>
          ))}
        </Group>
      ) : null}
    </View>
  );
}

/** Steel action and undo path in words, with the cannot-be-undone mark where it applies. */
export function SteelLine({ steelAction, undo, irreversible, testID }: { steelAction: string; undo: string; irreversible: boolean; testID?: string }) {
  return (
    <View style={styles.steel} testID={testID}>
      <View style={styles.steelRow}>
        <AppText variant="small" style={styles.steelLabel}>
          Steel
        </AppText>
        <AppText variant="label" style={styles.shrink}>
          {steelAction}
        </AppText>
      </View>
      <View style={styles.steelRow}>
        <AppText variant="small" style={styles.steelLabel}>
          Undo
        </AppText>
        <View style={[styles.undo, styles.shrink]}>
          {irreversible ? <Icon name="irreversible" size={16} color={colors.irreversible} /> : <Icon name="returned" size={16} color={colors.go} />}
          <AppText variant="label" tone={irreversible ? 'irreversible' : 'go'} style={styles.shrink}>
            {irreversible ? `Cannot be undone. ${undo}` : undo}
          </AppText>
        </View>
      </View>
    </View>
  );
}

function Group({ title, children, testID }: { title: string; children: React.ReactNode; testID?: string }) {
  return (
    <View style={styles.group} testID={testID}>
      <AppText variant="caption" role="heading" aria-level={3}>
        {title}
      </AppText>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.lg },
  group: { gap: space.sm },
  line: { gap: space.xxs, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: colors.steelLight },
  endedLine: { borderLeftWidth: 3, borderLeftColor: colors.irreversible, paddingLeft: space.sm, borderBottomColor: colors.irreversibleWash },
  lineHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  shrink: { flexShrink: 1 },
  steel: { gap: space.xxs, padding: space.sm, borderRadius: radii.md, backgroundColor: colors.paper },
  steelRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  steelLabel: { width: 44 },
  undo: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs },
});
