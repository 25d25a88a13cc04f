import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { CertificateType } from '../../certificates/store';
import type { CalibrationPoint } from './points';

/** The transmitter a calibration belongs to, with the range its points are judged against. */
export interface CalibratedTransmitter {
  id: string;
  meterRunId: string;
  tag: string;
  unit: string;
  lowerRange: number;
  upperRange: number;
  accuracyPercentOfSpan: number;
}

/** A calibration as stored, as a plain object (ids as decimal strings, dates YYYY-MM-DD). */
export interface CalibrationRecord {
  id: string;
  transmitterId: string;
  meterRunId: string;
  calibratedOn: string;
  laboratory: string;
  accreditationStandard: string | null;
  accreditationNumber: string | null;
  unit: string;
  lowerRange: number;
  upperRange: number;
  asFound: CalibrationPoint[];
  asLeft: CalibrationPoint[];
  asFoundPass: boolean;
  asLeftPass: boolean;
  performedBy: string;
  nextDue: string;
  notes: string | null;
  certificate: {
    path: string;
    sha256: string;
    contentType: CertificateType;
    sizeBytes: number;
    fileName: string;
  } | null;
  correctsId: string | null;
  /** The record that corrects this one, when there is one: this one is then no longer in force. */
  correctedById: string | null;
  createdBy: string | null;
  createdAtMs: number;
}

/** A transmitter's range and accuracy as a dated setting in force at one instant. */
export interface RangeInForce {
  lowerRange: number;
  upperRange: number;
  accuracyPercentOfSpan: number;
}

/** What a correction proposal needs to know of a transmitter, its meter run and site. */
export interface ProposalContext {
  transmitterId: string;
  tag: string;
  meterRunId: string;
  measures: 'differential-pressure' | 'static-pressure' | 'temperature';
  gauge: boolean;
  atmosphericPressurePa: number;
  timeZone: string;
  /** The transmitter's first reading, or null when it has none. */
  firstReadingMs: number | null;
  /** The meter run's first configuration version, or null when it has none. */
  firstConfigurationMs: number | null;
}

export type NewCalibration = Omit<CalibrationRecord, 'id' | 'meterRunId' | 'correctedById' | 'createdAtMs'>;

interface CalibrationRow {
  id: string;
  transmitter_id: string;
  meter_run_id: string;
  calibrated_on: string;
  laboratory: string;
  accreditation_standard: string | null;
  accreditation_number: string | null;
  unit: string;
  lower_range: number;
  upper_range: number;
  as_found: CalibrationPoint[];
  as_left: CalibrationPoint[];
  as_found_pass: boolean;
  as_left_pass: boolean;
  performed_by: string;
  next_due: string;
  notes: string | null;
  certificate_path: string | null;
  certificate_sha256: string | null;
  certificate_type: CertificateType | null;
  certificate_size_bytes: string | null;
  certificate_name: string | null;
  corrects_id: string | null;
  corrected_by_id: string | null;
  created_by: string | null;
  created_at: Date;
}

const selectCalibrations = `
  SELECT c.id::text, c.transmitter_id::text, t.meter_run_id::text, to_char(c.calibrated_on, 'YYYY-MM-DD') AS calibrated_on,
         c.laboratory, c.accreditation_standard, c.accreditation_number, c.unit, c.lower_range, c.upper_range,
         c.as_found, c.as_left, c.as_found_pass, c.as_left_pass, c.performed_by, to_char(c.next_due, 'YYYY-MM-DD') AS next_due,
         c.notes, c.certificate_path, c.certificate_sha256, c.certificate_type, c.certificate_size_bytes::text,
         c.certificate_name, c.corrects_id::text,
         (SELECT x.id::text FROM transmitter_calibrations x WHERE x.corrects_id = c.id) AS corrected_by_id,
         c.created_by::text, c.created_at
    FROM transmitter_calibrations c JOIN transmitters t ON t.id = c.transmitter_id`;

