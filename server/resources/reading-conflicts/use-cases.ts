import type { Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { conflict, notFound } from '../../errors';
import type { ReadingConflictRepository } from './repository';
import type { ReadingConflictsQuery, ResolveConflictBody } from './schema';

/**
 * The conflicts of re-sent readings, newest reading first.
 * @throws not found when a meter run is named and does not exist
 */
export async function listReadingConflicts(repository: ReadingConflictRepository, query: ReadingConflictsQuery) {
  if (query.meterRunId && !(await repository.meterRunExists(query.meterRunId))) throw notFound('Meter run');
  return repository.list({ meterRunId: query.meterRunId, status: query.status });
}

/**
 * Settles an open conflict: the reading stored stays as it is (a different figure comes in by a
 * correction, which the resolution may name). Resolution and audit event are one transaction,
 * and the conflict's row is locked, so two engineers cannot both resolve it.
 * @throws not found when the conflict does not exist; conflict (409) when it is already resolved
 */
export async function resolveReadingConflict(
  deps: { sequelize: Sequelize; repository: ReadingConflictRepository },
  request: { conflictId: string; body: ResolveConflictBody; actor: SignedInUser },
) {
  const { conflictId, body, actor } = request;
  return deps.sequelize.transaction(async (transaction) => {
    const found = await deps.repository.findForUpdate(conflictId, transaction);
    if (!found) throw notFound('Reading conflict');
    if (found.status === 'resolved')
      throw conflict(
        `This conflict was already resolved by ${found.resolution?.resolvedBy ?? 'someone'}.`,
        undefined,
        'already_resolved',
      );
    const correctionId = body.correctionId ?? null;
    await deps.repository.resolve(
      { conflictId, note: body.resolution, correctionId, resolvedBy: actor.id },
      transaction,
    );
    await recordAuditEvent(
      {
        actor,
        action: 'reading-conflict.resolve',
        entityType: 'reading-conflict',
        entityId: conflictId,
        before: { status: 'open' },
        after: {
          status: 'resolved',
          transmitterId: found.transmitterId,
          time: new Date(found.timeMs).toISOString(),
          storedValue: found.storedValue,
          offeredValue: found.offeredValue,
          correctionId,
        },
        reason: body.resolution,
      },
      transaction,
    );
    const resolved = await deps.repository.findById(conflictId, transaction);
    if (!resolved) throw notFound('Reading conflict');
    return resolved;
  });
}
