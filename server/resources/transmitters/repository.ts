import type { Transaction } from 'sequelize';
import { MeterRun, Transmitter } from '../../models';
import type { TransmitterChanges, TransmitterInput } from './schema';

/** A transmitter as stored, as a plain object (ids as decimal strings, range in its own unit). */
export interface TransmitterRecord {
  id: string;
  meterRunId: string;
  tag: string;
  measures: 'differential-pressure' | 'static-pressure' | 'temperature';
  unit: string;
  pressureReference: 'absolute' | 'gauge';
  lowerRange: number;
  upperRange: number;
  stackRole: 'single' | 'low' | 'high';
  accuracyPercentOfSpan: number;
  calibrationDue: string | null;
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
  /** Changes a transmitter (locked by lockForUpdate) and returns it as it now is. */
  update(id: string, changes: TransmitterChanges, transaction: Transaction): Promise<TransmitterRecord>;
}

export function transmitterRepository(): TransmitterRepository {
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
      await Transmitter.update(changes, { where: { id }, transaction });
      return transmitterRecord(await Transmitter.findByPk(id, { transaction, rejectOnEmpty: true }));
    },
  };
}
