import { useLocalSearchParams } from 'expo-router';
import { ProductEditScreen } from '@/features/products/screens/product-edit-screen';

export default function ProductEditRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <ProductEditScreen productId={id} />;
}
