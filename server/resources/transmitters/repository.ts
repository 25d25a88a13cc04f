import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { MeterRun, Transmitter } from '../../models';
import type { AccuracyKind } from '../../../shared/uncertainty';
import type { TransmitterChanges, TransmitterInput } from './schema';

/** A transmitter as stored, as a plain object (ids as decimal strings, range in its own unit). */
export interface TransmitterRecord {
  id: string;
  meterRunId: string;
  tag: string;
  measures: 'differential-pressure' | 'static-pressure' | 'temperature' | 'flow-direction';
  unit: string;
  pressureReference: 'absolute' | 'gauge';
  lowerRange: number;
  upperRange: number;
  stackRole: 'single' | 'low' | 'high';
  accuracyPercentOfSpan: number;
  calibrationDue: string | null;
  /** What kind of figure the accuracy is: a k = 2 uncertainty or a ± limit (GUM §4.3.7). */
  accuracyKind: AccuracyKind;
}

const transmitterRecord = (t: Transmitter): TransmitterRecord => ({
  id: String(t.id),
  meterRunId: String(t.meterRunId),
  tag: t.tag,
  measures: t.measures,
  unit: t.unit,
  pressureReference: t.pressureReference,
  lowerRange: t.lowerRange,
  upperRange: t.upperRange,
  stackRole: t.stackRole,
  accuracyPercentOfSpan: t.accuracyPercentOfSpan,
  calibrationDue: t.calibrationDue,
  accuracyKind: t.accuracyKind,
});

/** All reads and writes of transmitters. */
export interface TransmitterRepository {
  /** Transmitters by tag, of one meter run or of all. */
  list(meterRunId?: string): Promise<TransmitterRecord[]>;
  findById(id: string): Promise<TransmitterRecord | null>;
  /** The meter run's tag, or null when it does not exist. */
  meterRunTag(meterRunId: string): Promise<string | null>;
  /** The meter run's transmitters that measure the same quantity. */
  siblings(meterRunId: string, measures: TransmitterRecord['measures']): Promise<TransmitterRecord[]>;
  create(transmitter: TransmitterInput, transaction: Transaction): Promise<TransmitterRecord>;
  /** Reads the transmitter and locks its row until the transaction ends; null when it does not exist. */
  lockForUpdate(id: string, transaction: Transaction): Promise<TransmitterRecord | null>;
  /** Changes a transmitter's calibration date (locked by lockForUpdate) and returns it as it now is. */
  update(
    id: string,
    changes: Pick<TransmitterChanges, 'calibrationDue'>,
    transaction: Transaction,
  ): Promise<TransmitterRecord>;
  /**
   * Appends a dated version of the transmitter's range and accuracy, then sets the transmitter's
   * own columns to the latest version by effective time (what the set-up shows now).
   * @returns the new version's id
   */
  addRangeVersion(transmitterId: string, version: NewRangeVersion, transaction: Transaction): Promise<string>;
  /**
   * A transmitter written without range versions (the demo seed's SQL) gets its current range as
   * a version from the start of its meter run's history, so that a first re-range cannot reach back.
   */
  ensureRangeBaseline(transmitterId: string, transaction: Transaction): Promise<void>;
  /**
   * The start of a meter run's history for a transmitter's first range: its first configuration
   * version, or 2000-01-01 when that is later (as migration 0007 backfilled).
   */
  rangeHistoryStart(meterRunId: string, transaction?: Transaction): Promise<Date>;
  /** The meter run's first configuration version's time (where dated changes may start), or null. */
  meterRunHistoryStart(meterRunId: string): Promise<Date | null>;
  /** The IANA time zone of the meter run's site (its hours start on its local clock), or null. */
  meterRunTimeZone(meterRunId: string): Promise<string | null>;
}

/** A dated range and accuracy of a transmitter, in its own unit. */
export interface NewRangeVersion {
  lowerRange: number;
  upperRange: number;
  accuracyPercentOfSpan: number;
  accuracyKind: AccuracyKind;
  effectiveFrom: Date;
  reason: string;
  createdBy: string;
}

