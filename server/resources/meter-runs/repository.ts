import { col, Op, QueryTypes, type FindOptions, type Sequelize, type Transaction } from 'sequelize';
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
  /** No-flow cutoff, share of the active DP transmitter's span (the API shows it in percent). */
  noFlowCutoffShare: number;
  /** Tolerance of the reconciliation against field totals, percent (migration 0012). */
  reconciliationTolerancePercent: number;
  line: Record<string, unknown>;
}

/** The dated settings of a meter run (a row of meter_run_setting_versions, without who and why). */
export interface MeterRunSettingValues {
  holdLimitS: number;
  maxGapS: number;
  noFlowCutoffShare: number;
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
}

/** A dated version of a meter run's settings, with who made it and why. */
export interface MeterRunSettingVersion extends MeterRunSettingValues {
  id: string;
  effectiveFrom: Date;
  reason: string;
  createdAt: Date;
  createdBy: ConfigVersionAuthor | null;
}

interface SettingVersionRow {
  id: string;
  effective_from: Date;
  hold_limit_s: number;
  max_gap_s: number;
  no_flow_cutoff_share: number;
  stack_switch_up_share: number;
  stack_switch_down_share: number;
  reason: string;
  created_at: Date;
  author_email: string | null;
  author_name: string | null;
}

/** A configuration version: the element and fluid of a meter run from `effectiveFrom` on. */
export interface ConfigVersionRecord {
  id: string;
  meterRunId: string;
  effectiveFrom: Date;
  element: Record<string, unknown>;
  fluid: Record<string, unknown>;
  /** The element's constants in reverse flow (migration 0024): present ⇔ bi-directional from effectiveFrom; null one-way. */
  reverseElement: Record<string, unknown> | null;
  /** How the direction is known, with reverseElement ('dp-sign' when not given); null one-way. */
  directionSource: 'dp-sign' | 'direction-input' | null;
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
  reverse_element: Record<string, JsonValue> | null;
  direction_source: 'dp-sign' | 'direction-input' | null;
  reason: string;
  created_at: Date;
  author_email: string | null;
  author_name: string | null;
}

export type NewMeterRun = Omit<MeterRunRecord, 'id' | 'noFlowCutoffShare' | 'reconciliationTolerancePercent'>;
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
  // Not a model attribute (migration 0007 added the column): read through `withCutoff`.
  noFlowCutoffShare: Number(m.get('noFlowCutoffShare') ?? 0.005),
  reconciliationTolerancePercent: Number(m.get('reconciliationTolerancePercent') ?? 0.5),
  line: m.line,
});

/** Finds that also read the no-flow cutoff column. */
const withCutoff: Pick<FindOptions, 'attributes'> = {
  attributes: {
    include: [
      [col('no_flow_cutoff_share'), 'noFlowCutoffShare'],
      [col('reconciliation_tolerance_percent'), 'reconciliationTolerancePercent'],
    ],
  },
};

