import type { Pool } from 'pg';
import type { ValidReading } from './validate-reading';

export const sourceCode = { mqtt: 0, csv: 1, backfill: 2 } as const;
export type ReadingSource = keyof typeof sourceCode;

/** First instant of the UTC month containing `ms`. */
const monthStart = (ms: number) => {
  const d = new Date(ms);
  return Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1);
};
const nextMonth = (ms: number) => {
  const d = new Date(ms);
  return Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1);
};

/**
 * Creates the monthly partition of `readings` holding `ms`, if missing. Rows that fell into the
 * default partition for that month (none, normally) move into the new one in the same transaction.
 */
export async function ensureReadingPartition(pool: Pool, ms: number) {
  const from = monthStart(ms);
  const to = nextMonth(ms);
  const d = new Date(from);
  const name = `readings_y${d.getUTCFullYear()}m${String(d.getUTCMonth() + 1).padStart(2, '0')}`;
  const client = await pool.connect();
  try {
    const exists = await client.query('SELECT 1 FROM pg_class WHERE relname = $1', [name]);
    if (exists.rowCount) return name;
    await client.query('BEGIN');
    await client.query("SELECT pg_advisory_xact_lock(hashtext('readings-partitions'))");
    const again = await client.query('SELECT 1 FROM pg_class WHERE relname = $1', [name]);
    if (!again.rowCount) {
      const fromIso = new Date(from).toISOString();
      const toIso = new Date(to).toISOString();
      await client.query(`CREATE TABLE ${name} (LIKE readings INCLUDING DEFAULTS INCLUDING CONSTRAINTS)`);
      await client.query(
        `WITH moved AS (DELETE FROM readings_default WHERE time >= $1 AND time < $2 RETURNING *) INSERT INTO ${name} SELECT * FROM moved`,
        [fromIso, toIso],
      );
      await client.query(
        `ALTER TABLE readings ATTACH PARTITION ${name} FOR VALUES FROM ('${fromIso}') TO ('${toIso}')`,
      );
    }
    await client.query('COMMIT');
    return name;
  } catch (err) {
    await client.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    client.release();
  }
}

/**
 * Writes readings in bulk: one statement per batch (unnest of arrays, not one insert per
 * reading). The (transmitter, time) key turns a redelivered or re-imported reading into a
 * duplicate. In the same statement, the hours the batch touches are queued for recomputation, so
 * a committed reading can never be left out of its hourly record.
 */
export class ReadingWriter {
  private knownMonths = new Set<number>();

  constructor(
    private readonly pool: Pool,
    private readonly hourStartOf: (timeMs: number, timeZone: string) => number,
  ) {}

  async write(readings: ValidReading[], source: ReadingSource): Promise<{ inserted: number; duplicates: number }> {
    if (readings.length === 0) return { inserted: 0, duplicates: 0 };
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
    const stale = new Map<string, [string, number]>();
    for (let i = 0; i < n; i++) {
      const r = readings[i];
      ids[i] = r.transmitterId;
      times[i] = r.timeMs / 1000;
      values[i] = r.value;
      qualities[i] = r.quality;
      const hour = this.hourStartOf(r.timeMs, r.timeZone);
      stale.set(`${r.meterRunId}|${hour}`, [r.meterRunId, hour / 1000]);
    }
    // Always lock stale-hour rows in one order, so two concurrent batches cannot deadlock.
    const staleRows = [...stale.values()].sort((a, b) => Number(a[0]) - Number(b[0]) || a[1] - b[1]);
    const staleRuns = staleRows.map((s) => s[0]);
    const staleHours = staleRows.map((s) => s[1]);
    const result = await this.pool.query<{ inserted: number }>(
      `WITH ins AS (
         INSERT INTO readings (transmitter_id, time, value, quality, source)
         SELECT u.t, to_timestamp(u.s), u.v, u.q, $5::int2
           FROM unnest($1::bigint[], $2::float8[], $3::float8[], $4::int2[]) AS u(t, s, v, q)
         ON CONFLICT DO NOTHING
         RETURNING 1),
       queued AS (
         INSERT INTO stale_hours (meter_run_id, start)
         SELECT r, to_timestamp(h) FROM unnest($6::bigint[], $7::float8[]) AS x(r, h)
         ON CONFLICT (meter_run_id, start) DO UPDATE SET queued_at = clock_timestamp())
       SELECT count(*)::int AS inserted FROM ins`,
      [ids, times, values, qualities, sourceCode[source], staleRuns, staleHours],
    );
    const inserted = result.rows[0].inserted;
    return { inserted, duplicates: n - inserted };
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
    resolve: (r: { inserted: number; duplicates: number }) => void;
    reject: (e: unknown) => void;
  }[] = [];
  private scheduled = false;
  private inFlight = 0;

  constructor(
    private readonly writer: ReadingWriter,
    private readonly options: { maxBatch: number; maxConcurrent: number } = { maxBatch: 20_000, maxConcurrent: 2 },
  ) {}

  submit(readings: ValidReading[]): Promise<{ inserted: number; duplicates: number }> {
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
            batch.forEach((b) => b.resolve(batch.length === 1 ? res : { inserted: b.readings.length, duplicates: 0 })),
          (err) => batch.forEach((b) => b.reject(err)),
        )
        .finally(() => {
          this.inFlight--;
          this.flush();
        });
    }
  }
}
