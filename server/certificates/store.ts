import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Request, Response } from 'express';
import multer from 'multer';
import { AppError, badRequest } from '../errors';

/**
 * Certificates of meter care records (calibrations, analyses, inspections): PDF, PNG or JPEG,
 * their type judged by their first bytes (never by name or by the browser's claim), kept
 * read-only under `<data dir>/certificates/<yyyy>/<mm>/<sha256>.<ext>`. The name is the hash of
 * the bytes, so the same file uploaded twice is one stored file and a stored file never changes.
 * Records keep the returned relative path and SHA-256; downloads go through `certificateStream`.
 */

/** The certificate types accepted, as the Content-Type they are served with. */
export type CertificateType = 'application/pdf' | 'image/png' | 'image/jpeg';

/** The default size limit of one certificate, in bytes (10 MB). */
export const certificateMaxBytes = 10 * 1000 * 1000;

const extensions: Record<CertificateType, string> = {
  'application/pdf': 'pdf',
  'image/png': 'png',
  'image/jpeg': 'jpg',
};

/** A kept certificate, as a record stores it. */
export interface StoredCertificate {
  /** Relative to the data folder (`certificates/2026/12/<sha256>.pdf`), so the folder can move. */
  path: string;
  sha256: string;
  contentType: CertificateType;
  sizeBytes: number;
  /** The file name the uploader's computer gave it, for the download's name only. */
  originalName: string;
}

/**
 * The type of a certificate from its first bytes: `%PDF-`, the PNG signature, or a JPEG's SOI
 * marker followed by a marker byte (FF D8 FF). Anything else is null.
 * @param head at least the first 8 bytes of the file (fewer bytes can only match fewer types)
 */
export function sniffCertificateType(head: Uint8Array): CertificateType | null {
  const starts = (bytes: number[]) => head.length >= bytes.length && bytes.every((b, i) => head[i] === b);
  if (starts([0x25, 0x50, 0x44, 0x46, 0x2d])) return 'application/pdf';
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  if (starts([0xff, 0xd8, 0xff])) return 'image/jpeg';
  return null;
}

/** `<data dir>/certificates`, beside the uploads folder of the services (services.uploadDir). */
export function certificatesDirBeside(uploadDir: string): string {
  return path.join(path.dirname(path.resolve(uploadDir)), 'certificates');
}