export function transmitterRepository(sequelize: Sequelize): TransmitterRepository {
  return {
    async list(meterRunId) {
      const list = await Transmitter.findAll({ where: meterRunId ? { meterRunId } : {}, order: [['tag', 'ASC']] });
      return list.map(transmitterRecord);
    },

    async findById(id) {
      const t = await Transmitter.findByPk(id);
      return t ? transmitterRecord(t) : null;
    },

    async meterRunTag(meterRunId) {
      return (await MeterRun.findByPk(meterRunId))?.tag ?? null;
    },

    async siblings(meterRunId, measures) {
      return (await Transmitter.findAll({ where: { meterRunId, measures } })).map(transmitterRecord);
    },

    async create(transmitter, transaction) {
      return transmitterRecord(await Transmitter.create({ ...transmitter }, { transaction }));
    },

    async lockForUpdate(id, transaction) {
      const t = await Transmitter.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      return t ? transmitterRecord(t) : null;
    },

    async update(id, changes, transaction) {
      if (changes.calibrationDue !== undefined)
        await Transmitter.update({ calibrationDue: changes.calibrationDue }, { where: { id }, transaction });
      return transmitterRecord(await Transmitter.findByPk(id, { transaction, rejectOnEmpty: true }));
    },

    async addRangeVersion(transmitterId, v, transaction) {
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO transmitter_range_versions (transmitter_id, effective_from, lower_range, upper_range,
           accuracy_percent_of_span, accuracy_kind, created_by, reason)
         VALUES (:transmitterId, :effectiveFrom, :lowerRange, :upperRange, :accuracyPercentOfSpan, :accuracyKind,
                 :createdBy, :reason)
         RETURNING id::text`,
        {
          type: QueryTypes.SELECT,
          transaction,
          replacements: { ...v, transmitterId, effectiveFrom: v.effectiveFrom.toISOString() },
        },
      );
      await sequelize.query(
        `UPDATE transmitters t SET lower_range = v.lower_range, upper_range = v.upper_range,
                accuracy_percent_of_span = v.accuracy_percent_of_span, accuracy_kind = v.accuracy_kind, updated_at = now()
           FROM (SELECT * FROM transmitter_range_versions WHERE transmitter_id = :transmitterId
                  ORDER BY effective_from DESC, id DESC LIMIT 1) AS v
          WHERE t.id = :transmitterId`,
        { transaction, replacements: { transmitterId } },
      );
      return row.id;
    },

    async ensureRangeBaseline(transmitterId, transaction) {
      await sequelize.query(
        `INSERT INTO transmitter_range_versions (transmitter_id, effective_from, lower_range, upper_range,
           accuracy_percent_of_span, accuracy_kind, reason)
         SELECT t.id, least(timestamptz '2000-01-01T00:00:00Z', coalesce((SELECT min(c.effective_from)
                  FROM config_versions c WHERE c.meter_run_id = t.meter_run_id), timestamptz '2000-01-01T00:00:00Z')),
                t.lower_range, t.upper_range, t.accuracy_percent_of_span, t.accuracy_kind,
                'the transmitter as it was before its first dated change'
           FROM transmitters t
          WHERE t.id = :transmitterId AND NOT EXISTS (SELECT 1 FROM transmitter_range_versions WHERE transmitter_id = t.id)`,
        { transaction, replacements: { transmitterId } },
      );
    },

    async rangeHistoryStart(meterRunId, transaction) {
      const [row] = await sequelize.query<{ start: Date }>(
        `SELECT least(timestamptz '2000-01-01T00:00:00Z', coalesce(min(effective_from), timestamptz '2000-01-01T00:00:00Z')) AS start
           FROM config_versions WHERE meter_run_id = :meterRunId`,
        { type: QueryTypes.SELECT, transaction, replacements: { meterRunId } },
      );
      return row.start;
    },

    async meterRunTimeZone(meterRunId) {
      const [row] = await sequelize.query<{ time_zone: string }>(
        'SELECT s.time_zone FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = :meterRunId',
        { type: QueryTypes.SELECT, replacements: { meterRunId } },
      );
      return row?.time_zone ?? null;
    },

    async meterRunHistoryStart(meterRunId) {
      const [row] = await sequelize.query<{ start: Date | null }>(
        'SELECT min(effective_from) AS start FROM config_versions WHERE meter_run_id = :meterRunId',
        { type: QueryTypes.SELECT, replacements: { meterRunId } },
      );
      return row?.start ?? null;
    },
  };
}
