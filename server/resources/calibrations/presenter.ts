import type { CalibrationRecord } from './repository';
import type { CorrectionProposal } from './use-cases';

/** A calibration as JSON: ids as strings, dates YYYY-MM-DD, the certificate as a link (never its stored path). */
export function presentCalibration(c: CalibrationRecord) {
  return {
    id: c.id,
    transmitterId: c.transmitterId,
    meterRunId: c.meterRunId,
    calibratedOn: c.calibratedOn,
    laboratory: c.laboratory,
    accreditation: { standard: c.accreditationStandard, number: c.accreditationNumber },
    unit: c.unit,
    lowerRange: c.lowerRange,
    upperRange: c.upperRange,
    asFound: c.asFound,
    asLeft: c.asLeft,
    asFoundPass: c.asFoundPass,
    asLeftPass: c.asLeftPass,
    performedBy: c.performedBy,
    nextDue: c.nextDue,
    notes: c.notes,
    certificate: c.certificate
      ? {
          url: `/api/calibrations/${c.id}/certificate`,
          fileName: c.certificate.fileName,
          contentType: c.certificate.contentType,
          sizeBytes: c.certificate.sizeBytes,
          sha256: c.certificate.sha256,
        }
      : null,
    correctsId: c.correctsId,
    correctedById: c.correctedById,
    /** In force: not corrected by a later record. */
    current: c.correctedById === null,
    createdBy: c.createdBy,
    createdAt: new Date(c.createdAtMs).toISOString(),
  };
}

/** A correction proposal as JSON: instants ISO, the period's bounds as the corrections form takes them. */
export function presentCorrectionProposal(p: CorrectionProposal) {
  return {
    calibrationId: p.calibrationId,
    transmitterId: p.transmitterId,
    transmitterTag: p.transmitterTag,
    meterRunId: p.meterRunId,
    timeZone: p.timeZone,
    since: p.since,
    start: new Date(p.startMs).toISOString(),
    end: new Date(p.endMs).toISOString(),
    shortened: p.shortened,
    kind: p.kind,
    factor: p.factor,
    meanErrorFractionOfReading: p.meanErrorFractionOfReading,
    points: p.points,
    basis: p.basis,
    reason: p.reason,
  };
}
