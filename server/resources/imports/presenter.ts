import type { ImportRecord } from './repository';

/** An import's progress and rejected lines; ids as strings, instants as ISO 8601. */
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
  rejected: r.rejected,
  errors: r.errors,
  createdAt: r.createdAt.toISOString(),
  finishedAt: r.finishedAt ? r.finishedAt.toISOString() : null,
});
