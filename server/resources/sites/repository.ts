import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { Site } from '../../models';
import type { SiteChanges, SiteInput } from './schema';

/** A site as stored, as a plain object (id as a decimal string). */
export interface SiteRecord {
  id: string;
  code: string;
  name: string;
  timeZone: string;
  contractHour: number;
  basePressurePa: number;
  baseTemperatureK: number;
  atmosphericPressurePa: number;
  displayUnits: 'si' | 'us';
}

const siteRecord = (s: Site): SiteRecord => ({
  id: String(s.id),
  code: s.code,
  name: s.name,
  timeZone: s.timeZone,
  contractHour: s.contractHour,
  basePressurePa: s.basePressurePa,
  baseTemperatureK: s.baseTemperatureK,
  atmosphericPressurePa: s.atmosphericPressurePa,
  displayUnits: s.displayUnits,
});

/** All reads and writes of sites. */
export interface SiteRepository {
  /** Every site by code. */
  list(): Promise<SiteRecord[]>;
  findById(id: string): Promise<SiteRecord | null>;
  /** Creates a site with its first settings version, in force from the beginning of history. */
  create(site: SiteInput & { createdBy: string }, transaction: Transaction): Promise<SiteRecord>;
  /** Reads the site and locks its row until the transaction ends; null when it does not exist. */
  lockForUpdate(id: string, transaction: Transaction): Promise<SiteRecord | null>;
  /** Changes a site's undated fields (locked by lockForUpdate) and returns it as it now is. */
  update(id: string, changes: UndatedSiteChanges, transaction: Transaction): Promise<SiteRecord>;
  /**
   * Appends a dated version of the site's settings, then sets the site's own columns to the
   * latest version by effective time (what the set-up shows now).
   * @returns the new version's id
   */
  addSettingVersion(siteId: string, version: NewSiteSettingVersion, transaction: Transaction): Promise<string>;
  /**
   * A site written without settings versions (the demo seed's SQL) gets its current settings as a
   * version from the start of history, so that a first dated change cannot reach back.
   */
  ensureSettingBaseline(siteId: string, transaction: Transaction): Promise<void>;
  /** The ids of the site's meter runs. */
  meterRunIds(siteId: string): Promise<string[]>;
  /** The earliest first configuration version among the site's meter runs (where dated changes may start), or null. */
  historyStart(siteId: string): Promise<Date | null>;
}

/** The dated settings of a site. */
export type SiteSettingValues = Pick<
  SiteRecord,
  'contractHour' | 'basePressurePa' | 'baseTemperatureK' | 'atmosphericPressurePa'
>;

export type UndatedSiteChanges = Omit<SiteChanges, keyof SiteSettingValues | 'effectiveFrom' | 'reason'>;

export type NewSiteSettingVersion = SiteSettingValues & { effectiveFrom: Date; reason: string; createdBy: string };

/** Before this, a site created without a meter run has no history (as for meter runs). */
const beginningOfHistory = new Date('2000-01-01T00:00:00Z');

export function siteRepository(sequelize: Sequelize): SiteRepository {
  const addSettingVersion: SiteRepository['addSettingVersion'] = async (siteId, v, transaction) => {
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO site_setting_versions (site_id, effective_from, contract_hour, base_pressure_pa, base_temperature_k,
         atmospheric_pressure_pa, created_by, reason)
       VALUES (:siteId, :effectiveFrom, :contractHour, :basePressurePa, :baseTemperatureK, :atmosphericPressurePa,
         :createdBy, :reason)
       RETURNING id::text`,
      {
        type: QueryTypes.SELECT,
        transaction,
        replacements: { ...v, siteId, effectiveFrom: v.effectiveFrom.toISOString() },
      },
    );
    await sequelize.query(
      `UPDATE sites s SET contract_hour = v.contract_hour, base_pressure_pa = v.base_pressure_pa,
              base_temperature_k = v.base_temperature_k, atmospheric_pressure_pa = v.atmospheric_pressure_pa,
              updated_at = now()
         FROM (SELECT * FROM site_setting_versions WHERE site_id = :siteId
                ORDER BY effective_from DESC, id DESC LIMIT 1) AS v
        WHERE s.id = :siteId`,
      { transaction, replacements: { siteId } },
    );
    return row.id;
  };
  return {
    addSettingVersion,

    async ensureSettingBaseline(siteId, transaction) {
      await sequelize.query(
        `INSERT INTO site_setting_versions (site_id, effective_from, contract_hour, base_pressure_pa, base_temperature_k,
           atmospheric_pressure_pa, reason)
         SELECT s.id, least(timestamptz '2000-01-01T00:00:00Z', coalesce((SELECT min(c.effective_from)
                  FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id WHERE m.site_id = s.id),
                  timestamptz '2000-01-01T00:00:00Z')),
                s.contract_hour, s.base_pressure_pa, s.base_temperature_k, s.atmospheric_pressure_pa,
                'the site as it was before its first dated change'
           FROM sites s
          WHERE s.id = :siteId AND NOT EXISTS (SELECT 1 FROM site_setting_versions WHERE site_id = s.id)`,
        { transaction, replacements: { siteId } },
      );
    },

    async meterRunIds(siteId) {
      const rows = await sequelize.query<{ id: string }>(
        'SELECT id::text FROM meter_runs WHERE site_id = :siteId ORDER BY meter_runs.id',
        { type: QueryTypes.SELECT, replacements: { siteId } },
      );
      return rows.map((r) => r.id);
    },

    async historyStart(siteId) {
      const [row] = await sequelize.query<{ start: Date | null }>(
        `SELECT min(c.effective_from) AS start FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id
          WHERE m.site_id = :siteId`,
        { type: QueryTypes.SELECT, replacements: { siteId } },
      );
      return row?.start ?? null;
    },

    async list() {
      return (await Site.findAll({ order: [['code', 'ASC']] })).map(siteRecord);
    },

    async findById(id) {
      const site = await Site.findByPk(id);
      return site ? siteRecord(site) : null;
    },

    async create({ createdBy, ...site }, transaction) {
      const created = siteRecord(await Site.create({ ...site }, { transaction }));
      await addSettingVersion(
        created.id,
        {
          contractHour: created.contractHour,
          basePressurePa: created.basePressurePa,
          baseTemperatureK: created.baseTemperatureK,
          atmosphericPressurePa: created.atmosphericPressurePa,
          effectiveFrom: beginningOfHistory,
          reason: 'first settings',
          createdBy,
        },
        transaction,
      );
      return created;
    },

    async lockForUpdate(id, transaction) {
      const site = await Site.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      return site ? siteRecord(site) : null;
    },

    async update(id, changes, transaction) {
      const given = Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined));
      if (Object.keys(given).length) await Site.update(given, { where: { id }, transaction });
      return siteRecord(await Site.findByPk(id, { transaction, rejectOnEmpty: true }));
    },
  };
}
