import type { Transaction } from 'sequelize';
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
  create(site: SiteInput, transaction: Transaction): Promise<SiteRecord>;
  /** Reads the site and locks its row until the transaction ends; null when it does not exist. */
  lockForUpdate(id: string, transaction: Transaction): Promise<SiteRecord | null>;
  /** Changes a site (locked by lockForUpdate) and returns it as it now is. */
  update(id: string, changes: SiteChanges, transaction: Transaction): Promise<SiteRecord>;
}

export function siteRepository(): SiteRepository {
  return {
    async list() {
      return (await Site.findAll({ order: [['code', 'ASC']] })).map(siteRecord);
    },

    async findById(id) {
      const site = await Site.findByPk(id);
      return site ? siteRecord(site) : null;
    },

    async create(site, transaction) {
      return siteRecord(await Site.create({ ...site }, { transaction }));
    },

    async lockForUpdate(id, transaction) {
      const site = await Site.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      return site ? siteRecord(site) : null;
    },

    async update(id, changes, transaction) {
      await Site.update(changes, { where: { id }, transaction });
      return siteRecord(await Site.findByPk(id, { transaction, rejectOnEmpty: true }));
    },
  };
}
