/**
 * Alarm limits as stored: a meter run's settings and its transmitters', laid over the defaults
 * (shared/alarms/alarm-limits.ts effectiveAlarmLimits).
 */
import type { Pool, PoolClient } from 'pg';
import type { AlarmCondition } from '../../shared/alarms/alarm-codes';
import { effectiveAlarmLimits, type AlarmLimits } from '../../shared/alarms/alarm-limits';

export interface StoredLimits {
  id: string;
  meterRunId: string;
  transmitterId: string | null;
  condition: AlarmCondition;
  settings: Partial<AlarmLimits>;
  updatedAt: string;
}

interface StoredLimitsRow {
  id: string;
  meter_run_id: string;
  transmitter_id: string | null;
  condition: AlarmCondition;
  settings: Partial<AlarmLimits>;
  updated_at: Date;
}

/** @returns the stored settings of a meter run (all levels) */
export async function loadStoredLimits(db: Pool | PoolClient, meterRunId: string): Promise<StoredLimits[]> {
  const { rows } = await db.query<StoredLimitsRow>(
    `SELECT id::text, meter_run_id::text, transmitter_id::text, condition, settings, updated_at FROM alarm_limits WHERE meter_run_id = $1 ORDER BY condition, alarm_limits.transmitter_id NULLS FIRST`,
    [meterRunId],
  );
  return rows.map((r) => ({
    id: r.id,
    meterRunId: r.meter_run_id,
    transmitterId: r.transmitter_id,
    condition: r.condition,
    settings: r.settings,
    updatedAt: r.updated_at.toISOString(),
  }));
}

/**
 * @param stored the meter run's stored settings
 * @returns the limits in force for a condition at a transmitter (or the meter run: null)
 */
export function limitsResolver(
  stored: StoredLimits[],
): (condition: AlarmCondition, transmitterId: string | null) => AlarmLimits {
  const byKey = new Map(stored.map((s) => [`${s.condition}|${s.transmitterId ?? ''}`, s.settings]));
  return (condition, transmitterId) =>
    effectiveAlarmLimits(
      condition,
      byKey.get(`${condition}|`),
      transmitterId ? byKey.get(`${condition}|${transmitterId}`) : undefined,
    );
}
