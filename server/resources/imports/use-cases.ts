import path from 'node:path';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { notFound } from '../../errors';
import { componentLogger } from '../../log';
import { sha256OfFile, type OriginalsStore } from './originals';
import type { ImportRepository } from './repository';
import type { ImportKind } from './schema';

const log = componentLogger('imports');

/** The import jobs (server/ingest/csv-import.ts): each reads the file and records its progress. */
export interface ImportJobs {
  readings(importId: string, file: string): Promise<void>;
  fieldTotals(importId: string, file: string): Promise<void>;
}

export const listImports = (repository: ImportRepository) => repository.recent();

/** @throws not found when the import does not exist */
export async function getImport(repository: ImportRepository, importId: string) {
  const found = await repository.findById(importId);
  if (!found) throw notFound('Import');
  return found;
}

/**
 * An import with the meter runs it touched, so a finished import leads on to them. While it runs
 * the list is not looked for (the client polls the progress) and is empty.
 */
export async function getImportDetail(repository: ImportRepository, importId: string) {
  const found = await getImport(repository, importId);
  const meterRuns = found.status === 'running' ? [] : await repository.touchedMeterRuns(importId);
  return { import: found, meterRuns };
}

/**
 * Records an import of an uploaded file and starts its job without waiting for it: the caller
 * answers at once and the client follows the progress. The file is hashed first and kept, read-
 * only, as part of the record; the job reads the kept file, and the start is audited with the
 * hash, so a figure imported can be traced to the exact bytes, the person and the time. A job
 * that fails records that itself; what escapes it is logged.
 * @param upload the file on disk, the name the client gave it and its size in bytes
 */
export async function startImport(
  deps: { repository: ImportRepository; jobs: ImportJobs; originals: OriginalsStore },
  request: {
    kind: ImportKind;
    upload: { file: string; originalName: string; sizeBytes: number };
    actor: SignedInUser;
  },
) {
  const { kind, upload, actor } = request;
  // Only the base name: it is shown on screen, and a client may send a whole path.
  const filename = path.basename(upload.originalName || 'upload.csv');
  const sha256 = await sha256OfFile(upload.file);
  const { id: importId, createdAt } = await deps.repository.create({
    kind,
    filename,
    bytesTotal: upload.sizeBytes,
    createdBy: actor.id,
    sha256,
  });
  let originalPath: string;
  try {
    originalPath = await deps.originals.keep(upload.file, { importId, sha256, at: createdAt });
    await deps.repository.setOriginalPath(importId, originalPath);
  } catch (err) {
    // Nothing is imported from a file that could not be kept; the import says so instead of running on.
    await deps.repository.fail(importId, 'the uploaded file could not be kept, so nothing was imported');
    throw err;
  }
  await recordAuditEvent({
    actor,
    action: 'import.create',
    entityType: 'import',
    entityId: importId,
    after: { kind, filename, sizeBytes: upload.sizeBytes, sha256 },
  });
  const file = deps.originals.absolute(originalPath);
  const job = kind === 'readings' ? deps.jobs.readings(importId, file) : deps.jobs.fieldTotals(importId, file);
  job.catch((err: unknown) => log.error({ err, importId }, 'import failed'));
  return { id: importId, status: 'running' as const };
}

/**
 * The kept original of an import, for download; the download is audited.
 * @throws not found when the import does not exist or its file was not kept (imports made
 * before originals were kept) or is missing
 */
export async function originalOfImport(
  deps: { repository: ImportRepository; originals: OriginalsStore },
  importId: string,
  actor: SignedInUser,
) {
  const found = await deps.repository.findById(importId);
  if (!found) throw notFound('Import');
  const file = found.originalPath && found.sha256 ? await deps.originals.find(found.originalPath) : null;
  if (!file || !found.sha256) throw notFound('The original file of this import');
  await recordAuditEvent({
    actor,
    action: 'import.download-original',
    entityType: 'import',
    entityId: importId,
    after: { filename: found.filename, sha256: found.sha256 },
  });
  return { file, filename: found.filename, sha256: found.sha256 };
}
