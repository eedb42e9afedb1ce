import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';

/** Products and the parts they are built from. Placeholder until products exist. */
export function ProductListScreen() {
  return (
    <Screen title="Products" subtitle="What is sold, and which tools it needs" testID="products-screen">
      <EmptyState
        icon="product"
        title="No products yet"
        body="Products arrive here when they are entered with their bill of parts, so every change shows which products it ends."
        testID="products-empty"
      />
    </Screen>
  );
}
