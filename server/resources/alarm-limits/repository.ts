import type { Pool } from 'pg';
import { loadStoredLimits, type StoredLimits } from '../../alarms/limits-store';
import type { AlarmCondition } from '../../../shared/alarms/alarm-codes';
import type { AlarmLimits } from '../../../shared/alarms/alarm-limits';

/** A meter run with the transmitters its limits can be set on. */
export interface LimitsMeterRun {
  id: string;
  tag: string;
  transmitters: { id: string; tag: string; measures: string }[];
}

/** The settings of one alarm point (a meter run's, or one transmitter's). */
export interface AlarmLimitSetting {
  meterRunId: string;
  transmitterId: string | null;
  condition: AlarmCondition;
  settings: Partial<AlarmLimits>;
}

interface AlarmLimitRow {
  meter_run_id: string;
  transmitter_id: string | null;
  condition: AlarmCondition;
  settings: Partial<AlarmLimits>;
}

export interface AlarmLimitsRepository {
  meterRun(meterRunId: string): Promise<LimitsMeterRun | null>;
  /** Every stored setting of a meter run (server/alarms/limits-store.ts). */
  storedLimits(meterRunId: string): Promise<StoredLimits[]>;
  /** Stores a point's settings over any it had. @returns the setting's id */
  save(setting: AlarmLimitSetting, userId: string): Promise<string>;
  /** @returns what was deleted, or null when there is no such setting */
  delete(id: string): Promise<AlarmLimitSetting | null>;
}

export function alarmLimitsRepository(pool: Pool): AlarmLimitsRepository {
  return {
    async meterRun(meterRunId) {
      const run = await pool.query<{ id: string; tag: string }>('SELECT id::text, tag FROM meter_runs WHERE id = $1', [
        meterRunId,
      ]);
      if (!run.rows[0]) return null;
      const transmitters = await pool.query<LimitsMeterRun['transmitters'][number]>(
        'SELECT id::text, tag, measures FROM transmitters WHERE meter_run_id = $1 ORDER BY transmitters.id',
        [meterRunId],
      );
      return { ...run.rows[0], transmitters: transmitters.rows };
    },

    storedLimits: (meterRunId) => loadStoredLimits(pool, meterRunId),

    async save(setting, userId) {
      const { rows } = await pool.query<{ id: string }>(
        `INSERT INTO alarm_limits (meter_run_id, transmitter_id, condition, settings, updated_by) VALUES ($1, $2, $3, $4, $5)
         ON CONFLICT (meter_run_id, coalesce(transmitter_id, 0), condition)
           DO UPDATE SET settings = EXCLUDED.settings, updated_by = EXCLUDED.updated_by, updated_at = now()
         RETURNING id::text`,
        [setting.meterRunId, setting.transmitterId, setting.condition, JSON.stringify(setting.settings), userId],
      );
      return rows[0].id;
    },

    async delete(id) {
      const { rows } = await pool.query<AlarmLimitRow>(
        'DELETE FROM alarm_limits WHERE id = $1 RETURNING meter_run_id::text, transmitter_id::text, condition, settings',
        [id],
      );
      const r = rows[0];
      if (!r) return null;
      return {
        meterRunId: r.meter_run_id,
        transmitterId: r.transmitter_id,
        condition: r.condition,
        settings: r.settings,
      };
    },
  };
}
