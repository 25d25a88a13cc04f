import type { Pool } from 'pg';
import { judgeDueDate, todayIn, type DueState } from '../../../shared/alarms/due-date';
import { careDuties, type CareRecordKind } from '../../../shared/alarms/care-duties';
import type { AlarmCondition } from '../../../shared/alarms/alarm-codes';
import { limitsResolver } from '../../alarms/limits-store';
import { notFound } from '../../errors';
import { careMeterRuns, careTransmitters, findSite, openDueAlarms, storedLimits, type CareSite } from './repository';

export type CareDueKind = 'transmitter-calibration' | CareRecordKind;
export type CareDueState = DueState | 'not-recorded';
export type CareDueSort = 'due' | '-due';

export interface CareDueItem {
  kind: CareDueKind;
  meterRunId: string;
  meterRunName: string;
  transmitterId: string | null;
  subject: string;
  lastDoneOn: string | null;
  dueOn: string | null;
  state: CareDueState;
  daysLeft: number | null;
  recordUrl: string;
  alarmId: string | null;
}

export interface CareDueList {
  site: CareSite;
  today: string;
  items: CareDueItem[];
}

const recordPath: Record<CareRecordKind, string> = {
  'element-calibration': 'element-calibrations',
  'gas-analysis': 'gas-analyses',
  'element-inspection': 'inspections',
};

/** The alarm a due or overdue item raises (meter-run care records share one pair per meter run). */
const alarmConditionOf = (kind: CareDueKind, state: CareDueState): AlarmCondition | null => {
  if (state !== 'due-soon' && state !== 'overdue') return null;
  if (kind === 'transmitter-calibration') return state === 'overdue' ? 'calibration-overdue' : 'calibration-due';
  return state === 'overdue' ? 'care-overdue' : 'care-due';
};

/**
 * What is due in the care of a site's meters (issue 11 §4): each transmitter's calibration and
 * each meter run's element calibration (elements with a laboratory curve), gas analysis and
 * inspection, judged against today in the site's zone with the due-soon windows of the alarm
 * limits (calibration-due for transmitters, care-due for meter runs), so the list and the
 * alarms agree. Sorted by due date (`-due`: latest first); items never recorded come last.
 * @throws not found when the site does not exist
 */
export async function listCareDue(
  pool: Pool,
  request: { siteId: string; sort: CareDueSort; nowMs: number },
): Promise<CareDueList> {
  const site = await findSite(pool, request.siteId);
  if (!site) throw notFound('Site');
  const today = todayIn(request.nowMs, site.timeZone);
  const runs = await careMeterRuns(pool, site.id);
  const transmitters = await careTransmitters(pool, site.id);
  const alarms = await openDueAlarms(pool, site.id);
  const alarmOf = (meterRunId: string, transmitterId: string | null, condition: AlarmCondition | null) =>
    condition === null
      ? null
      : (alarms.find(
          (a) => a.meterRunId === meterRunId && a.transmitterId === transmitterId && a.condition === condition,
        )?.id ?? null);

  const items: CareDueItem[] = [];
  const judge = (dueOn: string | null, dueSoonDays: number) =>
    dueOn === null ? { state: 'not-recorded' as const, daysLeft: null } : judgeDueDate(dueOn, today, dueSoonDays);
  for (const run of runs) {
    const limits = limitsResolver(await storedLimits(pool, run.id));
    for (const t of transmitters.filter((x) => x.meterRunId === run.id)) {
      const { state, daysLeft } = judge(t.dueOn, limits('calibration-due', t.id).dueSoonDays ?? 14);
      items.push({
        kind: 'transmitter-calibration',
        meterRunId: run.id,
        meterRunName: run.name,
        transmitterId: t.id,
        subject: t.tag,
        lastDoneOn: t.lastDoneOn,
        dueOn: t.dueOn,
        state,
        daysLeft,
        recordUrl: `/api/transmitters/${t.id}/calibrations`,
        alarmId: alarmOf(run.id, t.id, alarmConditionOf('transmitter-calibration', state)),
      });
    }
    const dueSoonDays = limits('care-due', null).dueSoonDays ?? 14;
    for (const duty of careDuties(run)) {
      const { state, daysLeft } = judge(duty.dueOn, dueSoonDays);
      items.push({
        kind: duty.kind,
        meterRunId: run.id,
        meterRunName: run.name,
        transmitterId: null,
        subject: `${run.tag} ${run.name}`,
        lastDoneOn: duty.lastDoneOn,
        dueOn: duty.dueOn,
        state,
        daysLeft,
        recordUrl: `/api/meter-runs/${run.id}/${recordPath[duty.kind]}`,
        alarmId: alarmOf(run.id, null, alarmConditionOf(duty.kind, state)),
      });
    }
  }
  return { site, today, items: sortByDue(items, request.sort) };
}

/** By due date (then subject, then kind, so the order is stable); items without a date last in either order. */
export function sortByDue(items: CareDueItem[], sort: CareDueSort): CareDueItem[] {
  const direction = sort === '-due' ? -1 : 1;
  return [...items].sort((a, b) => {
    if (a.dueOn === null || b.dueOn === null) {
      if (a.dueOn !== b.dueOn) return a.dueOn === null ? 1 : -1;
    } else if (a.dueOn !== b.dueOn) return direction * (a.dueOn < b.dueOn ? -1 : 1);
    return a.subject.localeCompare(b.subject) || a.kind.localeCompare(b.kind);
  });
}
