import { useState, type ReactNode } from 'react';
import { View } from 'react-native';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { sessionKeys } from '@/api/auth';
import { createQueryClient } from '@/api/query-client';
import { colors } from '@/theme';
import { appFonts } from '@/theme/fonts';

/** Root providers: one QueryClient, safe areas, and the bundled fonts (nothing renders until they load). */
export function AppProviders({ children }: { children: ReactNode }) {
  const [client] = useState(() =>
    // Any 401 means the session ended (expired, or the account was deactivated): back to sign-in.
    createQueryClient((qc) => qc.setQueryData(sessionKeys.me(), null)),
  );
  const [fontsLoaded, fontError] = useFonts(appFonts);
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={client}>
        {fontsLoaded || fontError ? children : <View style={{ flex: 1, backgroundColor: colors.paper }} />}
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
