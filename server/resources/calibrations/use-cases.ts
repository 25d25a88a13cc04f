import { DateTime } from 'luxon';
import type { Sequelize } from 'sequelize';
import type { SignedInUser } from '../../auth/passport';
import { recordAuditEvent } from '../../audit';
import { badRequest, conflict, notFound } from '../../errors';
import type { StoredCertificate } from '../../certificates/store';
import { firstPointOutsideRange, judgePoints } from './points';
import { suggestedFactor, type FactorPoint } from './proposal';
import type { CalibrationRecord, CalibrationRepository } from './repository';
import type { CalibrationInput } from './schema';
import { presentCalibration } from './presenter';

/** A transmitter's calibrations, newest first; 404 when the transmitter does not exist. */
export async function listCalibrations(repository: CalibrationRepository, transmitterId: string) {
  if (!(await repository.transmitter(transmitterId))) throw notFound('Transmitter');
  return repository.list(transmitterId);
}

/** A calibration's certificate as stored; 404 when the calibration or its certificate is not there. */
export async function certificateOfCalibration(repository: CalibrationRepository, calibrationId: string) {
  const calibration = await repository.findById(calibrationId);
  if (!calibration?.certificate) throw notFound(calibration ? 'Certificate' : 'Calibration');
  return calibration.certificate;
}

/**
 * Records a calibration of a transmitter. The points are judged against the transmitter's range
 * (errors in % of span computed here); a point outside the range, a due date before the
 * calibration date or a correction of another transmitter's record is refused naming its field,
 * and only then is the certificate kept (`keepCertificate`, after every check: a refused request
 * stores nothing). Audited in the same transaction as the insert.
 * @param keepCertificate stores the uploaded certificate; null when none was sent
 */
export async function recordCalibration(
  deps: { sequelize: Sequelize; repository: CalibrationRepository },
  request: {
    transmitterId: string;
    input: CalibrationInput;
    keepCertificate: (() => Promise<StoredCertificate>) | null;
    actor: SignedInUser;
  },
): Promise<CalibrationRecord> {
  const { sequelize, repository } = deps;
  const { transmitterId, input, actor } = request;
  const current = await repository.transmitter(transmitterId);
  if (!current) throw notFound('Transmitter');
  // The points are judged against the range in force at the END of the calibration day on the
  // site's clock: a re-range made at the calibration visit is dated that day, and the certificate
  // states the range the transmitter was calibrated to and left in service with. A transmitter
  // with no dated range yet has only its current one.
  const transmitter = { ...current, ...(await repository.rangeAtEndOfDay(transmitterId, input.calibratedOn)) };
  for (const side of ['asFound', 'asLeft'] as const) {
    const outside = firstPointOutsideRange(input[side], transmitter);
    if (outside >= 0)
      throw badRequest(
        `${side}.${outside}.appliedValue: ${input[side][outside].appliedValue} ${transmitter.unit} is outside the range ` +
          `${transmitter.lowerRange}–${transmitter.upperRange} ${transmitter.unit} in force on ${input.calibratedOn} ` +
          `for ${transmitter.tag}`,
        `${side}.${outside}.appliedValue`,
        'invalid_field',
      );
  }
  if (input.nextDue < input.calibratedOn)
    throw badRequest(
      `nextDue: ${input.nextDue} is before the calibration date ${input.calibratedOn}`,
      'nextDue',
      'invalid_field',
    );
  const tolerance = input.tolerancePercentOfSpan ?? transmitter.accuracyPercentOfSpan;
  const asFound = judgePoints(input.asFound, transmitter, tolerance);
  const asLeft = judgePoints(input.asLeft, transmitter, tolerance);

  return sequelize.transaction(async (transaction) => {
    await repository.lockTransmitter(transmitterId, transaction);
    if (input.correctsId) {
      const corrected = await repository.findById(input.correctsId, transaction);
      if (!corrected || corrected.transmitterId !== transmitterId)
        throw badRequest(
          `correctsId: no calibration ${input.correctsId} of this transmitter`,
          'correctsId',
          'invalid_field',
        );
      if (corrected.correctedById)
        throw conflict(
          `Calibration ${corrected.id} was already corrected by ${corrected.correctedById}; correct that one instead.`,
          'correctsId',
        );
    }
    const certificate = request.keepCertificate ? await request.keepCertificate() : null;
    const calibration = await repository.insert(
      {
        transmitterId,
        calibratedOn: input.calibratedOn,
        laboratory: input.laboratory,
        accreditationStandard: input.accreditation?.standard ?? null,
        accreditationNumber: input.accreditation?.number ?? null,
        unit: transmitter.unit,
        lowerRange: transmitter.lowerRange,
        upperRange: transmitter.upperRange,
        asFound,
        asLeft,
        asFoundPass: asFound.every((p) => p.pass),
        asLeftPass: asLeft.every((p) => p.pass),
        performedBy: input.performedBy,
        nextDue: input.nextDue,
        notes: input.notes ?? null,
        certificate: certificate
          ? {
              path: certificate.path,
              sha256: certificate.sha256,
              contentType: certificate.contentType,
              sizeBytes: certificate.sizeBytes,
              fileName: certificate.originalName,
            }
          : null,
        correctsId: input.correctsId ?? null,
        createdBy: actor.id,
      },
      transaction,
    );
    await recordAuditEvent(
      {
        actor,
        action: input.correctsId ? 'calibration.correct' : 'calibration.create',
        entityType: 'calibration',
        entityId: calibration.id,
        before: null,
        after: presentCalibration(calibration),
      },
      transaction,
    );
    return calibration;
  });
}

