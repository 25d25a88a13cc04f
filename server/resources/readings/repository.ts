import type { Pool } from 'pg';

/** The names of the codes stored in readings.quality and readings.source (see the migration). */
const qualityNames = ['good', 'uncertain', 'bad', 'substituted'] as const;
const sourceNames = ['mqtt', 'csv', 'backfill'] as const;

/** One stored reading, in the transmitter's own unit. */
export interface StoredReading {
  timeMs: number;
  value: number;
  quality: (typeof qualityNames)[number];
  source: (typeof sourceNames)[number];
  /** The device that published it (MQTT), or null. */
  deviceId: string | null;
  /** The CSV import it came with, or null. */
  importId: string | null;
  /** When the server received it; null for readings stored before arrival times were kept. */
  arrivedAtMs: number | null;
}

interface ReadingRow {
  time: Date;
  value: number;
  quality: number;
  source: number;
  device_id: string | null;
  import_id: string | null;
  arrived_at: Date | null;
}

/** What the readings resource reads. */
export interface ReadingRepository {
  transmitterExists(transmitterId: string): Promise<boolean>;
  /**
   * A transmitter's readings in [from, to), oldest first, at most `limit`.
   * @param window ISO 8601 instants; a bound left out is open
   */
  readings(transmitterId: string, window: { from?: string; to?: string }, limit: number): Promise<StoredReading[]>;
}

export function readingRepository(pool: Pool): ReadingRepository {
  return {
    async transmitterExists(transmitterId) {
      const { rowCount } = await pool.query('SELECT 1 FROM transmitters WHERE id = $1', [transmitterId]);
      return Boolean(rowCount);
    },

    async readings(transmitterId, window, limit) {
      const { rows } = await pool.query<ReadingRow>(
        `SELECT time, value, quality, source, device_id::text, import_id::text, arrived_at FROM readings
          WHERE transmitter_id = $1 AND time >= $2 AND time < $3 ORDER BY time LIMIT $4`,
        [transmitterId, window.from ?? '-infinity', window.to ?? 'infinity', limit],
      );
      return rows.map((r) => ({
        timeMs: r.time.getTime(),
        value: r.value,
        quality: qualityNames[r.quality],
        source: sourceNames[r.source],
        deviceId: r.device_id,
        importId: r.import_id,
        arrivedAtMs: r.arrived_at ? r.arrived_at.getTime() : null,
      }));
    },
  };
}
