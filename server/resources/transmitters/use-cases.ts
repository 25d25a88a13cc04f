import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, notFound } from '../../errors';
import { validate } from '../../http/validate';
import type { TransmitterRecord, TransmitterRepository } from './repository';
import { transmitterBody, type TransmitterChanges, type TransmitterInput } from './schema';
import { presentTransmitter } from './presenter';

export interface TransmitterDeps {
  sequelize: Sequelize;
  repository: TransmitterRepository;
  /** A transmitter was added or changed: ingest's catalog and the live board must re-read the set-up. */
  changed(): void;
}

export const listTransmitters = (repository: TransmitterRepository, filter: { meterRunId?: string }) =>
  repository.list(filter.meterRunId);

/** @throws not found when the transmitter does not exist */
export async function getTransmitter(repository: TransmitterRepository, transmitterId: string) {
  const transmitter = await repository.findById(transmitterId);
  if (!transmitter) throw notFound('Transmitter');
  return transmitter;
}

/**
 * Adds a transmitter to a meter run, with its audit event. A meter run has one DP transmitter,
 * or a stacked pair (one low, one high); one static pressure and one temperature.
 * @throws bad request naming meterRunId when the meter run does not exist; conflict naming
 *   stackRole or measures when the meter run already has that transmitter, tag when the tag is in use
 */
export async function createTransmitter(
  { sequelize, repository, changed }: TransmitterDeps,
  input: TransmitterInput,
  actor: SignedInUser,
): Promise<TransmitterRecord> {
  const meterRunTag = await repository.meterRunTag(input.meterRunId);
  if (meterRunTag === null)
    throw badRequest(`meterRunId: no meter run ${input.meterRunId}`, 'meterRunId', 'invalid_field');
  const siblings = await repository.siblings(input.meterRunId, input.measures);
  if (input.measures === 'differential-pressure') {
    const clash = siblings.find(
      (s) => s.stackRole === input.stackRole || s.stackRole === 'single' || input.stackRole === 'single',
    );
    if (clash)
      throw conflict(
        `Meter run ${meterRunTag} already has DP transmitter ${clash.tag} (${clash.stackRole}); it takes one single DP transmitter or one low- and one high-range pair.`,
        'stackRole',
      );
  } else if (siblings.length) {
    throw conflict(
      `Meter run ${meterRunTag} already has a ${input.measures} transmitter (${siblings[0].tag}).`,
      'measures',
    );
  }
  try {
    const created = await sequelize.transaction(async (transaction) => {
      const transmitter = await repository.create(input, transaction);
      await recordAuditEvent(
        {
          actor,
          action: 'transmitter.create',
          entityType: 'transmitter',
          entityId: transmitter.id,
          after: presentTransmitter(transmitter),
        },
        transaction,
      );
      return transmitter;
    });
    changed();
    return created;
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw conflict(`A transmitter tagged ${input.tag} already exists.`, 'tag', 'duplicate');
    throw err;
  }
}

/**
 * Re-ranges a transmitter or changes its accuracy or calibration date, with its audit event.
 * @throws not found when the transmitter does not exist; bad request naming the field when the
 *   changed transmitter would be invalid as a whole
 */
export async function updateTransmitter(
  { sequelize, repository, changed }: TransmitterDeps,
  request: { transmitterId: string; changes: TransmitterChanges; actor: SignedInUser },
): Promise<TransmitterRecord> {
  const { changes, actor } = request;
  const updated = await sequelize.transaction(async (transaction) => {
    const before = await repository.lockForUpdate(request.transmitterId, transaction);
    if (!before) throw notFound('Transmitter');
    // Re-validate the whole transmitter so a re-range cannot leave upper below lower, or a unit of the wrong kind.
    validate(transmitterBody, {
      ...presentTransmitter(before),
      ...changes,
      calibrationDue: changes.calibrationDue ?? before.calibrationDue ?? undefined,
    });
    const after = await repository.update(before.id, changes, transaction);
    await recordAuditEvent(
      {
        actor,
        action: 'transmitter.update',
        entityType: 'transmitter',
        entityId: after.id,
        before: presentTransmitter(before),
        after: presentTransmitter(after),
      },
      transaction,
    );
    return after;
  });
  changed();
  return updated;
}
