/**
 * Re-reads the signed-in user from the server (GET /api/auth/me) so a name or role changed by
 * an admin reaches the navigation without a new sign-in. A 401 here ends the session through
 * the API client.
 */
import { useEffect } from 'react';

import { useMe } from '@/hooks/api/auth';
import { useSession } from './SessionProvider';

export function useSessionRefresh(): void {
  const { state, updateUser } = useSession();
  const me = useMe(state.status === 'signed-in');
  useEffect(() => {
    if (me.data) updateUser(me.data);
  }, [me.data, updateUser]);
}
