/** Users and their roles (admin only): GET, POST /api/users; PATCH /api/users/:id. */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { roles, type Role } from '@/constants/roles';
import { apiRequest } from './client';

export const userSchema = z.object({
  id: z.union([z.string(), z.number()]).transform(String),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

/** @returns every user, newest accounts last as the server orders them */
export function useUsers() {
  return useQuery({
    queryKey: userKeys.list(),
    queryFn: ({ signal }) => apiRequest({ path: '/users', schema: z.array(userSchema), signal }),
  });
}

export interface NewUser {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export interface UserChange {
  name?: string;
  role?: Role;
  disabled?: boolean;
  /** A new password; the server refuses one its policy does not allow (400 naming password) and signs the user out. */
  password?: string;
}

/** Replaces one user in the cached list, so the screen shows the change without a refetch. */
export function setUserInList(queryClient: QueryClient, user: User): void {
  queryClient.setQueryData<User[]>(userKeys.list(), (list) => {
    if (!list) return list;
    const index = list.findIndex((existing) => existing.id === user.id);
    return index === -1 ? [...list, user] : list.map((existing) => (existing.id === user.id ? user : existing));
  });
}

/** @returns a mutation that creates a user */
export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (user: NewUser) => apiRequest({ method: 'POST', path: '/users', body: user, schema: userSchema }),
    onSuccess: (user) => {
      setUserInList(queryClient, user);
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
    },
  });
}

/** @returns a mutation that renames, re-roles, disables or enables a user */
export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: UserChange }) =>
      apiRequest({ method: 'PATCH', path: `/users/${encodeURIComponent(id)}`, body: change, schema: userSchema }),
    onSuccess: (user) => {
      setUserInList(queryClient, user);
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
    },
  });
}
