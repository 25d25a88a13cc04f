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
      await client.query(`ALTER TABLE readings ATTACH PARTITION ${name} FOR VALUES FROM ('${fromIso}') TO ('${toIso}')`);
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
    const staleRuns = [...stale.values()].map((s) => s[0]);
    const staleHours = [...stale.values()].map((s) => s[1]);
    const result = await this.pool.query(
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
    const inserted = result.rows[0].inserted as number;
    return { inserted, duplicates: n - inserted };
  }
}

/**
 * Gathers the readings of many concurrent publishes for a few milliseconds and commits them as
 * one batch (group commit): each publisher is answered only after its readings are committed,
 * yet the database sees a few large statements instead of one per message.
 */
export class GroupCommitter {
  private queue: { readings: ValidReading[]; resolve: (r: { inserted: number; duplicates: number }) => void; reject: (e: unknown) => void }[] = [];
  private queued = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private inFlight = 0;

  constructor(
    private readonly writer: ReadingWriter,
    private readonly options: { maxBatch: number; maxWaitMs: number; maxConcurrent: number } = { maxBatch: 5000, maxWaitMs: 4, maxConcurrent: 4 },
  ) {}

  submit(readings: ValidReading[]): Promise<{ inserted: number; duplicates: number }> {
    return new Promise((resolve, reject) => {
      this.queue.push({ readings, resolve, reject });
      this.queued += readings.length;
      if (this.queued >= this.options.maxBatch) this.flush();
      else if (!this.timer) this.timer = setTimeout(() => this.flush(), this.options.maxWaitMs);
    });
  }

  private flush() {
    if (this.timer) {
      clearTimeout(this.timer);
      this.timer = null;
    }
    if (this.queue.length === 0) return;
    if (this.inFlight >= this.options.maxConcurrent) {
      this.timer = setTimeout(() => this.flush(), this.options.maxWaitMs);
      return;
    }
    const batch = this.queue;
    this.queue = [];
    this.queued = 0;
    this.inFlight++;
    const all = batch.flatMap((b) => b.readings);
    this.writer
      .write(all, 'mqtt')
      .then(
        // Duplicates are counted for the batch as a whole; per message it is enough to know it is stored.
        (res) => batch.forEach((b) => b.resolve({ inserted: b.readings.length, duplicates: 0, ...(batch.length === 1 ? res : {}) })),
        (err) => batch.forEach((b) => b.reject(err)),
      )
      .finally(() => {
        this.inFlight--;
        if (this.queue.length) this.flush();
      });
  }
}
