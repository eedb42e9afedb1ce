import { Stack } from 'expo-router';
import { AdminOnly } from '@/features/admin/components/admin-only';

/** Administration: admins only (the server refuses others anyway); others see why. */
export default function AdminLayout() {
  return (
    <AdminOnly>
      <Stack screenOptions={{ headerShown: false }} />
    </AdminOnly>
  );
}
