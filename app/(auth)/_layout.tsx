/** Signed-out area. Waits for the session to be known, so a signed-in user never sees the form flash. */
import { Navigator, Slot } from 'expo-router';

import { Splash } from '@/components/shell/Splash';
import { useSession } from '@/hooks/session/SessionProvider';

function SignedOutFrame() {
  const { state } = useSession();
  return state.status === 'signed-out' ? <Slot /> : <Splash />;
}

export default function SignedOutLayout() {
  // Navigator keeps the route state while the frame shows the splash instead of the screen.
  return (
    <Navigator>
      <SignedOutFrame />
    </Navigator>
  );
}
