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
  rejected: number;
  errors: { line: number; message: string }[];
  createdAt: Date;
  finishedAt: Date | null;
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
  rejected: string;
  errors: ImportRecord['errors'];
  created_at: Date;
  finished_at: Date | null;
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
  rejected: Number(r.rejected),
  errors: r.errors,
  createdAt: r.created_at,
  finishedAt: r.finished_at,
});

export interface ImportRepository {
  /** The newest 100 imports, newest first. */
  recent(): Promise<ImportRecord[]>;
  findById(id: string): Promise<ImportRecord | null>;
  /** Records a new, running import; returns its id. */
  create(job: { kind: ImportKind; filename: string; bytesTotal: number; createdBy: string }): Promise<string>;
}

export function importRepository(pool: Pool): ImportRepository {
  return {
    async recent() {
      const { rows } = await pool.query<ImportRow>('SELECT * FROM imports ORDER BY id DESC LIMIT 100');
      return rows.map(importRecord);
    },

    async findById(id) {
      const { rows } = await pool.query<ImportRow>('SELECT * FROM imports WHERE id = $1', [id]);
      return rows[0] ? importRecord(rows[0]) : null;
    },

    async create(job) {
      const { rows } = await pool.query<{ id: string }>(
        `INSERT INTO imports (kind, filename, bytes_total, created_by) VALUES ($1, $2, $3, $4) RETURNING id::text`,
        [job.kind, job.filename, job.bytesTotal, job.createdBy],
      );
      return rows[0].id;
    },
  };
}
