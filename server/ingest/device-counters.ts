import type { Pool } from 'pg';

/**
 * Per-device counts of accepted and rejected readings, kept in memory and added to the devices
 * table every few seconds (a write per message would cost more than the reading itself).
 */
export class DeviceCounters {
  private pending = new Map<
    string,
    { accepted: number; rejected: number; lastRejection: string | null; seenMs: number }
  >();
  private timer: ReturnType<typeof setInterval>;

  constructor(
    private readonly pool: Pool,
    intervalMs = 2000,
  ) {
    this.timer = setInterval(() => void this.flush().catch(() => undefined), intervalMs);
    (this.timer as unknown as { unref?: () => void }).unref?.();
  }

  count(deviceId: string, accepted: number, rejected: number, rejection?: string) {
    const entry = this.pending.get(deviceId) ?? { accepted: 0, rejected: 0, lastRejection: null, seenMs: 0 };
    entry.accepted += accepted;
    entry.rejected += rejected;
    if (rejection) entry.lastRejection = rejection.slice(0, 500);
    entry.seenMs = Date.now();
    this.pending.set(deviceId, entry);
  }

  async flush() {
    if (this.pending.size === 0) return;
    const batch = [...this.pending.entries()];
    this.pending.clear();
    for (const [id, e] of batch) {
      await this.pool.query(
        `UPDATE devices SET accepted_count = accepted_count + $2, rejected_count = rejected_count + $3,
                last_rejection = COALESCE($4, last_rejection), last_seen_at = to_timestamp($5 / 1000.0) WHERE id = $1`,
        [id, e.accepted, e.rejected, e.lastRejection, e.seenMs],
      );
    }
  }

  async close() {
    clearInterval(this.timer);
    await this.flush();
  }
}
