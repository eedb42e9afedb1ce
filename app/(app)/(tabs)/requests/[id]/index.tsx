import { useLocalSearchParams } from 'expo-router';
import { RequestDetailScreen } from '@/features/requests/screens/request-detail-screen';

export default function RequestRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <RequestDetailScreen requestId={id} />;
}