/** A correction covers at most this many days (server/resources/corrections/schema.ts CORRECTION_MAX_DAYS). */
const CORRECTION_MAX_DAYS = 92;

/** What `GET /api/calibrations/:id/correction-proposal` suggests; nothing is created. */
export interface CorrectionProposal {
  calibrationId: string;
  transmitterId: string;
  transmitterTag: string;
  meterRunId: string;
  timeZone: string;
  /** Where the period starts from: the last good calibration, the first reading or the first configuration. */
  since:
    | { kind: 'calibration'; calibrationId: string; calibratedOn: string }
    | { kind: 'first-reading' | 'first-configuration' };
  startMs: number;
  endMs: number;
  /** True when the period since the last good calibration was longer than a correction may cover. */
  shortened: boolean;
  kind: 'adjust';
  factor: number;
  meanErrorFractionOfReading: number;
  points: FactorPoint[];
  basis: string;
  reason: string;
}

/**
 * The correction a failed as-found calibration suggests, for the four-eyes corrections: an
 * adjustment of the meter run's flow by a factor (proposal.ts suggestedFactor) over the period from
 * the end of the last calibration day whose as-left passed (or, with none, the transmitter's first
 * reading, else the meter run's first configuration) to the start of this calibration's day, both
 * on the site's clock (local midnights are whole hours, as a correction's bounds must be). The
 * hours of the calibration days themselves are left to the engineer, who knows when the work was
 * done. A period longer than a correction may cover keeps its last 92 days and says so.
 * @throws not found; conflict when the as-found passed, or when there is no period to correct
 */
export async function correctionProposal(
  repository: CalibrationRepository,
  calibrationId: string,
): Promise<CorrectionProposal> {
  const calibration = await repository.findById(calibrationId);
  if (!calibration) throw notFound('Calibration');
  if (calibration.asFoundPass)
    throw conflict(`Calibration ${calibration.id} passed as found: there is no correction to propose.`);
  const context = await repository.proposalContext(calibration.transmitterId);
  if (!context) throw notFound('Transmitter');
  const zone = context.timeZone;
  const endMs = DateTime.fromISO(calibration.calibratedOn, { zone }).toMillis();
  const good = await repository.lastGoodBefore(calibration.transmitterId, calibration.calibratedOn);
  let since: CorrectionProposal['since'];
  let fromMs: number;
  if (good) {
    since = { kind: 'calibration', calibrationId: good.id, calibratedOn: good.calibratedOn };
    fromMs = DateTime.fromISO(good.calibratedOn, { zone }).plus({ days: 1 }).toMillis();
  } else {
    const first = context.firstReadingMs ?? context.firstConfigurationMs;
    if (first === null)
      throw conflict(`Transmitter ${context.tag} has no readings and its meter run no configuration.`);
    since = { kind: context.firstReadingMs !== null ? 'first-reading' : 'first-configuration' };
    fromMs = DateTime.fromMillis(first, { zone }).startOf('hour').toMillis();
  }
  const earliestMs = DateTime.fromMillis(endMs, { zone }).minus({ days: CORRECTION_MAX_DAYS }).toMillis();
  const startMs = Math.max(fromMs, earliestMs);
  if (startMs >= endMs)
    throw conflict(
      `No whole day lies between the last good calibration and ${calibration.calibratedOn}: nothing to propose.`,
    );
  const suggestion = suggestedFactor(context.measures, calibration.unit, calibration.asFound, context);
  if (!suggestion)
    throw conflict(`Calibration ${calibration.id} has no as-found point away from zero to derive a factor from.`);
  const sinceText =
    since.kind === 'calibration'
      ? `the last good calibration on ${since.calibratedOn}`
      : since.kind === 'first-reading'
        ? 'the transmitter’s first reading'
        : 'the meter run’s first configuration';
  return {
    calibrationId: calibration.id,
    transmitterId: context.transmitterId,
    transmitterTag: context.tag,
    meterRunId: context.meterRunId,
    timeZone: zone,
    since,
    startMs,
    endMs,
    shortened: startMs > fromMs,
    kind: 'adjust',
    factor: suggestion.factor,
    meanErrorFractionOfReading: suggestion.meanErrorFractionOfReading,
    points: suggestion.points,
    basis: suggestion.basis,
    reason:
      `${context.tag} failed its as-found calibration on ${calibration.calibratedOn} ` +
      `(${calibration.laboratory}); flow adjusted since ${sinceText}` +
      `${startMs > fromMs ? ` (last ${CORRECTION_MAX_DAYS} days; earlier periods proposed separately)` : ''}. ` +
      `Factor ${suggestion.factor.toFixed(6)} from a mean as-found error of ` +
      `${(suggestion.meanErrorFractionOfReading * 100).toFixed(4)} % of reading (an approximation).`,
  };
}
