/**
 * The sign-in guard, run by the root layout: a signed-out visitor anywhere but the sign-in
 * screen goes there (remembering the page they asked for), and a signed-in user on the sign-in
 * screen goes on to that page or the live board.
 */
import { useGlobalSearchParams, usePathname, useRouter, useSegments } from 'expo-router';
import { useEffect } from 'react';

import { safeReturnPath } from './safeReturnPath';
import { useSession } from './SessionProvider';

export function useSignInGuard(): void {
  const { state } = useSession();
  const segments = useSegments();
  const pathname = usePathname();
  const { next } = useGlobalSearchParams<{ next?: string }>();
  const router = useRouter();
  const inAuthGroup = segments[0] === '(auth)';
  const reason = state.status === 'signed-out' ? state.reason : undefined;

  useEffect(() => {
    if (state.status === 'loading') return;
    if (state.status === 'signed-out' && !inAuthGroup) {
      // After a deliberate sign-out the next person starts on the live board; after an expired
      // session or on a deep link, sign-in returns to the page that was asked for.
      const returnTo = reason === 'signed-out' ? undefined : safeReturnPath(pathname);
      const target = returnTo && returnTo !== '/' ? `/sign-in?next=${encodeURIComponent(returnTo)}` : '/sign-in';
      router.replace(target);
    } else if (state.status === 'signed-in' && inAuthGroup) {
      router.replace(safeReturnPath(next) ?? '/');
    }
  }, [state.status, reason, inAuthGroup, pathname, next, router]);
}