const calibrationRecord = (r: CalibrationRow): CalibrationRecord => ({
  id: r.id,
  transmitterId: r.transmitter_id,
  meterRunId: r.meter_run_id,
  calibratedOn: r.calibrated_on,
  laboratory: r.laboratory,
  accreditationStandard: r.accreditation_standard,
  accreditationNumber: r.accreditation_number,
  unit: r.unit,
  lowerRange: r.lower_range,
  upperRange: r.upper_range,
  asFound: r.as_found,
  asLeft: r.as_left,
  asFoundPass: r.as_found_pass,
  asLeftPass: r.as_left_pass,
  performedBy: r.performed_by,
  nextDue: r.next_due,
  notes: r.notes,
  certificate:
    r.certificate_path && r.certificate_sha256 && r.certificate_type
      ? {
          path: r.certificate_path,
          sha256: r.certificate_sha256,
          contentType: r.certificate_type,
          sizeBytes: Number(r.certificate_size_bytes),
          fileName: r.certificate_name ?? 'certificate',
        }
      : null,
  correctsId: r.corrects_id,
  correctedById: r.corrected_by_id,
  createdBy: r.created_by,
  createdAtMs: r.created_at.getTime(),
});

/** All reads and writes of calibrations (append-only: no update, no delete). */
export interface CalibrationRepository {
  transmitter(id: string): Promise<CalibratedTransmitter | null>;
  /** A transmitter's calibrations, newest calibration date first. */
  list(transmitterId: string): Promise<CalibrationRecord[]>;
  findById(id: string, transaction?: Transaction): Promise<CalibrationRecord | null>;
  /** One writer of a transmitter's calibrations at a time, until the transaction ends (the table is append-only: no row lock). */
  lockTransmitter(transmitterId: string, transaction: Transaction): Promise<void>;
  insert(calibration: NewCalibration, transaction: Transaction): Promise<CalibrationRecord>;
  /**
   * The range in force at the end of `day` on the site's clock (the last version whose effective
   * time is before the next local midnight); the earliest version when the day precedes them all;
   * null when the transmitter has no dated range.
   */
  rangeAtEndOfDay(transmitterId: string, day: string): Promise<RangeInForce | null>;
  proposalContext(transmitterId: string): Promise<ProposalContext | null>;
  /** The latest calibration in force (not corrected) of the transmitter before `day` whose as-left passed. */
  lastGoodBefore(transmitterId: string, day: string): Promise<CalibrationRecord | null>;
}

