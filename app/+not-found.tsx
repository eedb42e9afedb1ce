import { Stack } from 'expo-router';
import { NotFoundScreen } from '@/components/not-found-screen';

export default function NotFoundRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Not found · Toolgate' }} />
      <NotFoundScreen />
    </>
  );
}
