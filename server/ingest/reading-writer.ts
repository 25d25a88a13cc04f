import type { Pool } from 'pg';
import type { ValidReading } from './validate-reading';

export const sourceCode = { mqtt: 0, csv: 1, backfill: 2 } as const;
export type ReadingSource = keyof typeof sourceCode;

/** First instant of the UTC month containing `ms`. */
const monthStart = (ms: number) => {
  const d = new Date(ms);
  return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1);
};

/**
 * Creates the monthly partition of `readings` holding `ms`, if missing. Rows that fell into the
 * default partition for that month (none, normally) move into the new one in the same transaction.
 * The app role may create no table: the owner's `ensure_readings_partition` (migration 0010) does it.
 */
export async function ensureReadingPartition(pool: Pool, ms: number): Promise<string> {
  const made = await pool.query<{ name: string }>('SELECT ensure_readings_partition($1) AS name', [
    new Date(monthStart(ms)).toISOString(),
  ]);
  return made.rows[0].name;
}

/** Where a batch of readings came from, beyond its path: the CSV import, when it is one. */
export interface ReadingOrigin {
  importId?: string;
}

/** What one write did: readings stored, duplicates left out, and of those the conflicts recorded. */
export interface WriteOutcome {
  inserted: number;
  duplicates: number;
  /** Duplicates whose value or quality differed from the stored reading (recorded in reading_conflicts). */
  conflicts: number;
}

/**
 * Writes readings in bulk: one statement per batch (unnest of arrays, not one insert per
 * reading). The (transmitter, time) key turns a redelivered or re-imported reading into a
 * duplicate. In the same statement, the hours the batch touches are queued for recomputation, so
 * a committed reading can never be left out of its hourly record.
 *
 * Each reading is stored with its provenance: the device that published it (`ValidReading.deviceId`),
 * the import it came with, and its arrival time (the statement's time). Only when a batch had
 * duplicates is more work done: the left-out readings are compared with the stored ones, and each
 * that differs in value or quality (exact equality of the stored double, in the transmitter's unit)
 * is recorded as a conflict. The first reading stays stored; an identical re-send stays a silent
 * duplicate, as a QoS 1 redelivery must.
 */
export class ReadingWriter {
  private knownMonths = new Set<number>();

  constructor(
    private readonly pool: Pool,
    private readonly hourStartOf: (timeMs: number, timeZone: string) => number,
  ) {}

  async write(readings: ValidReading[], source: ReadingSource, origin: ReadingOrigin = {}): Promise<WriteOutcome> {
    if (readings.length === 0) return { inserted: 0, duplicates: 0, conflicts: 0 };
    for (const r of readings) {
      const month = monthStart(r.timeMs);
      if (!this.knownMonths.has(month)) {
        await ensureReadingPartition(this.pool, month);
        this.knownMonths.add(month);
      }
    }
    const n = readings.length;
    const ids = new Array<string>(n);
    const times = new Array<number>(n);
    const values = new Array<number>(n);
    const qualities = new Array<number>(n);
    // Devices only when some reading has one: a NULL array unnests to NULLs, sent for free.
    let devices: (string | null)[] | null = null;
    const stale = new Map<string, [string, number]>();
    for (let i = 0; i < n; i++) {
      const r = readings[i];
      ids[i] = r.transmitterId;
      times[i] = r.timeMs / 1000;
      values[i] = r.value;
      qualities[i] = r.quality;
      if (r.deviceId !== undefined) (devices ??= new Array<string | null>(n).fill(null))[i] = r.deviceId;
      // A reading may stand for the next seconds up to the hold (or gap) limit, so it may feed the first
      // seconds of the next hour(s): every hour it reaches is queued, not only its own (a late reading
      // changes them all). An hour not yet begun is left out: its own readings will queue it.
      const lastFedMs = Math.max(r.timeMs, Math.min(Date.now(), r.timeMs + Math.max(0, (r.reachS ?? 0) * 1000 - 1)));
      for (let hour = this.hourStartOf(r.timeMs, r.timeZone); hour <= lastFedMs;) {
        stale.set(`${r.meterRunId}|${hour}`, [r.meterRunId, hour / 1000]);
        const next = this.hourStartOf(hour + 3_600_000, r.timeZone);
        hour = next > hour ? next : hour + 3_600_000;
      }
    }
    // Always lock stale-hour rows in one order, so two concurrent batches cannot deadlock.
    const staleRows = [...stale.values()].sort((a, b) => Number(a[0]) - Number(b[0]) || a[1] - b[1]);
    const staleRuns = staleRows.map((s) => s[0]);
    const staleHours = staleRows.map((s) => s[1]);
    const importId = origin.importId ?? null;
    const result = await this.pool.query<{ inserted: number; arrived_at: Date }>(
      `WITH ins AS (
         INSERT INTO readings (transmitter_id, time, value, quality, source, device_id, import_id)
         SELECT u.t, to_timestamp(u.s), u.v, u.q, $5::int2, u.d, $9::bigint
           FROM unnest($1::bigint[], $2::float8[], $3::float8[], $4::int2[], $8::bigint[]) AS u(t, s, v, q, d)
         ON CONFLICT DO NOTHING
         RETURNING 1),
       queued AS (
         INSERT INTO stale_hours (meter_run_id, start)
         SELECT r, to_timestamp(h) FROM unnest($6::bigint[], $7::float8[]) AS x(r, h)
         ON CONFLICT (meter_run_id, start) DO UPDATE SET queued_at = clock_timestamp())
       SELECT count(*)::int AS inserted, now() AS arrived_at FROM ins`,
      [ids, times, values, qualities, sourceCode[source], staleRuns, staleHours, devices, importId],
    );
    const { inserted, arrived_at: arrivedAt } = result.rows[0];
    const duplicates = n - inserted;
    if (duplicates === 0) return { inserted, duplicates, conflicts: 0 };
    const conflicts = await this.recordConflicts(
      { ids, times, values, qualities, devices },
      { source: sourceCode[source], importId, arrivedAt },
    );
    return { inserted, duplicates, conflicts };
  }

