/** Sizes and counts as the imports screen shows them. */

/**
 * @param bytes a size in bytes
 * @returns e.g. "812 B", "14.2 kB", "3.5 MB" (decimal prefixes, as file managers on the web show)
 */
export function formatBytes(bytes: number): string {
  if (!Number.isFinite(bytes) || bytes < 0) return '—';
  if (bytes < 1000) return `${bytes} B`;
  if (bytes < 1e6) return `${(bytes / 1e3).toFixed(1)} kB`;
  if (bytes < 1e9) return `${(bytes / 1e6).toFixed(1)} MB`;
  return `${(bytes / 1e9).toFixed(2)} GB`;
}

/** @returns a count with digit grouping, e.g. "12,400" */
export function formatCount(count: number): string {
  return count.toLocaleString();
}
