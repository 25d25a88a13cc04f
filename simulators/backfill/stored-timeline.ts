/**
 * The scenario's timeline as the database knows it: the demo month is the month of KFG-101's
 * first configuration version (written by the seed), so the simulators keep to the month the
 * seed chose even when they run in a later month. Without it, the month before now.
 */
import type { Pool } from 'pg';
import { KFG_SITE, demoMonthAt, monthOf, scenarioTimeline, type ScenarioTimeline } from '../scenario';

/** The meter run whose configuration dates the scenario (its element change is the month's landmark). */
const ANCHOR_METER_RUN_TAG = 'KFG-101';

/**
 * @param pool database pool, or null (live-only without a database)
 * @param nowMs the present, epoch ms
 * @returns the timeline and where its month came from
 */
export async function storedScenarioTimeline(
  pool: Pool | null,
  nowMs: number,
): Promise<{ timeline: ScenarioTimeline; from: 'database' | 'clock' }> {
  if (pool) {
    const { rows } = await pool.query(
      `SELECT extract(epoch FROM min(c.effective_from)) * 1000 AS first
         FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id WHERE m.tag = $1`,
      [ANCHOR_METER_RUN_TAG],
    );
    if (rows[0]?.first !== null && rows[0]?.first !== undefined) {
      return { timeline: scenarioTimeline(monthOf(Number(rows[0].first), KFG_SITE.timeZone)), from: 'database' };
    }
  }
  return { timeline: scenarioTimeline(demoMonthAt(nowMs, KFG_SITE.timeZone)), from: 'clock' };
}
