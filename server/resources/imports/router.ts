import fs from 'node:fs';
import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { AppError, badRequest } from '../../errors';
import { parseId } from '../../http/params';
import { importKindOf } from './schema';
import { importRepository } from './repository';
import { getImport, listImports, startImport, type ImportJobs } from './use-cases';
import { presentImport } from './presenter';

/**
 * CSV uploads of readings and field totals. The file is streamed to disk (size-limited), the
 * answer `{ id, status }` comes at once, and the import runs on; `GET /api/imports/:id` reports
 * its progress and every rejected line.
 */
export function importsRouter(options: { pool: Pool; uploadDir: string; maxBytes: number; jobs: ImportJobs }) {
  fs.mkdirSync(options.uploadDir, { recursive: true });
  const upload = multer({ dest: options.uploadDir, limits: { fileSize: options.maxBytes, files: 1 } }).single('file');
  const repository = importRepository(options.pool);
  const router = Router();

  /** Streams the multipart upload to disk; multer's refusals become errors naming the file field. */
  const receive = (req: Request, res: Response) =>
    new Promise<void>((resolve, reject) =>
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          if (err.code === 'LIMIT_FILE_SIZE')
            reject(
              new AppError(413, 'too_large', `file: larger than ${Math.round(options.maxBytes / 1e6)} MB`, 'file'),
            );
          else reject(badRequest(`file: ${err.message}`, 'file'));
        } else if (err) reject(err);
        else resolve();
      }),
    );

  router.get('/', requireCapability('importData'), async (_req, res) => {
    res.json((await listImports(repository)).map(presentImport));
  });

  router.get('/:id', requireCapability('importData'), async (req, res) => {
    res.json(presentImport(await getImport(repository, parseId(req.params.id, 'Import'))));
  });

  router.post('/', requireCapability('importData'), async (req, res) => {
    await receive(req, res);
    if (!req.file) throw badRequest('file: attach a CSV file in the form field "file"', 'file');
    const kind = importKindOf(req.body);
    if (!kind) {
      fs.rm(req.file.path, { force: true }, () => undefined);
      throw badRequest('kind: must be readings or field-totals', 'kind');
    }
    const upload = { file: req.file.path, originalName: req.file.originalname, sizeBytes: req.file.size };
    res.status(202).json(await startImport({ repository, jobs: options.jobs }, { kind, upload, actor: req.user! }));
  });

  return router;
}
