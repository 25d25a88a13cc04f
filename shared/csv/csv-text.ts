/**
 * CSV text as RFC 4180 writes it: fields separated by commas, records by CRLF, and a field
 * quoted (with each `"` doubled) when it holds a comma, a quote, a CR or an LF. Leading and
 * trailing spaces are kept as data. Exports (audit events, volumes) write with this.
 */

/** A cell: text as is, numbers in JavaScript's shortest round-trip form, null and undefined empty. */
export type CsvCell = string | number | boolean | null | undefined;

/** @returns one field, quoted only when it must be */
export function csvField(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * @param header the column names, written as the first record
 * @param rows one array of cells per record, in the header's order
 * @returns the whole file, each record ended by CRLF
 */
export function csvText(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((record) => `${record.map(csvField).join(',')}\r\n`).join('');
}
