import { useLocalSearchParams } from 'expo-router';
import { SignNumbersSection } from '@/features/numbers/components/sign-numbers-section';
import { SignScreen } from '@/features/workflow/screens/sign-screen';

export default function SignRequestRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <SignScreen requestId={id} numbers={<SignNumbersSection requestId={id} />} />;
}
