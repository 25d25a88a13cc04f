/**
 * Root layout: fonts, the data cache, the session, and the sign-in guard that sends signed-out
 * visitors to /sign-in and signed-in users away from it.
 */
import { Inter_400Regular } from '@expo-google-fonts/inter/400Regular';
import { Inter_500Medium } from '@expo-google-fonts/inter/500Medium';
import { Inter_600SemiBold } from '@expo-google-fonts/inter/600SemiBold';
import { Inter_700Bold } from '@expo-google-fonts/inter/700Bold';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Navigator, Slot } from 'expo-router';
import { useState } from 'react';

import { Splash } from '@/components/shell/Splash';
import { createQueryClient } from '@/hooks/api/queryClient';
import { SessionProvider } from '@/hooks/session/SessionProvider';
import { useSignInGuard } from '@/hooks/session/useSignInGuard';

/**
 * The navigator stays mounted whatever is drawn: a layout that drops its navigator while it
 * waits (for fonts, for the session) loses the address, and the router falls back to "/".
 */
function RootFrame({ ready }: { ready: boolean }) {
  useSignInGuard();
  return ready ? <Slot /> : <Splash />;
}

export default function RootLayout() {
  const [queryClient] = useState(createQueryClient);
  // One file per weight: importing the package root would bundle all eighteen.
  const [fontsLoaded, fontError] = useFonts({ Inter_400Regular, Inter_500Medium, Inter_600SemiBold, Inter_700Bold });

  return (
    <QueryClientProvider client={queryClient}>
      <SessionProvider>
        <Navigator>
          <RootFrame ready={fontsLoaded || fontError != null} />
        </Navigator>
      </SessionProvider>
    </QueryClientProvider>
  );
}
