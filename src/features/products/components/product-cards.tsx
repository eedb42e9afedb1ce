import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { formatCents } from '@shared/domain/money';
import type { ProductDetail } from '@shared/schemas/registry';
import { LifeGauge } from '@/components/registry/life-gauge';
import { ToolStatusPill } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { formatShots, plural } from '@/lib/registry-format';
import { colors, radii, space } from '@/theme';
import { useWide } from '@/theme/use-wide';

/** "Can it still be made?": the answer in words, why, and what would stop or slow it. */
export function MakeabilityCard({ product }: { product: ProductDetail }) {
  const m = product.makeability;
  return (
    <Card accent={m.canBeMade ? 'go' : 'due'} testID="product-makeability">
      <AppText variant="caption">Can it still be made?</AppText>
      <View style={styles.answer}>
        <Icon name={m.canBeMade ? 'done' : 'alert'} size={28} color={m.canBeMade ? colors.go : colors.due} strokeWidth={2} />
        <AppText variant="title" style={{ color: m.canBeMade ? colors.go : colors.due }} testID="product-makeability-answer">
          {m.canBeMade ? 'Yes, it can be made' : 'No, not as things stand'}
        </AppText>
      </View>
      <AppText variant="body" testID="product-makeability-reason">
        {m.reason}
      </AppText>
      {m.blockers.length > 1 || (m.blockers.length === 1 && m.blockers[0]!.message !== m.reason) ? (
        <View style={styles.list} testID="product-blockers">
          <AppText variant="label">What stops it</AppText>
          {m.blockers.map((b, i) => (
            <View key={i} style={styles.item}>
              <Icon name="alert" size={16} color={colors.due} />
              <AppText variant="body" style={styles.itemText}>
                {b.message}
              </AppText>
            </View>
          ))}
        </View>
      ) : null}
      {m.warnings.length ? (
        <View style={styles.list} testID="product-warnings">
          <AppText variant="label">Worth checking before a run</AppText>
          {m.warnings.map((w) => (
            <View key={w} style={styles.item}>
              <Icon name="warning" size={16} color={colors.due} />
              <AppText variant="body" style={styles.itemText}>
                {w}
              </AppText>
            </View>
          ))}
        </View>
      ) : null}
      {product.hiddenLines > 0 ? (
        <AppText variant="small">
          {`${plural(product.hiddenLines, 'part')} of this product come${product.hiddenLines === 1 ? 's' : ''} from tools at another factory, not shown to you; the answer counts them.`}
        </AppText>
      ) : null}
    </Card>
  );
}

const money = (cents: number | null, currency: string) => (cents === null ? 'Not set' : formatCents(cents, currency));

/** FOB cost, wholesale and retail prices, planned units: figures in IBM Plex Mono. */
export function PricesCard({ product }: { product: ProductDetail }) {
  const rows: [string, string, string][] = [
    ['FOB cost', money(product.fobCents, product.currency), 'product-fob'],
    ['Wholesale', money(product.wholesaleCents, product.currency), 'product-wholesale'],
    ['Retail', money(product.retailCents, product.currency), 'product-retail'],
    ['Planned units', formatShots(product.plannedUnits), 'product-units'],
  ];
  return (
    <Card testID="product-prices">
      <AppText variant="heading" role="heading" aria-level={2}>
        Prices and plan
      </AppText>
      <View style={styles.figures}>
        {rows.map(([label, value, id]) => (
          <View key={label} style={styles.figure}>
            <AppText variant="caption">{label}</AppText>
            <AppText variant="monoStrong" style={styles.big} testID={id}>
              {value}
            </AppText>
          </View>
        ))}
      </View>
      <AppText variant="small">Amounts in {product.currency}.</AppText>
    </Card>
  );
}

