import type { Pool, PoolClient } from 'pg';
import type { AlarmCondition } from '../../../shared/alarms/alarm-codes';
import { loadStoredLimits, type StoredLimits } from '../../alarms/limits-store';

type Db = Pool | PoolClient;

import type { CareSubject } from '../../../shared/alarms/care-duties';

export interface CareSite {
  id: string;
  name: string;
  timeZone: string;
}

/** A meter run as the list reads it: the element in force now and its latest care records. */
export interface CareMeterRun extends CareSubject {
  id: string;
  tag: string;
  name: string;
  siteId: string;
  timeZone: string;
}

/** A transmitter with its latest calibration in force (or its own calibration_due when none is recorded). */
export interface CareTransmitter {
  id: string;
  tag: string;
  meterRunId: string;
  lastDoneOn: string | null;
  dueOn: string | null;
}

/** An alarm about a due date that is not back to normal. */
export interface OpenDueAlarm {
  id: string;
  meterRunId: string;
  transmitterId: string | null;
  condition: AlarmCondition;
}

interface MeterRunRow {
  id: string;
  tag: string;
  name: string;
  site_id: string;
  time_zone: string;
  element_kind: string | null;
  element_has_curve: boolean | null;
  calibration_on: string | null;
  calibration_due: string | null;
  analysis_on: string | null;
  analysis_due: string | null;
  inspection_on: string | null;
  inspection_due: string | null;
}

interface TransmitterRow {
  id: string;
  tag: string;
  meter_run_id: string;
  last_done_on: string | null;
  due_on: string | null;
}

interface AlarmRow {
  id: string;
  meter_run_id: string;
  transmitter_id: string | null;
  condition: AlarmCondition;
}

/** The latest record of a care table per meter run (by its own date, then the later record), dates in the site's zone. */
const latestOf = (table: string, at: string, alias: string) => `
  LEFT JOIN LATERAL (
    SELECT to_char(r.${at} AT TIME ZONE s.time_zone, 'YYYY-MM-DD') AS done_on, to_char(r.next_due, 'YYYY-MM-DD') AS due_on
      FROM ${table} r WHERE r.meter_run_id = m.id ORDER BY r.${at} DESC, r.id DESC LIMIT 1
  ) ${alias} ON true`;

const METER_RUNS_SQL = `
  SELECT m.id::text, m.tag, m.name, m.site_id::text, s.time_zone,
         cv.element->>'kind' AS element_kind, (cv.element ? 'calibration') AS element_has_curve,
         ec.done_on AS calibration_on, ec.due_on AS calibration_due,
         ga.done_on AS analysis_on, ga.due_on AS analysis_due,
         ei.done_on AS inspection_on, ei.due_on AS inspection_due
    FROM meter_runs m JOIN sites s ON s.id = m.site_id
    LEFT JOIN LATERAL (
      SELECT v.element FROM config_versions v WHERE v.meter_run_id = m.id
       ORDER BY (v.effective_from <= now()) DESC, v.effective_from DESC LIMIT 1
    ) cv ON true
    ${latestOf('element_calibrations', 'calibrated_at', 'ec')}
    ${latestOf('gas_analyses', 'sampled_at', 'ga')}
    ${latestOf('element_inspections', 'inspected_at', 'ei')}`;

const toMeterRun = (r: MeterRunRow): CareMeterRun => ({
  id: r.id,
  tag: r.tag,
  name: r.name,
  siteId: r.site_id,
  timeZone: r.time_zone,
  elementKind: r.element_kind,
  elementHasCurve: r.element_has_curve ?? false,
  latest: {
    'element-calibration': r.calibration_on ? { doneOn: r.calibration_on, dueOn: r.calibration_due } : null,
    'gas-analysis': r.analysis_on ? { doneOn: r.analysis_on, dueOn: r.analysis_due } : null,
    'element-inspection': r.inspection_on ? { doneOn: r.inspection_on, dueOn: r.inspection_due } : null,
  },
});

/** The site, its meter runs with their latest care records, the transmitters' calibrations and the open due alarms. */
export async function findSite(db: Db, siteId: string): Promise<CareSite | null> {
  const { rows } = await db.query<{ id: string; name: string; time_zone: string }>(
    'SELECT id::text, name, time_zone FROM sites WHERE id = $1',
    [siteId],
  );
  return rows[0] ? { id: rows[0].id, name: rows[0].name, timeZone: rows[0].time_zone } : null;
}

/** @returns the site's meter runs (every meter run when siteId is null), in tag order */
export async function careMeterRuns(db: Db, siteId: string | null): Promise<CareMeterRun[]> {
  const { rows } = await db.query<MeterRunRow>(
    `${METER_RUNS_SQL} WHERE ($1::bigint IS NULL OR m.site_id = $1::bigint) ORDER BY m.tag, m.id`,
    [siteId],
  );
  return rows.map(toMeterRun);
}

/**
 * The site's transmitters with the due date the calibration alarms use (server/alarms/evaluation-repository.ts):
 * the latest calibration not corrected by another, or the transmitter's calibration_due when none is recorded.
 */
export async function careTransmitters(db: Db, siteId: string): Promise<CareTransmitter[]> {
  const { rows } = await db.query<TransmitterRow>(
    `SELECT t.id::text, t.tag, t.meter_run_id::text, to_char(c.calibrated_on, 'YYYY-MM-DD') AS last_done_on,
            to_char(coalesce(c.next_due, t.calibration_due), 'YYYY-MM-DD') AS due_on
       FROM transmitters t JOIN meter_runs m ON m.id = t.meter_run_id
       LEFT JOIN LATERAL (
         SELECT k.calibrated_on, k.next_due FROM transmitter_calibrations k
          WHERE k.transmitter_id = t.id
            AND NOT EXISTS (SELECT 1 FROM transmitter_calibrations x WHERE x.corrects_id = k.id)
          ORDER BY k.calibrated_on DESC, k.id DESC LIMIT 1
       ) c ON true
      WHERE m.site_id = $1
      ORDER BY t.tag, t.id`,
    [siteId],
  );
  return rows.map((r) => ({
    id: r.id,
    tag: r.tag,
    meterRunId: r.meter_run_id,
    lastDoneOn: r.last_done_on,
    dueOn: r.due_on,
  }));
}

/** @returns the alarms about due dates of the site's meter runs that are not back to normal */
export async function openDueAlarms(db: Db, siteId: string): Promise<OpenDueAlarm[]> {
  const { rows } = await db.query<AlarmRow>(
    `SELECT a.id::text, a.meter_run_id::text, a.transmitter_id::text, a.condition
       FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id
      WHERE m.site_id = $1 AND a.state <> 'normal'
        AND a.condition IN ('calibration-due', 'calibration-overdue', 'care-due', 'care-overdue')
      ORDER BY a.id`,
    [siteId],
  );
  return rows.map((r) => ({
    id: r.id,
    meterRunId: r.meter_run_id,
    transmitterId: r.transmitter_id,
    condition: r.condition,
  }));
}

/** @returns the stored alarm limits of a meter run (the due-soon windows come from them) */
export function storedLimits(db: Db, meterRunId: string): Promise<StoredLimits[]> {
  return loadStoredLimits(db, meterRunId);
}
