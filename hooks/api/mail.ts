/** The mail outbox captured by the local SMTP stand-in (admin): GET /api/mail. */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

const mailSchema = z.object({
  id: z.union([z.string(), z.number()]).transform(String),
  to: z.union([z.string(), z.array(z.string())]).transform((to) => (Array.isArray(to) ? to.join(', ') : to)),
  subject: z.string(),
  text: z
    .string()
    .nullable()
    .transform((text) => text ?? ''),
  sentAt: z.string(),
});
export type Mail = z.infer<typeof mailSchema>;

export const mailKeys = {
  all: ['mail'] as const,
  list: () => [...mailKeys.all, 'list'] as const,
};

/** @returns every captured mail as the server lists it */
export function useMail() {
  return useQuery({
    queryKey: mailKeys.list(),
    queryFn: ({ signal }) => apiRequest({ path: '/mail', schema: z.array(mailSchema), signal }),
  });
}
