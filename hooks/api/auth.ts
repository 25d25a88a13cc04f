/** Sign-in and the current user: POST /api/auth/login, GET /api/auth/me. */
import { useMutation, useQuery, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { sessionUserSchema, type SessionUser, type StoredSession } from '@/hooks/session/storedSession';
import { apiRequest } from './client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

const loginResponseSchema = z.object({ token: z.string().min(1), user: sessionUserSchema });
const meResponseSchema = z.object({ user: sessionUserSchema });

export interface Credentials {
  email: string;
  password: string;
}

/** @returns a mutation that exchanges an email and password for a session */
export function useLogin() {
  return useMutation({
    mutationFn: (credentials: Credentials): Promise<StoredSession> =>
      apiRequest({
        method: 'POST',
        path: '/auth/login',
        body: credentials,
        schema: loginResponseSchema,
        authenticated: false,
      }),
  });
}

/**
 * The signed-in user as the server sees them now (their role may have changed since sign-in).
 * @param enabled fetch only while someone is signed in
 */
export function useMe(enabled: boolean) {
  return useQuery({
    queryKey: authKeys.me(),
    queryFn: async ({ signal }): Promise<SessionUser> =>
      (await apiRequest({ path: '/auth/me', schema: meResponseSchema, signal })).user,
    enabled,
  });
}

/** Puts a known current user into the cache, e.g. straight after sign-in. */
export function setMe(queryClient: QueryClient, user: SessionUser): void {
  queryClient.setQueryData(authKeys.me(), user);
}
