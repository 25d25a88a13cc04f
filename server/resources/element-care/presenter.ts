import { presentCreatedConfigVersion } from '../meter-runs/presenter';
import type { CertificateFile, ElementCalibrationRecord, GasAnalysisRecord, InspectionRecord } from './repository';
import type { Recorded } from './use-cases';

/** The certificate file as a link (never its stored path); `collection` is its download route's. */
const presentFile = (collection: string, id: string, f: CertificateFile | null) =>
  f
    ? {
        name: f.fileName,
        contentType: f.contentType,
        sizeBytes: f.sizeBytes,
        sha256: f.sha256,
        url: `/api/${collection}/${id}/certificate`,
      }
    : null;

const author = (r: { createdBy: { email: string; name: string } | null }) =>
  r.createdBy ? { email: r.createdBy.email, name: r.createdBy.name } : null;

export const presentCalibration = (c: ElementCalibrationRecord) => ({
  id: c.id,
  meterRunId: c.meterRunId,
  calibratedAt: c.calibratedAt.toISOString(),
  effectiveFrom: c.effectiveFrom.toISOString(),
  laboratory: c.laboratory,
  certificate: c.certificate,
  certificateFile: presentFile('element-calibrations', c.id, c.certificateFile),
  nextDue: c.nextDue,
  uncertaintyPercent: c.uncertaintyPercent,
  points: c.points.map((p) => ({ reynoldsNumber: p.reynoldsNumber, dischargeCoefficient: p.dischargeCoefficient })),
  direction: c.direction,
  configVersionId: c.configVersionId,
  createdAt: c.createdAt.toISOString(),
  createdBy: author(c),
});

export const presentGasAnalysis = (a: GasAnalysisRecord) => ({
  id: a.id,
  meterRunId: a.meterRunId,
  sampledAt: a.sampledAt.toISOString(),
  laboratory: a.laboratory,
  certificate: a.certificate,
  certificateFile: presentFile('gas-analyses', a.id, a.certificateFile),
  nextDue: a.nextDue,
  components: a.components,
  composition: a.composition,
  sumTolerance: a.sumTolerance,
  configVersionId: a.configVersionId,
  createdAt: a.createdAt.toISOString(),
  createdBy: author(a),
});

export const presentInspection = (i: InspectionRecord) => ({
  id: i.id,
  meterRunId: i.meterRunId,
  inspectedAt: i.inspectedAt.toISOString(),
  kind: i.kind,
  measured: i.measured,
  condition: i.condition,
  certificate: i.certificate,
  certificateFile: presentFile('element-inspections', i.id, i.certificateFile),
  nextDue: i.nextDue,
  configVersionId: i.configVersionId,
  createdAt: i.createdAt.toISOString(),
  createdBy: author(i),
});

/** A new record with the configuration version it made (and the hours sent back), or null. */
export const presentRecorded = <T, P>(r: Recorded<T>, present: (record: T) => P) => ({
  ...present(r.record),
  configVersion: r.configVersion ? presentCreatedConfigVersion(r.configVersion) : null,
});
