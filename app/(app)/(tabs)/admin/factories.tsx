import { FactoriesScreen } from '@/features/admin/screens/factories-screen';

export default function FactoriesRoute() {
  return <FactoriesScreen />;
}
