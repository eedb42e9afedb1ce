import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { formatCents } from '@shared/domain/money';
import type { ProductListItem } from '@shared/schemas/registry';
import { DataTable, type Column } from '@/components/registry/data-table';
import { MakeablePill, ProductStatusPill } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { formatShots } from '@/lib/registry-format';
import { colors, radii, space, touch } from '@/theme';

const productHref = (p: ProductListItem) => ({ pathname: '/products/[id]' as const, params: { id: p.id } });
const tools = (p: ProductListItem) => (p.toolCodes.length ? p.toolCodes.join(' · ') : 'No tools on record');

/** Phone: one row per product with its SKU, status and whether it can still be made. */
export function ProductRows({ products }: { products: readonly ProductListItem[] }) {
  return (
    <View style={styles.list} testID="product-rows" role="list">
      {products.map((p) => (
        <Link key={p.id} href={productHref(p)} asChild>
          <Pressable style={styles.row} role="link" accessibilityLabel={`Open product ${p.sku}, ${p.name}`} testID={`product-row-${p.sku}`}>
            <View style={styles.rowBody}>
              <AppText variant="monoStrong">{p.sku}</AppText>
              <AppText variant="bodyStrong" numberOfLines={2}>
                {p.name}
              </AppText>
              <AppText variant="small" numberOfLines={1}>
                {p.brand.name}
              </AppText>
              <View style={styles.pills}>
                <ProductStatusPill status={p.status} />
                <MakeablePill canBeMade={p.canBeMade} testID={`product-row-${p.sku}-makeable`} />
              </View>
              <AppText variant="monoSmall" numberOfLines={2}>
                {tools(p)}
              </AppText>
            </View>
            <Icon name="chevron-right" size={20} color={colors.steel} />
          </Pressable>
        </Link>
      ))}
    </View>
  );
}

const columns: readonly Column<ProductListItem>[] = [
  { key: 'sku', header: 'SKU', width: 96, render: (p) => <AppText variant="monoStrong">{p.sku}</AppText> },
  {
    key: 'name',
    header: 'Product',
    flex: 2,
    render: (p) => (
      <View style={styles.cellText}>
        <AppText variant="bodyStrong" numberOfLines={2}>
          {p.name}
        </AppText>
        <AppText variant="small" numberOfLines={1}>
          {p.brand.name}
        </AppText>
      </View>
    ),
  },
  { key: 'status', header: 'Status', width: 146, render: (p) => <ProductStatusPill status={p.status} /> },
  { key: 'makeable', header: 'Can it be made?', width: 146, render: (p) => <MakeablePill canBeMade={p.canBeMade} testID={`product-table-${p.sku}-makeable`} /> },
  {
    key: 'tools',
    header: 'Tools',
    flex: 1.3,
    render: (p) => (
      <AppText variant="monoSmall" numberOfLines={3} style={styles.cellText}>
        {tools(p)}
      </AppText>
    ),
  },
  { key: 'units', header: 'Planned units', width: 104, align: 'right', render: (p) => <AppText variant="mono">{formatShots(p.plannedUnits)}</AppText> },
  {
    key: 'retail',
    header: 'Retail',
    width: 84,
    align: 'right',
    render: (p) => <AppText variant="mono">{p.retailCents === null ? '—' : formatCents(p.retailCents, p.currency)}</AppText>,
  },
];

/** Wide screens: the same products as a table. */
export function ProductTable({ products }: { products: readonly ProductListItem[] }) {
  return (
    <DataTable
      caption="Products"
      columns={columns}
      rows={products}
      rowKey={(p) => p.id}
      rowHref={productHref}
      rowLabel={(p) => `Open product ${p.sku}, ${p.name}`}
      rowTestID={(p) => `product-row-${p.sku}`}
      testID="product-table"
    />
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: touch,
    padding: space.lg,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.steelLight,
    borderRadius: radii.lg,
  },
  rowBody: { flex: 1, gap: space.xs },
  pills: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  cellText: { flexShrink: 1, minWidth: 0 },
});
