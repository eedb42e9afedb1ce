import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import type { ToolDetail } from '@shared/schemas/registry';
import { MakeablePill, ProductStatusPill } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { StatusPill } from '@/components/ui/status-pill';
import { formatDay } from '@/lib/registry-format';
import { colors, radii, space } from '@/theme';

type Revision = ToolDetail['revisions'][number];
type RevisionProduct = Revision['products'][number];

/** The tool's history, newest first, each revision with the products bound to it. */
export function RevisionTimeline({ revisions }: { revisions: ToolDetail['revisions'] }) {
  return (
    <View testID="tool-revisions" role="list">
      {revisions.map((r, i) => (
        <View key={r.id} style={styles.item} role="listitem" testID={`tool-revision-${r.number}`}>
          <View style={styles.rail}>
            <View style={[styles.dot, r.isCurrent && styles.dotCurrent]} />
            {i < revisions.length - 1 ? <View style={styles.line} /> : null}
          </View>
          <View style={styles.body}>
            <View style={styles.title}>
              <AppText variant="monoStrong">Rev {r.number}</AppText>
              <AppText variant="monoSmall">{formatDay(r.madeOn)}</AppText>
              {r.isCurrent ? <StatusPill label="Current" icon="done" tone="go" /> : <StatusPill label="Superseded" icon="history" tone="neutral" />}
            </View>
            {r.note ? <AppText variant="body">{r.note}</AppText> : null}
            {r.changeRequestId ? (
              <AppText variant="small">{`Made by change request ${r.changeRequestId.slice(0, 8)}`}</AppText>
            ) : r.number > 1 ? (
              <AppText variant="small">Entered by hand: no change request on record</AppText>
            ) : !r.note ? (
              <AppText variant="small">The tool as built</AppText>
            ) : null}
            <View style={styles.products}>
              {r.products.length === 0 ? (
                <AppText variant="small" tone="faint">
                  No product is bound to this revision.
                </AppText>
              ) : (
                r.products.map((p) => <RevisionProductRow key={p.id} p={p} />)
              )}
            </View>
          </View>
        </View>
      ))}
    </View>
  );
}

function RevisionProductRow({ p }: { p: RevisionProduct }) {
  const parts = p.parts.map((x) => (x.quantityPerUnit > 1 ? `${x.partName} ×${x.quantityPerUnit}` : x.partName)).join(', ');
  return (
    <Link href={{ pathname: '/products/[id]', params: { id: p.id } }} asChild>
      <Pressable style={styles.product} role="link" accessibilityLabel={`Open product ${p.sku} ${p.name}`} testID={`tool-revision-product-${p.sku}`}>
        <View style={styles.productText}>
          <AppText variant="monoSmall">{p.sku}</AppText>
          <AppText variant="bodyStrong">{p.name}</AppText>
          <AppText variant="small">Needs {parts}</AppText>
          <View style={styles.pills}>
            <ProductStatusPill status={p.status} />
            <MakeablePill canBeMade={p.canBeMade} testID={`tool-revision-product-${p.sku}-makeable`} />
          </View>
          <View style={styles.mold}>
            <Icon name={p.moldableFromThisTool ? 'done' : 'irreversible'} size={16} color={p.moldableFromThisTool ? colors.go : colors.inkSoft} />
            <AppText variant="small" style={styles.moldText}>
              {p.moldableFromThisTool ? 'This tool molds these parts as it is now.' : 'This tool can no longer mold these parts.'}
            </AppText>
          </View>
          {!p.canBeMade ? <AppText variant="small">{p.reason}</AppText> : null}
        </View>
        <Icon name="chevron-right" size={18} color={colors.steel} />
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  item: { flexDirection: 'row', gap: space.md },
  rail: { width: 16, alignItems: 'center' },
  dot: { width: 14, height: 14, borderRadius: 7, borderWidth: 2, borderColor: colors.steel, backgroundColor: colors.card, marginTop: 4 },
  dotCurrent: { borderColor: colors.go, backgroundColor: colors.go },
  line: { flex: 1, width: 2, backgroundColor: colors.steelLight, marginTop: 2 },
  body: { flex: 1, gap: space.xs, paddingBottom: space.xl },
  title: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  products: { gap: space.sm, marginTop: space.xs },
  product: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    padding: space.md,
    borderWidth: 1,
    borderColor: colors.steelLight,
    borderRadius: radii.md,
    backgroundColor: colors.card,
  },
  productText: { flex: 1, gap: 2 },
  pills: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginTop: space.xs },
  mold: { flexDirection: 'row', alignItems: 'center', gap: space.xs, marginTop: space.xs },
  moldText: { flex: 1 },
});
