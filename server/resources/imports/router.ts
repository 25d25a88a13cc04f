import fs from 'node:fs';
import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { AppError, badRequest } from '../../errors';
import { parseId } from '../../http/params';
import { importKindOf } from './schema';
import { importRepository } from './repository';
import { originalsStore } from './originals';
import { getImportDetail, listImports, originalOfImport, startImport, type ImportJobs } from './use-cases';
import { attachmentDisposition, presentImport, presentImportDetail } from './presenter';

/**
 * CSV uploads of readings and field totals. The file is streamed to disk (size-limited), hashed
 * and kept read-only under `originalsDir`; the answer `{ id, status }` comes at once and the
 * import runs on; `GET /api/imports/:id` reports its progress and every rejected line, and
 * `GET /api/imports/:id/original` gives back the exact bytes uploaded.
 */
export function importsRouter(options: {
  pool: Pool;
  uploadDir: string;
  originalsDir: string;
  maxBytes: number;
  jobs: ImportJobs;
}) {
  fs.mkdirSync(options.uploadDir, { recursive: true });
  // Browsers send the file's name as UTF-8 bytes; read as Latin-1 (multer's default) "Mérida.csv" became "MÃ©rida.csv".
  const upload = multer({
    dest: options.uploadDir,
    limits: { fileSize: options.maxBytes, files: 1 },
    defParamCharset: 'utf8',
  }).single('file');
  const repository = importRepository(options.pool);
  const originals = originalsStore(options.originalsDir);
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
    const detail = await getImportDetail(repository, parseId(req.params.id, 'Import'));
    res.json(presentImportDetail(detail.import, detail.meterRuns));
  });

  router.get('/:id/original', requireCapability('importData'), async (req, res) => {
    const original = await originalOfImport({ repository, originals }, parseId(req.params.id, 'Import'), req.user!);
    // The bytes as uploaded: no charset is claimed, and the hash lets the receiver check them.
    res.setHeader('Content-Disposition', attachmentDisposition(original.filename));
    res.setHeader('Content-Type', 'text/csv');
    res.setHeader('X-Content-SHA256', original.sha256);
    res.setHeader('Cache-Control', 'private, no-store');
    // The path is the store's own (never from the request); the data folder may lie under a dot folder.
    res.sendFile(original.file, { cacheControl: false, lastModified: false, dotfiles: 'allow' });
  });

  router.post('/', requireCapability('importData'), async (req, res) => {
    await receive(req, res);
    if (!req.file) throw badRequest('file: attach a CSV file in the form field "file"', 'file');
    const kind = importKindOf(req.body);
    if (!kind) {
      // A refused upload is not an import: nothing of it is kept.
      fs.rm(req.file.path, { force: true }, () => undefined);
      throw badRequest('kind: must be readings or field-totals', 'kind');
    }
    const upload = { file: req.file.path, originalName: req.file.originalname, sizeBytes: req.file.size };
    res
      .status(202)
      .json(await startImport({ repository, jobs: options.jobs, originals }, { kind, upload, actor: req.user! }));
  });

  return router;
}
