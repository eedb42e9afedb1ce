import { Stack, useLocalSearchParams } from 'expo-router';
import { SignInScreen } from '@/features/auth/screens/sign-in-screen';

export default function SignInRoute() {
  const { next } = useLocalSearchParams<{ next?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Sign in · Toolgate' }} />
      <SignInScreen next={next} />
    </>
  );
}
