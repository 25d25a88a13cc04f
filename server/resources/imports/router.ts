import fs from 'node:fs';
import path from 'node:path';
import { Router } from 'express';
import multer from 'multer';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { AppError, badRequest, notFound } from '../../errors';

export interface ImportJobs {
  readings(importId: string, file: string): Promise<void>;
  fieldTotals(importId: string, file: string): Promise<void>;
}

const present = (r: Record<string, unknown>) => ({
  id: String(r.id),
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
  createdAt: (r.created_at as Date).toISOString(),
  finishedAt: r.finished_at ? (r.finished_at as Date).toISOString() : null,
});

/**
 * CSV uploads of readings and field totals. The file is streamed to disk (size-limited), the
 * answer `{ id, status }` comes at once, and the import runs on; `GET /api/imports/:id` reports
 * its progress and every rejected line.
 */
export function importsRouter(options: { pool: Pool; uploadDir: string; maxBytes: number; jobs: ImportJobs }) {
  fs.mkdirSync(options.uploadDir, { recursive: true });
  const upload = multer({ dest: options.uploadDir, limits: { fileSize: options.maxBytes, files: 1 } }).single('file');
  const router = Router();

  router.get('/', requireCapability('importData'), async (_req, res) => {
    const { rows } = await options.pool.query('SELECT * FROM imports ORDER BY id DESC LIMIT 100');
    res.json(rows.map(present));
  });

  router.get('/:id', requireCapability('importData'), async (req, res) => {
    if (!/^\d+$/.test(String(req.params.id))) throw notFound('Import');
    const { rows } = await options.pool.query('SELECT * FROM imports WHERE id = $1', [String(req.params.id)]);
    if (!rows[0]) throw notFound('Import');
    res.json(present(rows[0]));
  });

  router.post('/', requireCapability('importData'), (req, res, next) => {
    upload(req, res, async (err: unknown) => {
      try {
        if (err instanceof multer.MulterError) {
          if (err.code === 'LIMIT_FILE_SIZE')
            throw new AppError(413, 'too_large', `file: larger than ${Math.round(options.maxBytes / 1e6)} MB`, 'file');
          throw badRequest(`file: ${err.message}`, 'file');
        }
        if (err) throw err;
        if (!req.file) throw badRequest('file: attach a CSV file in the form field "file"', 'file');
        const kind = (req.body?.kind ?? 'readings') as string;
        if (kind !== 'readings' && kind !== 'field-totals') {
          fs.rm(req.file.path, { force: true }, () => undefined);
          throw badRequest('kind: must be readings or field-totals', 'kind');
        }
        const { rows } = await options.pool.query(
          `INSERT INTO imports (kind, filename, bytes_total, created_by) VALUES ($1, $2, $3, $4) RETURNING id::text`,
          [kind, path.basename(req.file.originalname || 'upload.csv'), req.file.size, req.user!.id],
        );
        const id = rows[0].id as string;
        const job =
          kind === 'readings' ? options.jobs.readings(id, req.file.path) : options.jobs.fieldTotals(id, req.file.path);
        job.catch((e) => console.error(`[imports] import ${id} failed:`, e));
        res.status(202).json({ id, status: 'running' });
      } catch (e) {
        next(e);
      }
    });
  });

  return router;
}
