/**
 * Signed-in area: the shell with navigation by role, and the area guard, which shows a
 * "not available for your role" message in place of any screen the role may not open.
 */
import { Navigator, Slot } from 'expo-router';

import { AppShell } from '@/components/shell/AppShell';
import { AreaGate } from '@/components/shell/AreaGate';
import { Splash } from '@/components/shell/Splash';
import { useSession } from '@/hooks/session/SessionProvider';
import { useSessionRefresh } from '@/hooks/session/useSessionRefresh';

function SignedInFrame() {
  const { state } = useSession();
  useSessionRefresh();
  // Signed out: the root guard is already on its way to /sign-in; show nothing of the app.
  if (state.status !== 'signed-in') return <Splash />;
  return (
    <AppShell user={state.user}>
      <AreaGate role={state.user.role}>
        <Slot />
      </AreaGate>
    </AppShell>
  );
}

export default function SignedInLayout() {
  // The navigator holds the route state even while the gate or the splash replaces the screen;
  // without it the router would lose the address and fall back to "/".
  return (
    <Navigator>
      <SignedInFrame />
    </Navigator>
  );
}
