import { AdminHomeScreen } from '@/features/admin/screens/admin-home-screen';

export default function AdminRoute() {
  return <AdminHomeScreen />;
}
