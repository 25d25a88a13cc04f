import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
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

/** One logged refusal of a device's message or reading. */
export interface RejectionRecord {
  at: Date;
  topic: string;
  kind: string;
  reason: string;
  readingIndex: number | null;
}

/** How many refusals of one kind a device has had since `since`. */
export interface RejectionCount {
  kind: string;
  count: number;
  since: Date;
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
  exists(id: string): Promise<boolean>;
  /** The device's refusal log, newest first (at most the log's bound), and its counts by kind. */
  rejections(id: string): Promise<{ latest: RejectionRecord[]; counts: RejectionCount[] }>;
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

    async exists(id) {
      return (await Device.count({ where: { id } })) > 0;
    },

    async rejections(id) {
      const [latest, counts] = await Promise.all([
        sequelize.query<{ at: Date; topic: string; kind: string; reason: string; readingIndex: number | null }>(
          `SELECT at, topic, reason_kind AS kind, reason, reading_index AS "readingIndex"
             FROM device_rejections WHERE device_id = :id ORDER BY id DESC`,
          { type: QueryTypes.SELECT, replacements: { id } },
        ),
        // count is a bigint, which pg hands over as text: cast in SQL (counts stay far below 2^53).
        sequelize.query<RejectionCount>(
          `SELECT reason_kind AS kind, count::float8 AS count, since
             FROM device_rejection_counts WHERE device_id = :id ORDER BY count DESC, reason_kind`,
          { type: QueryTypes.SELECT, replacements: { id } },
        ),
      ]);
      return { latest, counts };
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
