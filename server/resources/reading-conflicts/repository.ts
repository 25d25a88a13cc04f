import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { ConflictStatus } from './schema';

/** The names of the codes stored in readings.quality and readings.source (see migration 0002). */
const qualityNames = ['good', 'uncertain', 'bad', 'substituted'] as const;
const sourceNames = ['mqtt', 'csv', 'backfill'] as const;
export type QualityName = (typeof qualityNames)[number];

/** Where a reading came from: its device or its import when known, else its path. */
export interface ReadingOrigin {
  path: (typeof sourceNames)[number];
  deviceId: string | null;
  importId: string | null;
}

/** A re-sent reading that differed from the stored one, with its resolution if it has one. */
export interface ReadingConflict {
  id: string;
  meterRunId: string;
  transmitterId: string;
  transmitterTag: string;
  /** The transmitter's own unit, the unit of both values. */
  unit: string;
  timeMs: number;
  storedValue: number;
  storedQuality: QualityName;
  storedOrigin: ReadingOrigin;
  storedArrivedAtMs: number | null;
  offeredValue: number;
  offeredQuality: QualityName;
  offeredOrigin: ReadingOrigin;
  offeredArrivedAtMs: number;
  status: ConflictStatus;
  resolution: {
    note: string;
    correctionId: string | null;
    resolvedBy: string;
    resolvedAtMs: number;
  } | null;
}

/** bigint columns are selected as text; times come as Date. */
interface ConflictRow {
  id: string;
  meter_run_id: string;
  transmitter_id: string;
  transmitter_tag: string;
  unit: string;
  time: Date;
  stored_value: number;
  stored_quality: number;
  stored_source: number;
  stored_device_id: string | null;
  stored_import_id: string | null;
  stored_arrived_at: Date | null;
  offered_value: number;
  offered_quality: number;
  offered_source: number;
  offered_device_id: string | null;
  offered_import_id: string | null;
  offered_arrived_at: Date;
  resolution: string | null;
  correction_id: string | null;
  resolved_by: string | null;
  resolved_at: Date | null;
}

const selectConflicts = `
  SELECT c.id::text, t.meter_run_id::text, c.transmitter_id::text, t.tag AS transmitter_tag, t.unit, c.time,
         c.stored_value, c.stored_quality, c.stored_source, c.stored_device_id::text, c.stored_import_id::text,
         c.stored_arrived_at, c.offered_value, c.offered_quality, c.offered_source, c.offered_device_id::text,
         c.offered_import_id::text, c.offered_arrived_at,
         r.resolution, r.correction_id::text, u.email AS resolved_by, r.resolved_at
    FROM reading_conflicts c
    JOIN transmitters t ON t.id = c.transmitter_id
    LEFT JOIN reading_conflict_resolutions r ON r.conflict_id = c.id
    LEFT JOIN users u ON u.id = r.resolved_by`;

const conflictOf = (r: ConflictRow): ReadingConflict => ({
  id: r.id,
  meterRunId: r.meter_run_id,
  transmitterId: r.transmitter_id,
  transmitterTag: r.transmitter_tag,
  unit: r.unit,
  timeMs: r.time.getTime(),
  storedValue: r.stored_value,
  storedQuality: qualityNames[r.stored_quality],
  storedOrigin: { path: sourceNames[r.stored_source], deviceId: r.stored_device_id, importId: r.stored_import_id },
  storedArrivedAtMs: r.stored_arrived_at ? r.stored_arrived_at.getTime() : null,
  offeredValue: r.offered_value,
  offeredQuality: qualityNames[r.offered_quality],
  offeredOrigin: { path: sourceNames[r.offered_source], deviceId: r.offered_device_id, importId: r.offered_import_id },
  offeredArrivedAtMs: r.offered_arrived_at.getTime(),
  status: r.resolved_at ? 'resolved' : 'open',
  resolution:
    r.resolved_at && r.resolution !== null && r.resolved_by !== null
      ? {
          note: r.resolution,
          correctionId: r.correction_id,
          resolvedBy: r.resolved_by,
          resolvedAtMs: r.resolved_at.getTime(),
        }
      : null,
});

/** What the reading-conflicts resource reads and writes. */
export interface ReadingConflictRepository {
  /** Conflicts of one meter run or all, of one status or both, newest reading time first, at most 1000. */
  list(filter: { meterRunId?: string; status?: ConflictStatus }): Promise<ReadingConflict[]>;
  meterRunExists(meterRunId: string): Promise<boolean>;
  /** One conflict, its row locked until the transaction ends (so it is resolved once). */
  findForUpdate(conflictId: string, transaction: Transaction): Promise<ReadingConflict | null>;
  /** Records the resolution of an open conflict. */
  resolve(
    resolution: { conflictId: string; note: string; correctionId: string | null; resolvedBy: string },
    transaction: Transaction,
  ): Promise<void>;
  findById(conflictId: string, transaction?: Transaction): Promise<ReadingConflict | null>;
}

export function readingConflictRepository(sequelize: Sequelize): ReadingConflictRepository {
  const findById = async (conflictId: string, transaction?: Transaction) => {
    const rows = await sequelize.query<ConflictRow>(`${selectConflicts} WHERE c.id = :conflictId`, {
      type: QueryTypes.SELECT,
      replacements: { conflictId },
      transaction,
    });
    return rows[0] ? conflictOf(rows[0]) : null;
  };
  return {
    async list(filter) {
      const rows = await sequelize.query<ConflictRow>(
        `${selectConflicts}
          WHERE (CAST(:meterRunId AS bigint) IS NULL OR t.meter_run_id = CAST(:meterRunId AS bigint))
            AND (CAST(:status AS text) IS NULL OR (CAST(:status AS text) = 'open') = (r.conflict_id IS NULL))
          ORDER BY c.time DESC, c.id DESC LIMIT 1000`,
        {
          type: QueryTypes.SELECT,
          replacements: { meterRunId: filter.meterRunId ?? null, status: filter.status ?? null },
        },
      );
      return rows.map(conflictOf);
    },

    async meterRunExists(meterRunId) {
      const rows = await sequelize.query<{ found: number }>(
        'SELECT 1 AS found FROM meter_runs WHERE id = :meterRunId',
        {
          type: QueryTypes.SELECT,
          replacements: { meterRunId },
        },
      );
      return rows.length > 0;
    },

    async findForUpdate(conflictId, transaction) {
      // An advisory lock, not FOR UPDATE: the app role holds no UPDATE privilege on this append-only table.
      await sequelize.query("SELECT pg_advisory_xact_lock(hashtextextended('reading-conflict', :conflictId))", {
        type: QueryTypes.SELECT,
        replacements: { conflictId },
        transaction,
      });
      return findById(conflictId, transaction);
    },

    async resolve(resolution, transaction) {
      await sequelize.query(
        `INSERT INTO reading_conflict_resolutions (conflict_id, resolution, correction_id, resolved_by)
         VALUES (:conflictId, :note, :correctionId, :resolvedBy)`,
        { type: QueryTypes.INSERT, replacements: resolution, transaction },
      );
    },

    findById,
  };
}
