import type { Sequelize } from 'sequelize';
import type { SignedInUser } from '../../auth/passport';
import { recordAuditEvent } from '../../audit';
import { badRequest, conflict, notFound } from '../../errors';
import type { StoredCertificate } from '../../certificates/store';
import { firstPointOutsideRange, judgePoints } from './points';
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
  const transmitter = await repository.transmitter(transmitterId);
  if (!transmitter) throw notFound('Transmitter');
  for (const side of ['asFound', 'asLeft'] as const) {
    const outside = firstPointOutsideRange(input[side], transmitter);
    if (outside >= 0)
      throw badRequest(
        `${side}.${outside}.appliedValue: ${input[side][outside].appliedValue} ${transmitter.unit} is outside the range ` +
          `${transmitter.lowerRange}–${transmitter.upperRange} ${transmitter.unit} of ${transmitter.tag}`,
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
