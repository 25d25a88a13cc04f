import type { Pool } from 'pg';
import { componentLogger } from '../log';

const log = componentLogger('ingest');

/** How many refusals a device's log keeps (the latest ones); older ones are pruned as new ones come. */
export const rejectionLogSize = 100;

/** One refused message or reading, as the ingest path saw it. */
export interface Rejection {
  atMs: number;
  topic: string;
  /** A short key to count by: `topic`, `other-site`, `unknown-transmitter`, `payload`, or the reading's field. */
  kind: string;
  reason: string;
  /** The reading's place in the message (0 = first), or null when the whole message was refused. */
  readingIndex: number | null;
}

interface Pending {
  accepted: number;
  rejected: number;
  /** The latest refusals, at most rejectionLogSize of them. */
  log: Rejection[];
  countsByKind: Map<string, number>;
  seenMs: number;
}

/**
 * Per-device counts of accepted and rejected readings, and the log of refusals, kept in memory
 * and written to the database every few seconds (a write per message would cost more than the
 * reading itself). Each flush is one statement per device: counters, new log rows, counts by
 * kind, and the pruning of the log to its bound.
 */
export class DeviceCounters {
  private pending = new Map<string, Pending>();
  private timer: ReturnType<typeof setInterval>;

  constructor(
    private readonly pool: Pool,
    intervalMs = 2000,
  ) {
    this.timer = setInterval(() => void this.flush().catch(() => undefined), intervalMs);
    (this.timer as unknown as { unref?: () => void }).unref?.();
  }

  count(deviceId: string, accepted: number, rejections: Rejection[] = [], rejectedCount = rejections.length) {
    const entry = this.pending.get(deviceId) ?? {
      accepted: 0,
      rejected: 0,
      log: [],
      countsByKind: new Map<string, number>(),
      seenMs: 0,
    };
    entry.accepted += accepted;
    entry.rejected += rejectedCount;
    for (const r of rejections) {
      entry.countsByKind.set(r.kind, (entry.countsByKind.get(r.kind) ?? 0) + 1);
      entry.log.push({ ...r, topic: r.topic.slice(0, 500), reason: r.reason.slice(0, 500) });
    }
    if (entry.log.length > rejectionLogSize) entry.log.splice(0, entry.log.length - rejectionLogSize);
    entry.seenMs = Date.now();
    this.pending.set(deviceId, entry);
  }

  async flush() {
    if (this.pending.size === 0) return;
    const batch = [...this.pending.entries()];
    this.pending.clear();
    for (const [index, [id, e]] of batch.entries()) {
      try {
        await this.write(id, e);
      } catch (err) {
        // The database is away (or refused one device's write): put this and the unwritten
        // devices back, merged with what arrived meanwhile, for the next flush. Counts are not
        // lost across an outage; the log keeps its bound.
        for (const [laterId, later] of batch.slice(index)) this.putBack(laterId, later);
        throw err;
      }
    }
  }

  /** Merges counts that could not be written into what has arrived since. */
  private putBack(deviceId: string, e: Pending) {
    const now = this.pending.get(deviceId);
    if (!now) {
      this.pending.set(deviceId, e);
      return;
    }
    now.accepted += e.accepted;
    now.rejected += e.rejected;
    for (const [kind, n] of e.countsByKind) now.countsByKind.set(kind, (now.countsByKind.get(kind) ?? 0) + n);
    now.log = [...e.log, ...now.log].slice(-rejectionLogSize);
    now.seenMs = Math.max(now.seenMs, e.seenMs);
  }

  private async write(id: string, e: Pending) {
    const latest = e.log.at(-1);
    // Data-modifying CTEs all see the table as it was before the statement: the prune keeps the
    // newest (bound − new rows) of the old ones, so old plus new is at most the bound.
    await this.pool.query(
      `WITH new_rows AS (
           SELECT * FROM jsonb_to_recordset($6::jsonb)
             AS r("atMs" double precision, topic text, kind text, reason text, "readingIndex" integer)
         ), counted AS (
           UPDATE devices SET accepted_count = accepted_count + $2, rejected_count = rejected_count + $3,
                  last_rejection = COALESCE($4, last_rejection), last_seen_at = to_timestamp($5 / 1000.0)
            WHERE id = $1
         ), logged AS (
           INSERT INTO device_rejections (device_id, at, topic, reason_kind, reason, reading_index)
           SELECT $1, to_timestamp("atMs" / 1000.0), topic, kind, reason, "readingIndex" FROM new_rows
         ), by_kind AS (
           INSERT INTO device_rejection_counts (device_id, reason_kind, count)
           SELECT $1, key, value::bigint FROM jsonb_each_text($7::jsonb)
           ON CONFLICT (device_id, reason_kind)
           DO UPDATE SET count = device_rejection_counts.count + EXCLUDED.count
         )
         DELETE FROM device_rejections
          WHERE device_id = $1
            AND id NOT IN (SELECT id FROM device_rejections WHERE device_id = $1 ORDER BY id DESC
                            LIMIT greatest(0, $8::integer - (SELECT count(*) FROM new_rows)))`,
      [
        id,
        e.accepted,
        e.rejected,
        latest ? `${latest.topic}: ${latest.reason}`.slice(0, 500) : null,
        e.seenMs,
        JSON.stringify(e.log),
        JSON.stringify(Object.fromEntries(e.countsByKind)),
        rejectionLogSize,
      ],
    );
  }

  /** Stops the timer and writes what is pending; a database that is away loses only these counts, logged. */
  async close() {
    clearInterval(this.timer);
    await this.flush().catch((err: unknown) => log.warn({ err }, 'device counters not written at close'));
  }
}