  /**
   * Compares a batch that had duplicates with what is stored and records each reading that
   * differs from the stored one at its key. A reading of this very batch that was stored compares
   * equal to itself; a second reading for the same key in the batch is compared with the first.
   * @returns the conflicts newly recorded (the same offer made again is recorded once)
   */
  private async recordConflicts(
    batch: {
      ids: string[];
      times: number[];
      values: number[];
      qualities: number[];
      devices: (string | null)[] | null;
    },
    offer: { source: number; importId: string | null; arrivedAt: Date },
  ): Promise<number> {
    const { rowCount } = await this.pool.query(
      `INSERT INTO reading_conflicts (transmitter_id, time, stored_value, stored_quality, stored_source,
         stored_device_id, stored_import_id, stored_arrived_at, offered_value, offered_quality, offered_source,
         offered_device_id, offered_import_id, offered_arrived_at)
       SELECT r.transmitter_id, r.time, r.value, r.quality, r.source, r.device_id, r.import_id, r.arrived_at,
              u.v, u.q, $6::int2, u.d, $7::bigint, $8::timestamptz
         FROM unnest($1::bigint[], $2::float8[], $3::float8[], $4::int2[], $5::bigint[]) AS u(t, s, v, q, d)
         JOIN readings r ON r.transmitter_id = u.t AND r.time = to_timestamp(u.s)
        WHERE r.value <> u.v OR r.quality <> u.q
       ON CONFLICT (transmitter_id, time, offered_value, offered_quality) DO NOTHING`,
      [
        batch.ids,
        batch.times,
        batch.values,
        batch.qualities,
        batch.devices,
        offer.source,
        offer.importId,
        offer.arrivedAt,
      ],
    );
    return rowCount ?? 0;
  }
}

/**
 * Gathers the readings of many concurrent publishes and commits them as one batch (group
 * commit): each publisher is answered only after its readings are committed, yet the database
 * sees a few large statements instead of one per message. Adaptive: a batch goes out at the next
 * turn of the event loop when the database is idle, and grows for as long as the previous
 * batches are still being written — low latency when quiet, big batches under load.
 */
export class GroupCommitter {
  private queue: {
    readings: ValidReading[];
    resolve: (r: WriteOutcome) => void;
    reject: (e: unknown) => void;
  }[] = [];
  private scheduled = false;
  private inFlight = 0;

  constructor(
    private readonly writer: ReadingWriter,
    private readonly options: { maxBatch: number; maxConcurrent: number } = { maxBatch: 20_000, maxConcurrent: 2 },
  ) {}

  submit(readings: ValidReading[]): Promise<WriteOutcome> {
    return new Promise((resolve, reject) => {
      this.queue.push({ readings, resolve, reject });
      if (!this.scheduled) {
        this.scheduled = true;
        setImmediate(() => {
          this.scheduled = false;
          this.flush();
        });
      }
    });
  }

  private flush() {
    while (this.queue.length && this.inFlight < this.options.maxConcurrent) {
      // Take whole messages up to maxBatch readings (a message is never split).
      let take = 0;
      let count = 0;
      while (
        take < this.queue.length &&
        (take === 0 || count + this.queue[take].readings.length <= this.options.maxBatch)
      ) {
        count += this.queue[take].readings.length;
        take++;
      }
      const batch = this.queue.splice(0, take);
      this.inFlight++;
      const all = batch.length === 1 ? batch[0].readings : batch.flatMap((b) => b.readings);
      this.writer
        .write(all, 'mqtt')
        .then(
          // Duplicates are known for the batch as a whole; each publisher learns its readings are stored.
          (res) =>
            batch.forEach((b) =>
              b.resolve(batch.length === 1 ? res : { inserted: b.readings.length, duplicates: 0, conflicts: 0 }),
            ),
          (err) => batch.forEach((b) => b.reject(err)),
        )
        .finally(() => {
          this.inFlight--;
          this.flush();
        });
    }
  }
}
