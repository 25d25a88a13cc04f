import type { CalibrationRecord } from './repository';

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
