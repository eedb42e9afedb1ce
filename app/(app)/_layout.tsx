import { Stack } from 'expo-router';
import { RequireSession } from '@/features/auth/components/require-session';

/** Everything in (app) needs a signed-in user; others go to /sign-in. */
export default function SignedInLayout() {
  return (
    <RequireSession>
      <Stack screenOptions={{ headerShown: false }} />
    </RequireSession>
  );
}
