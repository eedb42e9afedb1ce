import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { productStatusLabels, productStatuses, type ProductStatus } from '@shared/schemas/registry';
import type { ProductFilters } from '@/api/registry';
import { FilterBar } from '@/components/registry/filter-bar';
import { EmptyState } from '@/components/ui/empty-state';
import { PagedResults } from '@/components/registry/paged-results';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { useDebounced } from '@/lib/use-debounced';
import { space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { ProductRows, ProductTable } from '../components/product-list-views';
import { useBrands, useProductList } from '../hooks';

type Picks = Pick<ProductFilters, 'brandId' | 'status'>;

/** Products: what is sold, its status, and whether it can still be made from the tools as they are. */
export function ProductListScreen() {
  const wide = useWide();
  const brands = useBrands();
  const [search, setSearch] = useState('');
  const [picks, setPicks] = useState<Picks>({});
  const q = useDebounced(search.trim(), 300);
  const list = useProductList({ ...picks, q: q || undefined });
  const products = list.data?.pages.flatMap((p) => p.data) ?? [];
  const filtering = !!q || !!picks.brandId || !!picks.status;

  return (
    <Screen title="Products" subtitle="What is sold, which tools it needs, and whether it can still be made" width={wide ? 'full' : 'content'} testID="products-screen">
      <View style={styles.controls}>
        <TextField
          label="Search"
          placeholder="SKU, product name or tool code"
          value={search}
          onChangeText={setSearch}
          leadingIcon="search"
          autoCapitalize="none"
          autoCorrect={false}
          returnKeyType="search"
          testID="products-search"
        />
        <FilterBar
          selects={[
            {
              key: 'brand',
              label: 'Brand',
              options: (brands.data ?? []).map((b) => ({ value: b.id, label: b.name })),
              value: picks.brandId,
              onChange: (v) => setPicks((p) => ({ ...p, brandId: v })),
            },
            {
              key: 'status',
              label: 'Status',
              options: productStatuses.map((s) => ({ value: s, label: productStatusLabels[s] })),
              value: picks.status,
              onChange: (v) => setPicks((p) => ({ ...p, status: v as ProductStatus | undefined })),
            },
          ]}
          onClear={() => setPicks({})}
          testID="products-filter"
        />
      </View>

      {list.isPending ? (
        <Loading label="Loading products…" />
      ) : list.isError ? (
        <ErrorState error={list.error} onRetry={() => void list.refetch()} />
      ) : products.length === 0 ? (
        filtering ? (
          <EmptyState
            icon="search"
            title={q ? `No product matches “${q}”` : 'No product matches these filters'}
            body="The search looks at SKUs, product names and the codes of the tools a product needs. Check the spelling, or remove a filter."
            action={{ title: 'Clear search and filters', icon: 'close', onPress: () => { setSearch(''); setPicks({}); } }}
            testID="products-empty"
          />
        ) : (
          <EmptyState
            icon="product"
            title="No products yet"
            body="Products arrive here when the tooling engineer loads them with their bill of parts (Tools tab, Import CSV), so every change shows which products it ends."
            testID="products-empty"
          />
        )
      ) : (
        <PagedResults list={list} count={products.length} noun="product" testID="products">
          {wide ? <ProductTable products={products} /> : <ProductRows products={products} />}
        </PagedResults>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  controls: { gap: space.xs },
});
