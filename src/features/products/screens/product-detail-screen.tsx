import { StyleSheet, View } from 'react-native';
import type { ProductDetail } from '@shared/schemas/registry';
import { ProductStatusPill } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { plural } from '@/lib/registry-format';
import { space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { BillCard, MakeabilityCard, PricesCard, ProductToolsCard } from '../components/product-cards';
import { useCanEditRegistry, useProduct } from '../hooks';

const back = { href: '/products' as const, label: 'Products' };

export function ProductDetailScreen({ productId }: { productId: string }) {
  const product = useProduct(productId);
  if (product.isPending) return <Loading fill label="Loading product…" />;
  if (product.isError) {
    return (
      <Screen title="Product" back={back} testID="product-detail">
        <ErrorState error={product.error} onRetry={() => void product.refetch()} />
      </Screen>
    );
  }
  return <ProductDetailView product={product.data} />;
}

function ProductDetailView({ product }: { product: ProductDetail }) {
  const wide = useWide();
  const canEdit = useCanEditRegistry();
  const header = (
    <Card testID="product-header">
      <View style={styles.skuRow}>
        <AppText variant="monoStrong" style={styles.sku} testID="product-sku">
          {product.sku}
        </AppText>
        <ProductStatusPill status={product.status} testID="product-status" />
      </View>
      <AppText variant="small">{product.brand.name}</AppText>
    </Card>
  );
  const tools = (
    <Section title="Tools it depends on" description={`${plural(product.tools.length, 'tool')}, with the revision whose geometry it needs`} testID="product-tools-section">
      <ProductToolsCard product={product} />
    </Section>
  );
  const bill = (
    <Section title="Bill of parts" description={plural(product.bill.length, 'line')}>
      <BillCard product={product} />
    </Section>
  );
  return (
    <Screen
      eyebrow={`Product · ${product.brand.name}`}
      title={product.name}
      back={back}
      actions={canEdit ? <Button title="Edit product" icon="edit" variant="secondary" href={{ pathname: '/products/[id]/edit', params: { id: product.id } }} testID="product-edit" /> : null}
      testID="product-detail"
    >
      {header}
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.column}>
            <MakeabilityCard product={product} />
            <PricesCard product={product} />
          </View>
          <View style={styles.column}>{tools}</View>
        </View>
      ) : (
        <>
          <MakeabilityCard product={product} />
          {tools}
          <PricesCard product={product} />
        </>
      )}
      {bill}
    </Screen>
  );
}

const styles = StyleSheet.create({
  skuRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  sku: { fontSize: 22, lineHeight: 28 },
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  column: { flex: 1, gap: space.lg, minWidth: 0 },
});