export function calibrationRepository(sequelize: Sequelize): CalibrationRepository {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction) =>
    sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });
  const findById = async (id: string, transaction?: Transaction) => {
    const [row] = await select<CalibrationRow>(`${selectCalibrations} WHERE c.id = :id`, { id }, transaction);
    return row ? calibrationRecord(row) : null;
  };
  return {
    async transmitter(id) {
      const [row] = await select<{
        id: string;
        meter_run_id: string;
        tag: string;
        unit: string;
        lower_range: number;
        upper_range: number;
        accuracy_percent_of_span: number;
      }>(
        `SELECT id::text, meter_run_id::text, tag, unit, lower_range, upper_range, accuracy_percent_of_span
           FROM transmitters WHERE id = :id`,
        { id },
      );
      return row
        ? {
            id: row.id,
            meterRunId: row.meter_run_id,
            tag: row.tag,
            unit: row.unit,
            lowerRange: row.lower_range,
            upperRange: row.upper_range,
            accuracyPercentOfSpan: row.accuracy_percent_of_span,
          }
        : null;
    },

    async list(transmitterId) {
      const rows = await select<CalibrationRow>(
        `${selectCalibrations} WHERE c.transmitter_id = :transmitterId ORDER BY c.calibrated_on DESC, c.id DESC`,
        { transmitterId },
      );
      return rows.map(calibrationRecord);
    },

    findById,

    async lockTransmitter(transmitterId, transaction) {
      await sequelize.query(`SELECT pg_advisory_xact_lock(hashtext('transmitter-calibrations'), :id::int)`, {
        replacements: { id: Number(transmitterId) % 2 ** 31 },
        transaction,
      });
    },

    async insert(c, transaction) {
      const [row] = await select<{ id: string }>(
        `INSERT INTO transmitter_calibrations
           (transmitter_id, calibrated_on, laboratory, accreditation_standard, accreditation_number, unit, lower_range,
            upper_range, as_found, as_left, as_found_pass, as_left_pass, performed_by, next_due, notes,
            certificate_path, certificate_sha256, certificate_type, certificate_size_bytes, certificate_name,
            corrects_id, created_by)
         VALUES (:transmitterId, :calibratedOn, :laboratory, :accreditationStandard, :accreditationNumber, :unit, :lowerRange,
            :upperRange, :asFound::jsonb, :asLeft::jsonb, :asFoundPass, :asLeftPass, :performedBy, :nextDue, :notes,
            :certificatePath, :certificateSha256, :certificateType, :certificateSizeBytes, :certificateName,
            :correctsId, :createdBy)
         RETURNING id::text`,
        {
          ...c,
          asFound: JSON.stringify(c.asFound),
          asLeft: JSON.stringify(c.asLeft),
          certificatePath: c.certificate?.path ?? null,
          certificateSha256: c.certificate?.sha256 ?? null,
          certificateType: c.certificate?.contentType ?? null,
          certificateSizeBytes: c.certificate?.sizeBytes ?? null,
          certificateName: c.certificate?.fileName ?? null,
        },
        transaction,
      );
      return (await findById(row.id, transaction))!;
    },

    async rangeAtEndOfDay(transmitterId, day) {
      const [row] = await select<{ lower_range: number; upper_range: number; accuracy_percent_of_span: number }>(
        `SELECT v.lower_range, v.upper_range, v.accuracy_percent_of_span
           FROM transmitter_range_versions v
           JOIN transmitters t ON t.id = v.transmitter_id
           JOIN meter_runs m ON m.id = t.meter_run_id
           JOIN sites s ON s.id = m.site_id
          WHERE v.transmitter_id = :transmitterId
          ORDER BY (v.effective_from < ((:day::date + 1)::timestamp AT TIME ZONE s.time_zone)) DESC,
                   CASE WHEN v.effective_from < ((:day::date + 1)::timestamp AT TIME ZONE s.time_zone)
                        THEN -extract(epoch FROM v.effective_from) ELSE extract(epoch FROM v.effective_from) END,
                   v.id DESC
          LIMIT 1`,
        { transmitterId, day },
      );
      return row
        ? {
            lowerRange: row.lower_range,
            upperRange: row.upper_range,
            accuracyPercentOfSpan: row.accuracy_percent_of_span,
          }
        : null;
    },

    async proposalContext(transmitterId) {
      const [row] = await select<{
        id: string;
        tag: string;
        meter_run_id: string;
        measures: ProposalContext['measures'];
        pressure_reference: string;
        atmospheric_pressure_pa: number;
        time_zone: string;
        first_reading: Date | null;
        first_configuration: Date | null;
      }>(
        `SELECT t.id::text, t.tag, t.meter_run_id::text, t.measures::text AS measures, t.pressure_reference,
                s.atmospheric_pressure_pa, s.time_zone,
                (SELECT min(r.time) FROM readings r WHERE r.transmitter_id = t.id) AS first_reading,
                (SELECT min(c.effective_from) FROM config_versions c WHERE c.meter_run_id = t.meter_run_id)
                  AS first_configuration
           FROM transmitters t JOIN meter_runs m ON m.id = t.meter_run_id JOIN sites s ON s.id = m.site_id
          WHERE t.id = :transmitterId`,
        { transmitterId },
      );
      return row
        ? {
            transmitterId: row.id,
            tag: row.tag,
            meterRunId: row.meter_run_id,
            measures: row.measures,
            gauge: row.pressure_reference === 'gauge',
            atmosphericPressurePa: row.atmospheric_pressure_pa,
            timeZone: row.time_zone,
            firstReadingMs: row.first_reading ? row.first_reading.getTime() : null,
            firstConfigurationMs: row.first_configuration ? row.first_configuration.getTime() : null,
          }
        : null;
    },

    async lastGoodBefore(transmitterId, day) {
      const [row] = await select<CalibrationRow>(
        `${selectCalibrations}
          WHERE c.transmitter_id = :transmitterId AND c.calibrated_on < :day::date AND c.as_left_pass
            AND NOT EXISTS (SELECT 1 FROM transmitter_calibrations x WHERE x.corrects_id = c.id)
          ORDER BY c.calibrated_on DESC, c.id DESC LIMIT 1`,
        { transmitterId, day },
      );
      return row ? calibrationRecord(row) : null;
    },
  };
}
