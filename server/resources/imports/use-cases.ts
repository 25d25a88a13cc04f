import path from 'node:path';
import { notFound } from '../../errors';
import { componentLogger } from '../../log';
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
 * Records an import of an uploaded file and starts its job without waiting for it: the caller
 * answers at once and the client follows the progress. A job that fails records that itself;
 * what escapes it is logged.
 * @param upload the file on disk, the name the client gave it and its size in bytes
 */
export async function startImport(
  deps: { repository: ImportRepository; jobs: ImportJobs },
  request: {
    kind: ImportKind;
    upload: { file: string; originalName: string; sizeBytes: number };
    actor: { id: string };
  },
) {
  const { kind, upload, actor } = request;
  const importId = await deps.repository.create({
    kind,
    // Only the base name: it is shown on screen, and a client may send a whole path.
    filename: path.basename(upload.originalName || 'upload.csv'),
    bytesTotal: upload.sizeBytes,
    createdBy: actor.id,
  });
  const job =
    kind === 'readings' ? deps.jobs.readings(importId, upload.file) : deps.jobs.fieldTotals(importId, upload.file);
  job.catch((err: unknown) => log.error({ err, importId }, 'import failed'));
  return { id: importId, status: 'running' as const };
}