/** The tools the product depends on and the revisions it needs from each (links to the tools). */
export function ProductToolsCard({ product }: { product: ProductDetail }) {
  if (product.tools.length === 0) {
    return (
      <Card>
        <AppText variant="body" tone="soft">
          No tools are on record for this product: its bill of parts is empty.
        </AppText>
      </Card>
    );
  }
  return (
    <View style={styles.tools} testID="product-tools">
      {product.tools.map((t) => {
        const ok = t.status !== 'disposed' && t.revisionsNeeded.every((r) => r === t.currentRevision);
        return (
          <Link key={t.id} href={{ pathname: '/tools/[id]', params: { id: t.id } }} asChild>
            <Pressable style={styles.tool} role="link" accessibilityLabel={`Open tool ${t.code}, ${t.name}`} testID={`product-tool-${t.code}`}>
              <View style={styles.toolText}>
                <View style={styles.toolTop}>
                  <AppText variant="monoStrong">{t.code}</AppText>
                  <ToolStatusPill status={t.status} />
                </View>
                <AppText variant="bodyStrong">{t.name}</AppText>
                <View style={styles.item}>
                  <Icon name={ok ? 'done' : 'alert'} size={16} color={ok ? colors.go : colors.due} />
                  <AppText variant="small" style={styles.itemText}>
                    {`Needs rev ${t.revisionsNeeded.join(', ')}; the tool is at rev ${t.currentRevision}`}
                    {t.status === 'disposed' ? ' and is disposed' : ''}
                  </AppText>
                </View>
              </View>
              <Icon name="chevron-right" size={18} color={colors.steel} />
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}

/** Each line of the bill of parts: part, tool, revision, quantity, and whether it can be molded now. */
export function BillCard({ product }: { product: ProductDetail }) {
  const wide = useWide();
  return (
    <Card padded={false} testID="product-bill">
      {product.bill.length === 0 ? (
        <AppText variant="body" tone="soft" style={styles.empty}>
          No bill of parts recorded. Load one with a bill-of-parts CSV from the Tools tab.
        </AppText>
      ) : (
        product.bill.map((l, i) => (
          <View key={l.id} style={[styles.line, i < product.bill.length - 1 && styles.divider]} testID={`product-bill-${l.tool.code}-${l.part.name}`}>
            <View style={[styles.lineTop, !wide && styles.lineTopPhone]}>
              <View style={styles.toolText}>
                <AppText variant="bodyStrong">
                  {l.part.name}
                  {l.quantityPerUnit > 1 ? <AppText variant="mono">{`  ×${l.quantityPerUnit}`}</AppText> : null}
                </AppText>
                <AppText variant="monoSmall">{`${l.tool.code} · rev ${l.revision} · ${l.part.resin} · ${l.part.cavitiesPerShot} per shot`}</AppText>
              </View>
              <View style={wide ? styles.lineGauge : styles.lineGaugePhone}>
                <LifeGauge life={l.tool.life} compact />
              </View>
            </View>
            <View style={styles.item}>
              <Icon name={l.moldable ? 'done' : 'alert'} size={16} color={l.moldable ? colors.go : colors.due} />
              <AppText variant="small" style={styles.itemText}>
                {l.moldable ? `Molded now on ${l.tool.code} at ${l.tool.factory.name}` : (l.problem ?? 'Cannot be molded now')}
              </AppText>
            </View>
          </View>
        ))
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  answer: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  list: { gap: space.xs },
  item: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs },
  itemText: { flex: 1 },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  figure: { minWidth: 120, flexGrow: 1, flexBasis: 120, gap: 2 },
  big: { fontSize: 18, lineHeight: 26 },
  tools: { gap: space.sm },
  tool: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    padding: space.lg,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.steelLight,
    borderRadius: radii.lg,
  },
  toolText: { flex: 1, gap: 2, minWidth: 0 },
  toolTop: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  empty: { padding: space.lg },
  line: { padding: space.lg, gap: space.sm },
  lineTop: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start', flexWrap: 'wrap' },
  lineTopPhone: { flexDirection: 'column', gap: space.sm },
  lineGauge: { width: 180 },
  lineGaugePhone: { alignSelf: 'stretch' },
  divider: { borderBottomWidth: 1, borderBottomColor: colors.steelLight },
});
