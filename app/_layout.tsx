/**
 * Root layout: fonts, the data cache, the session, and the sign-in guard that sends signed-out
 * visitors to /sign-in and signed-in users away from it.
 */
import { QueryClientProvider } from '@tanstack/react-query';
import { Navigator, Slot } from 'expo-router';
import { useState } from 'react';

import { useAppFonts } from '@/components/fonts/useAppFonts';
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
  const fontsReady = useAppFonts();

  return (
    <QueryClientProvider client={queryClient}>
      <SessionProvider>
        <Navigator>
          <RootFrame ready={fontsReady} />
        </Navigator>
      </SessionProvider>
    </QueryClientProvider>
  );
}
