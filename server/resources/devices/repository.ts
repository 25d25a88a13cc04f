import type { Sequelize, Transaction } from 'sequelize';
import { Device, Site } from '../../models';

/** A device's credentials record, without its password hash. */
export interface DeviceRecord {
  id: string;
  siteId: string;
  name: string;
  username: string;
  disabled: boolean;
  acceptedCount: number;
  rejectedCount: number;
  lastRejection: string | null;
  lastSeenAt: Date | null;
  createdAt: Date;
}

export interface DevicesRepository {
  transaction<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  /** Every device, oldest first, with its site's code. */
  list(): Promise<{ device: DeviceRecord; siteCode: string | undefined }[]>;
  site(siteId: string): Promise<{ id: string; code: string } | null>;
  create(
    device: { siteId: string; name: string; username: string; passwordHash: string },
    transaction: Transaction,
  ): Promise<DeviceRecord>;
  /** @returns the device before and after, or null when there is no such device */
  setDisabled(
    id: string,
    disabled: boolean,
    transaction: Transaction,
  ): Promise<{ before: DeviceRecord; after: DeviceRecord } | null>;
}

// The counters are bigints, which Sequelize hands over as strings.
const toRecord = (d: Device): DeviceRecord => ({
  id: String(d.id),
  siteId: String(d.siteId),
  name: d.name,
  username: d.username,
  disabled: d.disabled,
  acceptedCount: Number(d.acceptedCount),
  rejectedCount: Number(d.rejectedCount),
  lastRejection: d.lastRejection,
  lastSeenAt: d.lastSeenAt,
  createdAt: d.createdAt,
});

export function devicesRepository(sequelize: Sequelize): DevicesRepository {
  return {
    transaction: (work) => sequelize.transaction(work),

    async list() {
      const [devices, sites] = await Promise.all([Device.findAll({ order: [['id', 'ASC']] }), Site.findAll()]);
      const codes = new Map(sites.map((s) => [String(s.id), s.code]));
      return devices.map((d) => ({ device: toRecord(d), siteCode: codes.get(String(d.siteId)) }));
    },

    async site(siteId) {
      const site = await Site.findByPk(siteId);
      return site ? { id: String(site.id), code: site.code } : null;
    },

    async create(device, transaction) {
      return toRecord(await Device.create(device, { transaction }));
    },

    async setDisabled(id, disabled, transaction) {
      const device = await Device.findByPk(id, { transaction });
      if (!device) return null;
      const before = toRecord(device);
      await device.update({ disabled }, { transaction });
      return { before, after: toRecord(device) };
    },
  };
}
