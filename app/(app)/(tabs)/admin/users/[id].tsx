import { useLocalSearchParams } from 'expo-router';
import { UserDetailScreen } from '@/features/admin/screens/user-detail-screen';

export default function UserRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <UserDetailScreen userId={id} />;
}
