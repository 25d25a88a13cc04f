import type { ImportRecord, TouchedMeterRun } from './repository';

/**
 * An import's progress and rejected lines; ids as strings, instants as ISO 8601. The kept
 * original is described by its hash and uploader; where it lies on disk is not shown.
 */
export const presentImport = (r: ImportRecord) => ({
  id: r.id,
  kind: r.kind,
  filename: r.filename,
  status: r.status,
  bytesTotal: r.bytesTotal,
  bytesRead: r.bytesRead,
  rowsRead: r.rowsRead,
  rowsImported: r.rowsImported,
  duplicates: r.duplicates,
  conflicts: r.conflicts,
  rejected: r.rejected,
  errors: r.errors,
  createdAt: r.createdAt.toISOString(),
  finishedAt: r.finishedAt ? r.finishedAt.toISOString() : null,
  sha256: r.sha256,
  uploadedBy: r.uploadedBy,
  uploadedAt: r.createdAt.toISOString(),
});

/** An import's detail: as in the list, then the meter runs it touched (ids as strings), added last. */
export const presentImportDetail = (r: ImportRecord, meterRuns: readonly TouchedMeterRun[]) => ({
  ...presentImport(r),
  meterRuns: meterRuns.map((m) => ({ id: m.id, tag: m.tag })),
});

/**
 * `Content-Disposition` of a download under the name it was uploaded with: the name quoted
 * (RFC 6266), and, when it is not plain ASCII, also in UTF-8 as `filename*` (RFC 8187), which
 * browsers prefer; the quoted form then has `_` for each character it cannot carry.
 */
export function attachmentDisposition(filename: string): string {
  const ascii = filename.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '\\$&');
  const plain = `attachment; filename="${ascii}"`;
  if (!/[^\x20-\x7e]/.test(filename)) return plain;
  const utf8 = encodeURIComponent(filename).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${plain}; filename*=UTF-8''${utf8}`;
}
