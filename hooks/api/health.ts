/** Server health: GET /api/health (no sign-in needed). */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

export const healthKeys = {
  all: ['health'] as const,
};

const healthSchema = z.object({
  status: z.string(),
  database: z.string(),
  broker: z.string(),
});
export type Health = z.infer<typeof healthSchema>;

/** How often the shell re-checks the server, in milliseconds. */
const healthPollMs = 60_000;

/** @returns the server's health, re-checked every minute */
export function useHealth() {
  return useQuery({
    queryKey: healthKeys.all,
    queryFn: ({ signal }) => apiRequest({ path: '/health', schema: healthSchema, authenticated: false, signal }),
    refetchInterval: healthPollMs,
  });
}

/** @returns whether every part the health check reports is up */
export function isHealthy(health: Health): boolean {
  return health.status === 'ok' && health.database === 'up' && health.broker === 'up';
}
