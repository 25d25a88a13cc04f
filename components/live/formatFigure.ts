/**
 * Numbers and ages as an operator reads them: enough digits to see a change, no more.
 */

/**
 * @param value a measured figure
 * @returns the figure with grouping and 0–3 decimals by size (1234.5 → "1,235"; 12.345 → "12.3"; 0.4567 → "0.457")
 */
export function formatFigure(value: number): string {
  if (!Number.isFinite(value)) return '—';
  const size = Math.abs(value);
  const decimals = size >= 100 ? 0 : size >= 10 ? 1 : size >= 1 ? 2 : size === 0 ? 0 : 3;
  return value.toLocaleString(undefined, { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

/**
 * @param seconds an age or a duration in seconds
 * @returns a short reading such as "8 s", "3 min", "2 h 5 min" or "3 d 4 h"
 */
export function formatAge(seconds: number): string {
  if (!Number.isFinite(seconds)) return '—';
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  const minutes = Math.floor(s / 60);
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return minutes % 60 ? `${hours} h ${minutes % 60} min` : `${hours} h`;
  const days = Math.floor(hours / 24);
  return hours % 24 ? `${days} d ${hours % 24} h` : `${days} d`;
}

/**
 * @param share a share of span (0.42 for 42 %)
 * @returns the share as a whole percent, or with one decimal below 10 % where it matters most
 */
export function formatShare(share: number): string {
  const percent = share * 100;
  return `${Math.abs(percent) < 10 ? percent.toFixed(1) : Math.round(percent)} %`;
}
