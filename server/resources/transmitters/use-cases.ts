import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { datedChangeTime } from '../meter-runs/use-cases';
import { hourStartOf } from '../../../shared/history/contract-day';
import { refuseDatedChangeInClosedMonth } from '../../history/closed-periods';
import type { TransmitterRecord, TransmitterRepository } from './repository';
import { transmitterBody, type TransmitterChanges, type TransmitterInput } from './schema';
import { presentTransmitter } from './presenter';

export interface TransmitterHooks {
  /** A transmitter was added or changed: ingest's catalog and the live board must re-read the set-up. */
  changed(): void;
  /**
   * A dated range or accuracy took effect at `from`: the meter run's hours from the one containing
   * it on must be recomputed; `reference` names the version (`transmitter-range:<id>`).
   */
  rangeChanged(meterRunId: string, from: Date, reference: string): Promise<void>;
}

export interface TransmitterDeps {
  sequelize: Sequelize;
  repository: TransmitterRepository;
  hooks: TransmitterHooks;
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
  { sequelize, repository, hooks }: TransmitterDeps,
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
      // Its first range is in force over the meter run's whole history.
      await repository.addRangeVersion(
        transmitter.id,
        {
          lowerRange: transmitter.lowerRange,
          upperRange: transmitter.upperRange,
          accuracyPercentOfSpan: transmitter.accuracyPercentOfSpan,
          accuracyKind: transmitter.accuracyKind,
          effectiveFrom: await repository.rangeHistoryStart(transmitter.meterRunId, transaction),
          reason: 'first range',
          createdBy: actor.id,
        },
        transaction,
      );
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
    hooks.changed();
    return created;
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw conflict(`A transmitter tagged ${input.tag} already exists.`, 'tag', 'duplicate');
    throw err;
  }
}

/**
 * Re-ranges a transmitter or changes its accuracy or calibration date, with its audit event (old
 * and new values, and the reason). The range and accuracy are dated: a change appends a version
 * in force from `effectiveFrom` (default now, under the rule of configuration versions) and
 * recomputes the meter run's hours from the one containing it on, and no earlier hour.
 * @throws not found when the transmitter does not exist; bad request naming the field when the
 *   changed transmitter would be invalid as a whole, or effectiveFrom outside the history
 */
export async function updateTransmitter(
  { sequelize, repository, hooks }: TransmitterDeps,
  request: { transmitterId: string; changes: TransmitterChanges; actor: SignedInUser; nowMs?: number },
): Promise<TransmitterRecord> {
  const { changes, actor } = request;
  const current = await repository.findById(request.transmitterId);
  if (!current) throw notFound('Transmitter');
  const effectiveFrom = datedChangeTime(
    changes.effectiveFrom,
    rangeOf(current, changes) !== null,
    await repository.meterRunHistoryStart(current.meterRunId),
    request.nowMs ?? Date.now(),
  );
  if (rangeOf(current, changes) !== null)
    await refuseDatedChangeInClosedMonth(sequelize, { meterRunId: current.meterRunId }, effectiveFrom);
  const { updated, versionId } = await sequelize.transaction(async (transaction) => {
    const before = await repository.lockForUpdate(request.transmitterId, transaction);
    if (!before) throw notFound('Transmitter');
    const { effectiveFrom: _when, reason: _why, ...fields } = changes;
    // Re-validate the whole transmitter so a re-range cannot leave upper below lower, or a unit of the wrong kind.
    validate(transmitterBody, {
      ...presentTransmitter(before),
      ...fields,
      calibrationDue: changes.calibrationDue ?? before.calibrationDue ?? undefined,
    });
    let after = await repository.update(before.id, { calibrationDue: changes.calibrationDue }, transaction);
    const range = rangeOf(before, changes);
    let id: string | null = null;
    if (range) {
      await repository.ensureRangeBaseline(before.id, transaction);
      id = await repository.addRangeVersion(
        before.id,
        { ...range, effectiveFrom, reason: changes.reason ?? '', createdBy: actor.id },
        transaction,
      );
      after = (await repository.lockForUpdate(before.id, transaction)) ?? after;
    }
    await recordAuditEvent(
      {
        actor,
        action: 'transmitter.update',
        entityType: 'transmitter',
        entityId: after.id,
        before: presentTransmitter(before),
        after: range
          ? { ...presentTransmitter(after), rangeEffectiveFrom: effectiveFrom.toISOString() }
          : presentTransmitter(after),
        reason: changes.reason ?? null,
      },
      transaction,
    );
    return { updated: after, versionId: id };
  });
  hooks.changed();
  if (versionId !== null) {
    // From the hour that contains the effective time: it is split there into two records.
    const timeZone = await repository.meterRunTimeZone(updated.meterRunId);
    const fromMs = timeZone ? hourStartOf(effectiveFrom.getTime(), timeZone) : effectiveFrom.getTime();
    await hooks.rangeChanged(updated.meterRunId, new Date(fromMs), `transmitter-range:${versionId}`);
  }
  return updated;
}

/** The range and accuracy a change asks for, or null when they stay as they are. */
function rangeOf(before: TransmitterRecord, changes: TransmitterChanges) {
  const range = {
    lowerRange: changes.lowerRange ?? before.lowerRange,
    upperRange: changes.upperRange ?? before.upperRange,
    accuracyPercentOfSpan: changes.accuracyPercentOfSpan ?? before.accuracyPercentOfSpan,
    accuracyKind: changes.accuracyKind ?? before.accuracyKind,
  };
  const same =
    range.lowerRange === before.lowerRange &&
    range.upperRange === before.upperRange &&
    range.accuracyPercentOfSpan === before.accuracyPercentOfSpan &&
    range.accuracyKind === before.accuracyKind;
  return same ? null : range;
}
