/** The state of what the server depends on, as the process checks it (server/index.ts). */
export type Health = { database: 'up' | 'down'; broker: 'up' | 'down' };

/**
 * @param check reads the real state of the database and the broker
 * @returns whether both are up, with the states
 */
export async function serverHealth(check: () => Promise<Health>) {
  const health = await check();
  return { ok: health.database === 'up' && health.broker === 'up', health };
}
