import { BrandsScreen } from '@/features/admin/screens/brands-screen';

export default function BrandsRoute() {
  return <BrandsScreen />;
}