const configVersionRecord = (c: ConfigVersion): ConfigVersionRecord => ({
  id: String(c.id),
  meterRunId: String(c.meterRunId),
  effectiveFrom: c.effectiveFrom,
  element: c.element,
  fluid: c.fluid,
  reverseElement: c.reverseElement ?? null,
  directionSource: c.directionSource ?? null,
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
  /** Changes a meter run's name and line (locked by lockForUpdate) and returns it as it now is. */
  update(
    id: string,
    changes: Pick<MeterRunChanges, 'name' | 'line'>,
    transaction: Transaction,
  ): Promise<MeterRunRecord>;
  /**
   * Appends a dated version of the meter run's settings, then sets the meter run's own columns
   * to the latest version by effective time (what the set-up shows now).
   * @returns the new version's id
   */
  addSettingVersion(
    meterRunId: string,
    version: MeterRunSettingValues & { effectiveFrom: Date; reason: string; createdBy: string },
    transaction: Transaction,
  ): Promise<string>;
  /**
   * A meter run written without settings versions (the demo seed's SQL) gets its current settings
   * as a version from the start of its history, so that a first dated change cannot reach back.
   */
  ensureSettingBaseline(meterRunId: string, transaction: Transaction): Promise<void>;
  /** Every settings version of a meter run with who made it, oldest first (by effective time, then as written). */
  settingVersionHistory(meterRunId: string): Promise<MeterRunSettingVersion[]>;
  /** The earliest start of history among a site's meter runs (their first configuration versions); null without any. */
  siteHistoryStart(siteId: string): Promise<Date | null>;
  /** Every range version of the meter run's transmitters with who made it, oldest first. */
  transmitterRangeHistory(meterRunId: string): Promise<TransmitterRangeVersion[]>;
  /** Every settings version of a site with who made it, oldest first. */
  siteSettingHistory(siteId: string): Promise<SiteSettingVersion[]>;
}

/** Who and why of any dated version. */
interface DatedVersion {
  id: string;
  effectiveFrom: Date;
  reason: string;
  createdAt: Date;
  createdBy: ConfigVersionAuthor | null;
}

/** A dated range and accuracy of one transmitter of the meter run (in its own unit). */
export interface TransmitterRangeVersion extends DatedVersion {
  transmitterId: string;
  tag: string;
  unit: string;
  lowerRange: number;
  upperRange: number;
  accuracyPercentOfSpan: number;
}

/** Dated settings of the meter run's site. */
export interface SiteSettingVersion extends DatedVersion {
  siteId: string;
  contractHour: number;
  basePressurePa: number;
  baseTemperatureK: number;
  atmosphericPressurePa: number;
}

interface AuthorColumns {
  id: string;
  effective_from: Date;
  reason: string;
  created_at: Date;
  author_email: string | null;
  author_name: string | null;
}

interface RangeVersionRow extends AuthorColumns {
  transmitter_id: string;
  tag: string;
  unit: string;
  lower_range: number;
  upper_range: number;
  accuracy_percent_of_span: number;
}

interface SiteVersionRow extends AuthorColumns {
  site_id: string;
  contract_hour: number;
  base_pressure_pa: number;
  base_temperature_k: number;
  atmospheric_pressure_pa: number;
}

const datedVersion = (r: AuthorColumns): DatedVersion => ({
  id: r.id,
  effectiveFrom: r.effective_from,
  reason: r.reason,
  createdAt: r.created_at,
  createdBy: r.author_email !== null && r.author_name !== null ? { email: r.author_email, name: r.author_name } : null,
});

export function meterRunRepository(sequelize: Sequelize): MeterRunRepository {
  return {
    async list(siteId) {
      const runs = await MeterRun.findAll({ ...withCutoff, where: siteId ? { siteId } : {}, order: [['tag', 'ASC']] });
      return runs.map(meterRunRecord);
    },

    async findById(id) {
      const run = await MeterRun.findByPk(id, withCutoff);
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
        `SELECT v.id::text, v.meter_run_id::text, v.effective_from, v.element, v.fluid, v.reverse_element,
                v.direction_source, v.reason, v.created_at,
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
          reverseElement: r.reverse_element,
          directionSource: r.direction_source,
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
      const created = await MeterRun.create({ ...run }, { transaction });
      return meterRunRecord(await MeterRun.findByPk(created.id, { ...withCutoff, transaction, rejectOnEmpty: true }));
    },

    async createConfigVersion(version, transaction) {
      return configVersionRecord(await ConfigVersion.create({ ...version }, { transaction }));
    },

    async lockForUpdate(id, transaction) {
      const run = await MeterRun.findByPk(id, { ...withCutoff, transaction, lock: transaction.LOCK.UPDATE });
      return run ? meterRunRecord(run) : null;
    },

    async update(id, changes, transaction) {
      if (changes.name !== undefined || changes.line !== undefined)
        await MeterRun.update({ name: changes.name, line: changes.line }, { where: { id }, transaction });
      return meterRunRecord(await MeterRun.findByPk(id, { ...withCutoff, transaction, rejectOnEmpty: true }));
    },

    async addSettingVersion(meterRunId, v, transaction) {
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO meter_run_setting_versions (meter_run_id, effective_from, hold_limit_s, max_gap_s, no_flow_cutoff_share,
           stack_switch_up_share, stack_switch_down_share, created_by, reason)
         VALUES (:meterRunId, :effectiveFrom, :holdLimitS, :maxGapS, :noFlowCutoffShare, :stackSwitchUpShare,
           :stackSwitchDownShare, :createdBy, :reason)
         RETURNING id::text`,
        {
          type: QueryTypes.SELECT,
          transaction,
          replacements: { ...v, meterRunId, effectiveFrom: v.effectiveFrom.toISOString() },
        },
      );
      await sequelize.query(
        `UPDATE meter_runs m SET hold_limit_s = v.hold_limit_s, max_gap_s = v.max_gap_s,
                no_flow_cutoff_share = v.no_flow_cutoff_share, stack_switch_up_share = v.stack_switch_up_share,
                stack_switch_down_share = v.stack_switch_down_share, updated_at = now()
           FROM (SELECT * FROM meter_run_setting_versions WHERE meter_run_id = :meterRunId
                  ORDER BY effective_from DESC, id DESC LIMIT 1) AS v
          WHERE m.id = :meterRunId`,
        { transaction, replacements: { meterRunId } },
      );
      return row.id;
    },

    async ensureSettingBaseline(meterRunId, transaction) {
      await sequelize.query(
        `INSERT INTO meter_run_setting_versions (meter_run_id, effective_from, hold_limit_s, max_gap_s,
           no_flow_cutoff_share, stack_switch_up_share, stack_switch_down_share, reason)
         SELECT m.id, least(timestamptz '2000-01-01T00:00:00Z', coalesce((SELECT min(c.effective_from)
                  FROM config_versions c WHERE c.meter_run_id = m.id), timestamptz '2000-01-01T00:00:00Z')),
                m.hold_limit_s, m.max_gap_s, m.no_flow_cutoff_share, m.stack_switch_up_share, m.stack_switch_down_share,
                'the meter run as it was before its first dated change'
           FROM meter_runs m
          WHERE m.id = :meterRunId AND NOT EXISTS (SELECT 1 FROM meter_run_setting_versions WHERE meter_run_id = m.id)`,
        { transaction, replacements: { meterRunId } },
      );
    },

    async settingVersionHistory(meterRunId) {
      const rows = await sequelize.query<SettingVersionRow>(
        `SELECT v.id::text, v.effective_from, v.hold_limit_s, v.max_gap_s, v.no_flow_cutoff_share, v.stack_switch_up_share,
                v.stack_switch_down_share, v.reason, v.created_at, u.email AS author_email, u.name AS author_name
           FROM meter_run_setting_versions v LEFT JOIN users u ON u.id = v.created_by
          WHERE v.meter_run_id = :meterRunId
          ORDER BY v.effective_from, v.id`,
        { type: QueryTypes.SELECT, replacements: { meterRunId } },
      );
      return rows.map((r) => ({
        id: r.id,
        effectiveFrom: r.effective_from,
        holdLimitS: r.hold_limit_s,
        maxGapS: r.max_gap_s,
        noFlowCutoffShare: r.no_flow_cutoff_share,
        stackSwitchUpShare: r.stack_switch_up_share,
        stackSwitchDownShare: r.stack_switch_down_share,
        reason: r.reason,
        createdAt: r.created_at,
        createdBy:
          r.author_email !== null && r.author_name !== null ? { email: r.author_email, name: r.author_name } : null,
      }));
    },

    async transmitterRangeHistory(meterRunId) {
      const rows = await sequelize.query<RangeVersionRow>(
        `SELECT v.id::text, v.transmitter_id::text, t.tag, t.unit, v.effective_from, v.lower_range, v.upper_range,
                v.accuracy_percent_of_span, v.reason, v.created_at, u.email AS author_email, u.name AS author_name
           FROM transmitter_range_versions v JOIN transmitters t ON t.id = v.transmitter_id
           LEFT JOIN users u ON u.id = v.created_by
          WHERE t.meter_run_id = :meterRunId
          ORDER BY v.effective_from, v.id`,
        { type: QueryTypes.SELECT, replacements: { meterRunId } },
      );
      return rows.map((r) => ({
        ...datedVersion(r),
        transmitterId: r.transmitter_id,
        tag: r.tag,
        unit: r.unit,
        lowerRange: r.lower_range,
        upperRange: r.upper_range,
        accuracyPercentOfSpan: r.accuracy_percent_of_span,
      }));
    },

    async siteSettingHistory(siteId) {
      const rows = await sequelize.query<SiteVersionRow>(
        `SELECT v.id::text, v.site_id::text, v.effective_from, v.contract_hour, v.base_pressure_pa, v.base_temperature_k,
                v.atmospheric_pressure_pa, v.reason, v.created_at, u.email AS author_email, u.name AS author_name
           FROM site_setting_versions v LEFT JOIN users u ON u.id = v.created_by
          WHERE v.site_id = :siteId
          ORDER BY v.effective_from, v.id`,
        { type: QueryTypes.SELECT, replacements: { siteId } },
      );
      return rows.map((r) => ({
        ...datedVersion(r),
        siteId: r.site_id,
        contractHour: r.contract_hour,
        basePressurePa: r.base_pressure_pa,
        baseTemperatureK: r.base_temperature_k,
        atmosphericPressurePa: r.atmospheric_pressure_pa,
      }));
    },

    async siteHistoryStart(siteId) {
      const [row] = await sequelize.query<{ start: Date | null }>(
        `SELECT min(c.effective_from) AS start FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id
          WHERE m.site_id = :siteId`,
        { type: QueryTypes.SELECT, replacements: { siteId } },
      );
      return row?.start ?? null;
    },
  };
}
