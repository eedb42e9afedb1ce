import { useLocalSearchParams } from 'expo-router';
import { RequestFormScreen } from '@/features/requests/screens/request-form-screen';

export default function EditRequestRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <RequestFormScreen requestId={id} />;
}
