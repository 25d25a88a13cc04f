/**
 * Holds who is signed in. The session is read from storage after the first render, never
 * during it, because the static export renders every page in Node where no storage exists:
 * the first client render must match that HTML, so both start as `loading`.
 */
import { useQueryClient } from '@tanstack/react-query';
import { createContext, useCallback, useContext, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';

import { configureApiClient } from '@/hooks/api/client';
import { clearSession, readSession, subscribeToSessionChanges, writeSession } from './sessionStore';
import type { SessionUser, StoredSession } from './storedSession';

export type SessionState =
  | { status: 'loading' }
  | { status: 'signed-out'; reason?: 'expired' | 'signed-out' }
  | { status: 'signed-in'; token: string; user: SessionUser };

interface SessionContextValue {
  state: SessionState;
  signIn: (session: StoredSession) => void;
  signOut: (reason?: 'expired' | 'signed-out') => void;
  /** Replaces the stored user after the server reports a change (name, role). */
  updateUser: (user: SessionUser) => void;
}

const SessionContext = createContext<SessionContextValue | null>(null);

/** Provides the session to everything below it; needs a QueryClientProvider above it. */
export function SessionProvider({ children }: { children: ReactNode }) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<SessionState>({ status: 'loading' });
  const tokenRef = useRef<string | null>(null);

  const adopt = useCallback((session: StoredSession | null, reason?: 'expired' | 'signed-out') => {
    tokenRef.current = session?.token ?? null;
    setState(session ? { status: 'signed-in', ...session } : { status: 'signed-out', reason });
  }, []);

  const signOut = useCallback(
    (reason: 'expired' | 'signed-out' = 'signed-out') => {
      clearSession();
      adopt(null, reason);
      // Nothing fetched for one user may be shown to the next.
      queryClient.clear();
    },
    [adopt, queryClient],
  );

  const signIn = useCallback(
    (session: StoredSession) => {
      queryClient.clear();
      writeSession(session);
      adopt(session);
    },
    [adopt, queryClient],
  );

  const updateUser = useCallback((user: SessionUser) => {
    setState((current) => {
      if (current.status !== 'signed-in') return current;
      const same =
        current.user.name === user.name && current.user.role === user.role && current.user.email === user.email;
      if (same) return current;
      writeSession({ token: current.token, user });
      return { ...current, user };
    });
  }, []);

  useEffect(() => {
    configureApiClient({
      getToken: () => tokenRef.current,
      onUnauthorized: () => {
        if (tokenRef.current) signOut('expired');
      },
    });
    adopt(readSession());
    return subscribeToSessionChanges((session) => {
      if (!session) queryClient.clear();
      adopt(session, 'signed-out');
    });
  }, [adopt, signOut, queryClient]);

  const value = useMemo(() => ({ state, signIn, signOut, updateUser }), [state, signIn, signOut, updateUser]);
  return <SessionContext.Provider value={value}>{children}</SessionContext.Provider>;
}

/** @returns the session and the functions that change it */
export function useSession(): SessionContextValue {
  const value = useContext(SessionContext);
  if (!value) throw new Error('useSession: no SessionProvider above this component');
  return value;
}

/**
 * For screens inside the signed-in area, where the layout guarantees a user.
 * @returns the signed-in user
 */
export function useSignedInUser(): SessionUser {
  const { state } = useSession();
  if (state.status !== 'signed-in') throw new Error('useSignedInUser: used outside the signed-in area');
  return state.user;
}
