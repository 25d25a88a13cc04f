import type { QueryClient } from '@tanstack/react-query';

/**
 * Puts one created or changed item into a cached list, so a screen shows it before the refetch
 * that follows every mutation (used by sites.ts, meterRuns.ts and transmitters.ts). A list not
 * in the cache is left alone: there is nothing on screen to update.
 * @param queryClient the app's query client
 * @param key the list's query key
 * @param item the item as the server returned it
 */
export function upsertInList<T extends { id: string }>(
  queryClient: QueryClient,
  key: readonly unknown[],
  item: T,
): void {
  queryClient.setQueryData<T[]>(key, (list) => {
    if (!list) return list;
    return list.some((existing) => existing.id === item.id)
      ? list.map((existing) => (existing.id === item.id ? item : existing))
      : [...list, item];
  });
}
