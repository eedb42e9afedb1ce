import { useLocalSearchParams } from 'expo-router';
import { SignScreen } from '@/features/workflow/screens/sign-screen';

export default function SignRequestRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <SignScreen requestId={id} />;
}