async function readHead(file: string, bytes: number): Promise<Uint8Array> {
  const handle = await fs.promises.open(file, 'r');
  try {
    const buffer = Buffer.alloc(bytes);
    const { bytesRead } = await handle.read(buffer, 0, bytes, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

async function sha256Of(file: string): Promise<string> {
  const hash = crypto.createHash('sha256');
  await pipeline(fs.createReadStream(file), hash);
  return hash.digest('hex');
}

/** The absolute path of a stored relative path, refusing one that would leave the certificates folder. */
function resolveInside(certificatesDir: string, relativePath: string): string {
  const root = path.resolve(certificatesDir);
  const resolved = path.resolve(path.dirname(root), relativePath);
  if (!resolved.startsWith(root + path.sep)) throw new Error(`not a stored certificate: ${relativePath}`);
  return resolved;
}

/**
 * The type of an uploaded file by its content, or a 400 naming `field` when it is not a PDF, PNG
 * or JPEG. Writes nothing: a use case that makes other records first (a configuration version)
 * checks the file before them and keeps it (storeCertificate) only after them.
 */
export async function checkCertificateUpload(
  uploaded: { file: string },
  field = 'certificate',
): Promise<CertificateType> {
  const contentType = sniffCertificateType(await readHead(uploaded.file, 8));
  if (!contentType) throw badRequest(`${field}: must be a PDF, PNG or JPEG file (judged by its content)`, field);
  return contentType;
}

/** An upload a use case may check early and keep late (see checkCertificateUpload). */
export interface CertificateUpload {
  check(): Promise<CertificateType>;
  keep(): Promise<StoredCertificate>;
}

/** The CertificateUpload of a received file, kept under `certificatesDir`; null when none was sent. */
export function certificateUpload(
  certificatesDir: string,
  uploaded: { file: string; originalName: string } | null,
  field = 'certificate',
): CertificateUpload | null {
  if (!uploaded) return null;
  return {
    check: () => checkCertificateUpload(uploaded, field),
    keep: () => storeCertificate(certificatesDir, uploaded, { field }),
  };
}

/**
 * Checks an uploaded file by content and moves it into the store, read-only. A file of another
 * type is deleted and refused with a 400 naming `field`: nothing of it is kept.
 * @param certificatesDir `<data dir>/certificates` (see certificatesDirBeside)
 * @param uploaded the temporary file multer wrote, and the name the browser sent
 * @param options `at` sets the month folder (UTC, default now); `field` names the form field in errors
 */
export async function storeCertificate(
  certificatesDir: string,
  uploaded: { file: string; originalName: string },
  options: { at?: Date; field?: string } = {},
): Promise<StoredCertificate> {
  const field = options.field ?? 'certificate';
  try {
    const stat = await fs.promises.stat(uploaded.file);
    const contentType = await checkCertificateUpload(uploaded, field);
    const sha256 = await sha256Of(uploaded.file);
    const at = options.at ?? new Date();
    const folder = path.basename(path.resolve(certificatesDir));
    const relativePath = path.posix.join(
      folder,
      String(at.getUTCFullYear()),
      String(at.getUTCMonth() + 1).padStart(2, '0'),
      `${sha256}.${extensions[contentType]}`,
    );
    const target = resolveInside(certificatesDir, relativePath);
    await fs.promises.mkdir(path.dirname(target), { recursive: true });
    // Never over an existing file: the name is the hash, so one already there holds these very bytes.
    await fs.promises
      .copyFile(uploaded.file, target, fs.constants.COPYFILE_EXCL)
      .catch((err: NodeJS.ErrnoException) => {
        if (err.code !== 'EEXIST') throw err;
      });
    await fs.promises.chmod(target, 0o444);
    return { path: relativePath, sha256, contentType, sizeBytes: stat.size, originalName: uploaded.originalName };
  } finally {
    await fs.promises.rm(uploaded.file, { force: true });
  }
}

/**
 * A read stream of a stored certificate, or null when the file is not there.
 * @param relativePath the `path` of a StoredCertificate
 */
export async function certificateStream(
  certificatesDir: string,
  relativePath: string,
): Promise<{ stream: fs.ReadStream; sizeBytes: number } | null> {
  const file = resolveInside(certificatesDir, relativePath);
  const stat = await fs.promises.stat(file).catch(() => null);
  if (!stat?.isFile()) return null;
  return { stream: fs.createReadStream(file), sizeBytes: stat.size };
}

/**
 * A multipart receiver for routes that take a certificate: streams the one file of form field
 * `field` to `uploadDir` with a size limit. Over the limit is a 413 naming the field; other
 * refusals of the form are 400s. Resolves with the temporary file, or null when none was sent.
 * A request that is not multipart passes through untouched (its JSON body stays as parsed).
 */
export function certificateReceiver(options: { uploadDir: string; maxBytes?: number; field?: string }) {
  const field = options.field ?? 'certificate';
  const maxBytes = options.maxBytes ?? certificateMaxBytes;
  fs.mkdirSync(options.uploadDir, { recursive: true });
  const upload = multer({
    dest: options.uploadDir,
    limits: { fileSize: maxBytes, files: 1 },
    defParamCharset: 'utf8',
  }).single(field);
  return (req: Request, res: Response) =>
    new Promise<{ file: string; originalName: string } | null>((resolve, reject) =>
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          if (err.code === 'LIMIT_FILE_SIZE')
            reject(new AppError(413, 'too_large', `${field}: larger than ${Math.round(maxBytes / 1e6)} MB`, field));
          else reject(badRequest(`${field}: ${err.message}`, field));
        } else if (err) reject(err);
        else resolve(req.file ? { file: req.file.path, originalName: req.file.originalname } : null);
      }),
    );
}

/** Sends a stored certificate as a download; the caller has already checked who may see it. */
export async function sendCertificate(
  res: Response,
  certificatesDir: string,
  stored: { path: string; sha256: string; contentType: string; originalName: string },
): Promise<boolean> {
  const found = await certificateStream(certificatesDir, stored.path);
  if (!found) return false;
  const ascii = stored.originalName.replace(/[^\x20-\x7e]|["\\]/g, '_') || 'certificate';
  res.setHeader('Content-Type', stored.contentType);
  res.setHeader('Content-Length', String(found.sizeBytes));
  res.setHeader(
    'Content-Disposition',
    `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(stored.originalName)}`,
  );
  res.setHeader('X-Content-SHA256', stored.sha256);
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', 'private, no-store');
  await pipeline(found.stream, res);
  return true;
}
