import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { CalibrationPoint } from '../../../shared/flow/flow-types';
import type { CertificateType } from '../../certificates/store';

/** Who recorded an element care record. */
export interface RecordAuthor {
  email: string;
  name: string;
}

/** A record's stored certificate file (never served by its path; see the certificate routes). */
export interface CertificateFile {
  path: string;
  sha256: string;
  contentType: CertificateType;
  sizeBytes: number;
  fileName: string;
}

interface Recorded {
  id: string;
  meterRunId: string;
  /** The certificate's number or reference. */
  certificate: string | null;
  certificateFile: CertificateFile | null;
  /** The next one due, YYYY-MM-DD in the site's zone. */
  nextDue: string | null;
  configVersionId: string | null;
  createdAt: Date;
  createdBy: RecordAuthor | null;
}

export interface ElementCalibrationRecord extends Recorded {
  calibratedAt: Date;
  effectiveFrom: Date;
  laboratory: string;
  uncertaintyPercent: number;
  points: CalibrationPoint[];
  /** The flow direction the curve is for (issue 13 §11): 'reverse' went into the reverse constants. */
  direction: 'forward' | 'reverse';
}

export interface GasAnalysisRecord extends Recorded {
  sampledAt: Date;
  laboratory: string;
  components: Record<string, number>;
  composition: Record<string, number>;
  sumTolerance: number;
}

export interface InspectionRecord extends Recorded {
  inspectedAt: Date;
  kind: string;
  measured: Record<string, number | boolean>;
  condition: string;
}

interface RecordedRow {
  id: string;
  meter_run_id: string;
  certificate: string | null;
  certificate_path: string | null;
  certificate_sha256: string | null;
  certificate_type: CertificateType | null;
  certificate_size_bytes: string | null;
  certificate_name: string | null;
  next_due: string | null;
  config_version_id: string | null;
  created_at: Date;
  author_email: string | null;
  author_name: string | null;
}
interface CalibrationRow extends RecordedRow {
  calibrated_at: Date;
  effective_from: Date;
  laboratory: string;
  uncertainty_percent: number;
  points: CalibrationPoint[];
  direction: 'forward' | 'reverse';
}
interface AnalysisRow extends RecordedRow {
  sampled_at: Date;
  laboratory: string;
  components: Record<string, number>;
  composition: Record<string, number>;
  sum_tolerance: number;
}
interface InspectionRow extends RecordedRow {
  inspected_at: Date;
  kind: string;
  measured: Record<string, number | boolean>;
  condition: string;
}

const recorded = (r: RecordedRow): Recorded => ({
  id: r.id,
  meterRunId: r.meter_run_id,
  certificate: r.certificate,
  certificateFile:
    r.certificate_path && r.certificate_sha256 && r.certificate_type
      ? {
          path: r.certificate_path,
          sha256: r.certificate_sha256,
          contentType: r.certificate_type,
          sizeBytes: Number(r.certificate_size_bytes),
          fileName: r.certificate_name ?? 'certificate',
        }
      : null,
  nextDue: r.next_due,
  configVersionId: r.config_version_id,
  createdAt: r.created_at,
  createdBy: r.author_email !== null ? { email: r.author_email, name: r.author_name ?? '' } : null,
});

const common = `t.id::text, t.meter_run_id::text, t.certificate, t.certificate_path, t.certificate_sha256,
                t.certificate_type, t.certificate_size_bytes::text, t.certificate_name,
                to_char(t.next_due, 'YYYY-MM-DD') AS next_due, t.config_version_id::text, t.created_at,
                u.email AS author_email, u.name AS author_name`;

/** The certificate and next-due columns of an insert, and their values. */
const fileColumns = `certificate_path, certificate_sha256, certificate_type, certificate_size_bytes, certificate_name, next_due`;
const fileValues = `:certificatePath, :certificateSha256, :certificateType, :certificateSizeBytes, :certificateName, :nextDue`;
const fileReplacements = (r: { certificateFile: CertificateFile | null; nextDue: string | null }) => ({
  certificatePath: r.certificateFile?.path ?? null,
  certificateSha256: r.certificateFile?.sha256 ?? null,
  certificateType: r.certificateFile?.contentType ?? null,
  certificateSizeBytes: r.certificateFile?.sizeBytes ?? null,
  certificateName: r.certificateFile?.fileName ?? null,
  nextDue: r.nextDue,
});

/** All reads and writes of element calibrations, gas analyses and inspections (append-only tables). */
export interface ElementCareRepository {
  /** A meter run's records, newest first (by the date they were taken). */
  listCalibrations(meterRunId: string): Promise<ElementCalibrationRecord[]>;
  listGasAnalyses(meterRunId: string): Promise<GasAnalysisRecord[]>;
  listInspections(meterRunId: string): Promise<InspectionRecord[]>;
  findCalibration(id: string, transaction?: Transaction): Promise<ElementCalibrationRecord | null>;
  findGasAnalysis(id: string, transaction?: Transaction): Promise<GasAnalysisRecord | null>;
  findInspection(id: string, transaction?: Transaction): Promise<InspectionRecord | null>;
  /** Each insert returns the new record's id. */
  insertCalibration(
    c: Omit<ElementCalibrationRecord, 'id' | 'createdAt' | 'createdBy'> & { createdBy: string },
    transaction: Transaction,
  ): Promise<string>;
  insertGasAnalysis(
    a: Omit<GasAnalysisRecord, 'id' | 'createdAt' | 'createdBy'> & { createdBy: string },
    transaction: Transaction,
  ): Promise<string>;
  insertInspection(
    i: Omit<InspectionRecord, 'id' | 'createdAt' | 'createdBy'> & { createdBy: string },
    transaction: Transaction,
  ): Promise<string>;
}

