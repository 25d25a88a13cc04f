import type { Pool } from 'pg';
import type { AlarmCondition } from '../../../shared/alarms/alarm-codes';

/** An alarm point: the meter run, transmitter (or the run as a whole) and condition. */
export interface AlarmPointRecord {
  pointKey: string;
  meterRunId: string;
  meterRunTag: string;
  transmitterId: string | null;
  transmitterTag: string | null;
  condition: AlarmCondition;
}

export interface AnnunciationRecord {
  pointKey: string;
  at: Date;
}

export interface OccurrenceRecord {
  id: string;
  pointKey: string;
  raisedAt: Date;
  clearedAt: Date | null;
}

export interface AlarmPerformanceRepository {
  /** The site's zone, or null when there is no such site. */
  siteTimeZone(siteId: string): Promise<string | null>;
  /** Every raise and return-to-alarm logged for the site's meter runs in [from, to). */
  annunciations(siteId: string, from: Date, to: Date): Promise<AnnunciationRecord[]>;
  /** Alarm occurrences of the site raised before `to` and not cleared before `from`. */
  occurrences(siteId: string, from: Date, to: Date): Promise<OccurrenceRecord[]>;
  /** The site's alarm points among those keys, with their tags. */
  points(siteId: string, pointKeys: string[]): Promise<AlarmPointRecord[]>;
}

/** meter run | transmitter ('' for the run as a whole) | condition */
const POINT_KEY = `a.meter_run_id::text || '|' || coalesce(a.transmitter_id::text, '') || '|' || a.condition`;

export function alarmPerformanceRepository(pool: Pool): AlarmPerformanceRepository {
  return {
    async siteTimeZone(siteId) {
      const { rows } = await pool.query<{ time_zone: string }>('SELECT time_zone FROM sites WHERE id = $1', [siteId]);
      return rows[0]?.time_zone ?? null;
    },

    async annunciations(siteId, from, to) {
      const { rows } = await pool.query<{ point_key: string; at: Date }>(
        `SELECT ${POINT_KEY} AS point_key, e.occurred_at AS at
           FROM alarm_events e JOIN alarms a ON a.id = e.alarm_id JOIN meter_runs m ON m.id = a.meter_run_id
          WHERE m.site_id = $1 AND e.action IN ('raised', 'returned-to-alarm')
            AND e.occurred_at >= $2 AND e.occurred_at < $3
          ORDER BY e.occurred_at, e.id`,
        [siteId, from, to],
      );
      return rows.map((r) => ({ pointKey: r.point_key, at: r.at }));
    },

    async occurrences(siteId, from, to) {
      const { rows } = await pool.query<{ id: string; point_key: string; raised_at: Date; cleared_at: Date | null }>(
        `SELECT a.id::text, ${POINT_KEY} AS point_key, a.raised_at, a.cleared_at
           FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id
          WHERE m.site_id = $1 AND a.raised_at < $3 AND coalesce(a.cleared_at, 'infinity') >= $2
          ORDER BY a.raised_at, a.id`,
        [siteId, from, to],
      );
      return rows.map((r) => ({ id: r.id, pointKey: r.point_key, raisedAt: r.raised_at, clearedAt: r.cleared_at }));
    },

    async points(siteId, pointKeys) {
      if (!pointKeys.length) return [];
      const { rows } = await pool.query<{
        point_key: string;
        meter_run_id: string;
        meter_run_tag: string;
        transmitter_id: string | null;
        transmitter_tag: string | null;
        condition: AlarmCondition;
      }>(
        `SELECT DISTINCT ${POINT_KEY} AS point_key, a.meter_run_id::text, m.tag AS meter_run_tag,
                a.transmitter_id::text, t.tag AS transmitter_tag, a.condition
           FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id LEFT JOIN transmitters t ON t.id = a.transmitter_id
          WHERE m.site_id = $1 AND ${POINT_KEY} = ANY($2::text[])`,
        [siteId, pointKeys],
      );
      return rows.map((r) => ({
        pointKey: r.point_key,
        meterRunId: r.meter_run_id,
        meterRunTag: r.meter_run_tag,
        transmitterId: r.transmitter_id,
        transmitterTag: r.transmitter_tag,
        condition: r.condition,
      }));
    },
  };
}
