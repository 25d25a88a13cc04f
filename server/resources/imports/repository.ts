import type { Pool } from 'pg';
import type { ImportKind } from './schema';

/** An import job as stored: its progress and the lines it rejected. */
export interface ImportRecord {
  id: string;
  kind: ImportKind;
  filename: string;
  status: 'running' | 'done' | 'failed';
  bytesTotal: number;
  bytesRead: number;
  rowsRead: number;
  rowsImported: number;
  duplicates: number;
  /** Re-sent readings with another value or quality than the stored ones (recorded as conflicts). */
  conflicts: number;
  rejected: number;
  errors: { line: number; message: string }[];
  createdAt: Date;
  finishedAt: Date | null;
  /** SHA-256 (hex) of the uploaded file; null for imports made before originals were kept. */
  sha256: string | null;
  /** Where the original lies, relative to the data folder; null when it was not kept. */
  originalPath: string | null;
  /** The e-mail of the person who uploaded the file. */
  uploadedBy: string | null;
}

/** bigint columns come from pg as decimal strings. */
interface ImportRow {
  id: string;
  kind: ImportKind;
  filename: string;
  status: ImportRecord['status'];
  bytes_total: string | null;
  bytes_read: string;
  rows_read: string;
  rows_imported: string;
  duplicates: string;
  conflicts: string;
  rejected: string;
  errors: ImportRecord['errors'];
  created_at: Date;
  finished_at: Date | null;
  sha256: string | null;
  original_path: string | null;
  uploaded_by: string | null;
}

const importRecord = (r: ImportRow): ImportRecord => ({
  id: r.id,
  kind: r.kind,
  filename: r.filename,
  status: r.status,
  bytesTotal: Number(r.bytes_total ?? 0),
  bytesRead: Number(r.bytes_read),
  rowsRead: Number(r.rows_read),
  rowsImported: Number(r.rows_imported),
  duplicates: Number(r.duplicates),
  conflicts: Number(r.conflicts),
  rejected: Number(r.rejected),
  errors: r.errors,
  createdAt: r.created_at,
  finishedAt: r.finished_at,
  sha256: r.sha256,
  originalPath: r.original_path,
  uploadedBy: r.uploaded_by,
});

/** An import with the e-mail of its uploader. */
const selectImports = `SELECT i.*, u.email AS uploaded_by FROM imports i LEFT JOIN users u ON u.id = i.created_by`;

export interface ImportRepository {
  /** The newest 100 imports, newest first. */
  recent(): Promise<ImportRecord[]>;
  findById(id: string): Promise<ImportRecord | null>;
  /** Records a new, running import with the hash of its file; returns its id and start time. */
  create(job: {
    kind: ImportKind;
    filename: string;
    bytesTotal: number;
    createdBy: string;
    sha256: string;
  }): Promise<{ id: string; createdAt: Date }>;
  /** Records where the import's original file is kept (set once: a kept path is never replaced). */
  setOriginalPath(id: string, originalPath: string): Promise<void>;
  /** Ends a running import as failed before its job started, with the reason as its only listed line. */
  fail(id: string, message: string): Promise<void>;
  /**
   * The meter runs an import stored anything for (readings, offered conflicting readings, field
   * totals), by tag. One pass over the readings (they carry the import's id since migration 0008).
   */
  touchedMeterRuns(id: string): Promise<TouchedMeterRun[]>;
}

/** A meter run an import touched. */
export interface TouchedMeterRun {
  id: string;
  tag: string;
}

export function importRepository(pool: Pool): ImportRepository {
  return {
    async recent() {
      const { rows } = await pool.query<ImportRow>(`${selectImports} ORDER BY i.id DESC LIMIT 100`);
      return rows.map(importRecord);
    },

    async findById(id) {
      const { rows } = await pool.query<ImportRow>(`${selectImports} WHERE i.id = $1`, [id]);
      return rows[0] ? importRecord(rows[0]) : null;
    },

    async create(job) {
      const { rows } = await pool.query<{ id: string; created_at: Date }>(
        `INSERT INTO imports (kind, filename, bytes_total, created_by, sha256) VALUES ($1, $2, $3, $4, $5)
         RETURNING id::text, created_at`,
        [job.kind, job.filename, job.bytesTotal, job.createdBy, job.sha256],
      );
      return { id: rows[0].id, createdAt: rows[0].created_at };
    },

    async setOriginalPath(id, originalPath) {
      const { rowCount } = await pool.query(
        'UPDATE imports SET original_path = $2 WHERE id = $1 AND original_path IS NULL',
        [id, originalPath],
      );
      if (rowCount !== 1) throw new Error(`import ${id}: its original path is already recorded`);
    },

    async touchedMeterRuns(id) {
      const { rows } = await pool.query<TouchedMeterRun>(
        `WITH touched AS (
           SELECT t.meter_run_id FROM transmitters t
            WHERE t.id IN (SELECT DISTINCT r.transmitter_id FROM readings r WHERE r.import_id = $1)
           UNION
           SELECT t.meter_run_id FROM reading_conflicts c JOIN transmitters t ON t.id = c.transmitter_id
            WHERE c.offered_import_id = $1
           UNION
           SELECT f.meter_run_id FROM field_total_versions f WHERE f.import_id = $1)
         SELECT m.id::text AS id, m.tag FROM meter_runs m WHERE m.id IN (SELECT meter_run_id FROM touched)
          ORDER BY m.tag`,
        [id],
      );
      return rows;
    },

    async fail(id, message) {
      await pool.query(
        `UPDATE imports SET status = 'failed', finished_at = now(), errors = jsonb_build_array(jsonb_build_object('line', 0, 'message', $2::text))
         WHERE id = $1 AND status = 'running'`,
        [id, message],
      );
    },
  };
}