export function elementCareRepository(sequelize: Sequelize): ElementCareRepository {
  const select = <Row extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction) =>
    sequelize.query<Row>(sql, { type: QueryTypes.SELECT, replacements, transaction });
  const insertReturningId = async (sql: string, replacements: Record<string, unknown>, transaction: Transaction) => {
    const rows = await select<{ id: string }>(sql, replacements, transaction);
    return rows[0].id;
  };

  const calibration = (r: CalibrationRow): ElementCalibrationRecord => ({
    ...recorded(r),
    calibratedAt: r.calibrated_at,
    effectiveFrom: r.effective_from,
    laboratory: r.laboratory,
    uncertaintyPercent: r.uncertainty_percent,
    points: r.points,
    direction: r.direction,
  });
  const analysis = (r: AnalysisRow): GasAnalysisRecord => ({
    ...recorded(r),
    sampledAt: r.sampled_at,
    laboratory: r.laboratory,
    components: r.components,
    composition: r.composition,
    sumTolerance: r.sum_tolerance,
  });
  const inspection = (r: InspectionRow): InspectionRecord => ({
    ...recorded(r),
    inspectedAt: r.inspected_at,
    kind: r.kind,
    measured: r.measured,
    condition: r.condition,
  });

  const calibrationSql = `SELECT ${common}, t.calibrated_at, t.effective_from, t.laboratory, t.uncertainty_percent, t.points,
                t.direction
           FROM element_calibrations t LEFT JOIN users u ON u.id = t.created_by`;
  const analysisSql = `SELECT ${common}, t.sampled_at, t.laboratory, t.components, t.composition, t.sum_tolerance
           FROM gas_analyses t LEFT JOIN users u ON u.id = t.created_by`;
  const inspectionSql = `SELECT ${common}, t.inspected_at, t.kind, t.measured, t.condition
           FROM element_inspections t LEFT JOIN users u ON u.id = t.created_by`;

  return {
    async listCalibrations(meterRunId) {
      const rows = await select<CalibrationRow>(
        `${calibrationSql} WHERE t.meter_run_id = :meterRunId ORDER BY t.calibrated_at DESC, t.id DESC`,
        { meterRunId },
      );
      return rows.map(calibration);
    },
    async listGasAnalyses(meterRunId) {
      const rows = await select<AnalysisRow>(
        `${analysisSql} WHERE t.meter_run_id = :meterRunId ORDER BY t.sampled_at DESC, t.id DESC`,
        { meterRunId },
      );
      return rows.map(analysis);
    },
    async listInspections(meterRunId) {
      const rows = await select<InspectionRow>(
        `${inspectionSql} WHERE t.meter_run_id = :meterRunId ORDER BY t.inspected_at DESC, t.id DESC`,
        { meterRunId },
      );
      return rows.map(inspection);
    },
    async findCalibration(id, transaction) {
      const rows = await select<CalibrationRow>(`${calibrationSql} WHERE t.id = :id`, { id }, transaction);
      return rows.length ? calibration(rows[0]) : null;
    },
    async findGasAnalysis(id, transaction) {
      const rows = await select<AnalysisRow>(`${analysisSql} WHERE t.id = :id`, { id }, transaction);
      return rows.length ? analysis(rows[0]) : null;
    },
    async findInspection(id, transaction) {
      const rows = await select<InspectionRow>(`${inspectionSql} WHERE t.id = :id`, { id }, transaction);
      return rows.length ? inspection(rows[0]) : null;
    },
    insertCalibration(c, transaction) {
      return insertReturningId(
        `INSERT INTO element_calibrations (meter_run_id, calibrated_at, effective_from, laboratory, certificate,
                uncertainty_percent, points, direction, config_version_id, created_by, ${fileColumns})
         VALUES (:meterRunId, :calibratedAt, :effectiveFrom, :laboratory, :certificate,
                 :uncertaintyPercent, CAST(:points AS jsonb), :direction, :configVersionId, :createdBy, ${fileValues})
         RETURNING id::text`,
        { ...c, points: JSON.stringify(c.points), ...fileReplacements(c) },
        transaction,
      );
    },
    insertGasAnalysis(a, transaction) {
      return insertReturningId(
        `INSERT INTO gas_analyses (meter_run_id, sampled_at, laboratory, certificate, components, composition,
                sum_tolerance, config_version_id, created_by, ${fileColumns})
         VALUES (:meterRunId, :sampledAt, :laboratory, :certificate, CAST(:components AS jsonb), CAST(:composition AS jsonb),
                 :sumTolerance, :configVersionId, :createdBy, ${fileValues})
         RETURNING id::text`,
        {
          ...a,
          components: JSON.stringify(a.components),
          composition: JSON.stringify(a.composition),
          ...fileReplacements(a),
        },
        transaction,
      );
    },
    insertInspection(i, transaction) {
      return insertReturningId(
        `INSERT INTO element_inspections (meter_run_id, inspected_at, kind, measured, condition, certificate,
                config_version_id, created_by, ${fileColumns})
         VALUES (:meterRunId, :inspectedAt, :kind, CAST(:measured AS jsonb), :condition, :certificate,
                 :configVersionId, :createdBy, ${fileValues})
         RETURNING id::text`,
        { ...i, measured: JSON.stringify(i.measured), ...fileReplacements(i) },
        transaction,
      );
    },
  };
}
