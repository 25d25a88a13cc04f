import { Op, QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { JsonValue } from '../../../shared/config/config-difference';
import { ConfigVersion, MeterRun, Site } from '../../models';
import type { MeterRunChanges } from './schema';

/** A meter run as stored, as a plain object (ids as decimal strings). */
export interface MeterRunRecord {
  id: string;
  siteId: string;
  tag: string;
  name: string;
  holdLimitS: number;
  maxGapS: number;
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
  line: Record<string, unknown>;
}

/** A configuration version: the element and fluid of a meter run from `effectiveFrom` on. */
export interface ConfigVersionRecord {
  id: string;
  meterRunId: string;
  effectiveFrom: Date;
  element: Record<string, unknown>;
  fluid: Record<string, unknown>;
  reason: string;
  createdAt: Date;
}

/** Who made a configuration version (null for versions written before authors were kept). */
export interface ConfigVersionAuthor {
  email: string;
  name: string;
}

/** A configuration version with its author, as the history of a meter run lists it. */
export interface ConfigVersionWithAuthor {
  version: ConfigVersionRecord;
  createdBy: ConfigVersionAuthor | null;
}

interface ConfigVersionHistoryRow {
  id: string;
  meter_run_id: string;
  effective_from: Date;
  element: Record<string, JsonValue>;
  fluid: Record<string, JsonValue>;
  reason: string;
  created_at: Date;
  author_email: string | null;
  author_name: string | null;
}

export type NewMeterRun = Omit<MeterRunRecord, 'id'>;
export type NewConfigVersion = Omit<ConfigVersionRecord, 'id' | 'createdAt'> & { createdBy: string };

const meterRunRecord = (m: MeterRun): MeterRunRecord => ({
  id: String(m.id),
  siteId: String(m.siteId),
  tag: m.tag,
  name: m.name,
  holdLimitS: m.holdLimitS,
  maxGapS: m.maxGapS,
  stackSwitchUpShare: m.stackSwitchUpShare,
  stackSwitchDownShare: m.stackSwitchDownShare,
  line: m.line,
});

const configVersionRecord = (c: ConfigVersion): ConfigVersionRecord => ({
  id: String(c.id),
  meterRunId: String(c.meterRunId),
  effectiveFrom: c.effectiveFrom,
  element: c.element,
  fluid: c.fluid,
  reason: c.reason,
  createdAt: c.createdAt,
});

/** All reads and writes of meter runs and their configuration versions. */
export interface MeterRunRepository {
  /** Meter runs by tag, of one site or of all. */
  list(siteId?: string): Promise<MeterRunRecord[]>;
  findById(id: string): Promise<MeterRunRecord | null>;
  siteExists(siteId: string): Promise<boolean>;
  /** The version in force at `at` (the newest effective at or before it), or null. */
  currentConfig(meterRunId: string, at: Date): Promise<ConfigVersionRecord | null>;
  /** The versions of these meter runs effective at or before `at`, newest first, in one query. */
  configsEffectiveBy(meterRunIds: string[], at: Date): Promise<ConfigVersionRecord[]>;
  /** Every version of a meter run with who made it, oldest first (by effective time). */
  configVersionHistory(meterRunId: string): Promise<ConfigVersionWithAuthor[]>;
  /** The IANA time zone of a site (its hours start on its local clock); null when there is no such site. */
  siteTimeZone(siteId: string): Promise<string | null>;
  /** How many hourly records of a meter run are already computed from `fromMs` on. */
  computedHourCount(meterRunId: string, fromMs: number): Promise<number>;
  create(run: NewMeterRun, transaction: Transaction): Promise<MeterRunRecord>;
  createConfigVersion(version: NewConfigVersion, transaction: Transaction): Promise<ConfigVersionRecord>;
  /** Reads the meter run and locks its row until the transaction ends; null when it does not exist. */
  lockForUpdate(id: string, transaction: Transaction): Promise<MeterRunRecord | null>;
  /** Changes a meter run (locked by lockForUpdate) and returns it as it now is. */
  update(id: string, changes: MeterRunChanges, transaction: Transaction): Promise<MeterRunRecord>;
}

export function meterRunRepository(sequelize: Sequelize): MeterRunRepository {
  return {
    async list(siteId) {
      const runs = await MeterRun.findAll({ where: siteId ? { siteId } : {}, order: [['tag', 'ASC']] });
      return runs.map(meterRunRecord);
    },

    async findById(id) {
      const run = await MeterRun.findByPk(id);
      return run ? meterRunRecord(run) : null;
    },

    async siteExists(siteId) {
      return (await Site.findByPk(siteId)) !== null;
    },

    async currentConfig(meterRunId, at) {
      const version = await ConfigVersion.findOne({
        where: { meterRunId, effectiveFrom: { [Op.lte]: at } },
        order: [['effectiveFrom', 'DESC']],
      });
      return version ? configVersionRecord(version) : null;
    },

    async configsEffectiveBy(meterRunIds, at) {
      const versions = await ConfigVersion.findAll({
        where: { meterRunId: meterRunIds, effectiveFrom: { [Op.lte]: at } },
        order: [['effectiveFrom', 'DESC']],
      });
      return versions.map(configVersionRecord);
    },

    async configVersionHistory(meterRunId) {
      const rows = await sequelize.query<ConfigVersionHistoryRow>(
        `SELECT v.id::text, v.meter_run_id::text, v.effective_from, v.element, v.fluid, v.reason, v.created_at,
                u.email AS author_email, u.name AS author_name
           FROM config_versions v LEFT JOIN users u ON u.id = v.created_by
          WHERE v.meter_run_id = :meterRunId
          ORDER BY v.effective_from`,
        { type: QueryTypes.SELECT, replacements: { meterRunId } },
      );
      return rows.map((r) => ({
        version: {
          id: r.id,
          meterRunId: r.meter_run_id,
          effectiveFrom: r.effective_from,
          element: r.element,
          fluid: r.fluid,
          reason: r.reason,
          createdAt: r.created_at,
        },
        createdBy:
          r.author_email !== null && r.author_name !== null ? { email: r.author_email, name: r.author_name } : null,
      }));
    },

    async siteTimeZone(siteId) {
      const site = await Site.findByPk(siteId, { attributes: ['timeZone'] });
      return site ? site.timeZone : null;
    },

    async computedHourCount(meterRunId, fromMs) {
      const [row] = await sequelize.query<{ hours: number }>(
        `SELECT count(*)::int AS hours FROM hourly_records WHERE meter_run_id = :meterRunId AND start >= :from`,
        { type: QueryTypes.SELECT, replacements: { meterRunId, from: new Date(fromMs).toISOString() } },
      );
      return row.hours;
    },

    async create(run, transaction) {
      return meterRunRecord(await MeterRun.create({ ...run }, { transaction }));
    },

    async createConfigVersion(version, transaction) {
      return configVersionRecord(await ConfigVersion.create({ ...version }, { transaction }));
    },

    async lockForUpdate(id, transaction) {
      const run = await MeterRun.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      return run ? meterRunRecord(run) : null;
    },

    async update(id, changes, transaction) {
      await MeterRun.update(changes, { where: { id }, transaction });
      return meterRunRecord(await MeterRun.findByPk(id, { transaction, rejectOnEmpty: true }));
    },
  };
}
