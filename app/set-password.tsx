import { Stack, useLocalSearchParams } from 'expo-router';
import { SetPasswordScreen } from '@/features/auth/screens/set-password-screen';

export default function SetPasswordRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Choose your password · Toolgate' }} />
      <SetPasswordScreen token={token} />
    </>
  );
}
