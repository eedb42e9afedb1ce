import { ProductListScreen } from '@/features/products/screens/product-list-screen';

export default function ProductsRoute() {
  return <ProductListScreen />;
}
