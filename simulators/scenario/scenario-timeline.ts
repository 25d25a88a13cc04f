/**
 * The instants of the demo scenario for one demo month: where each site's history starts, when
 * the KFG-101 element change takes effect, and the frozen hour and the dropout. Pure.
 */
import { demoHistoryStartMs, localTimeMs } from './demo-month';
import { DROPOUT, FROZEN_TRANSMITTER } from './scenario-events';
import { DEMO_METER_RUNS, siteOf } from './catalog';
import { DEMO_SITES } from './sites';

export interface TimeWindow {
  fromMs: number;
  /** Excluded. */
  toMs: number;
}

export interface ScenarioTimeline {
  /** 'YYYY-MM', the month before the current one in the KFG zone (where the events happen). */
  demoMonth: string;
  /** First instant of each site's demo history (its first contract day of the demo month), by site code. */
  historyStartMs: Record<string, number>;
  /** When the wells' decline is counted from (KFG's history start): the flow there is nominal. */
  declineStartMs: number;
  /** When each meter run's element change takes effect, by meter run tag. */
  elementChangeMs: Record<string, number>;
  frozen: TimeWindow & { tag: string };
  dropout: TimeWindow & { meterRunTag: string };
}

const MS_PER_MINUTE = 60_000;

/**
 * @param demoMonth 'YYYY-MM'
 * @returns the scenario's instants in that month
 */
export function scenarioTimeline(demoMonth: string): ScenarioTimeline {
  const historyStartMs: Record<string, number> = {};
  for (const site of DEMO_SITES)
    historyStartMs[site.code] = demoHistoryStartMs(demoMonth, site.timeZone, site.contractHour);
  const elementChangeMs: Record<string, number> = {};
  for (const run of DEMO_METER_RUNS) {
    const change = run.elementChange;
    if (change)
      elementChangeMs[run.tag] = localTimeMs(demoMonth, change.day, change.hour, change.minute, siteOf(run).timeZone);
  }
  const zoneOf = (siteCode: string) => DEMO_SITES.find((s) => s.code === siteCode)!.timeZone;
  const frozenFrom = localTimeMs(
    demoMonth,
    FROZEN_TRANSMITTER.day,
    FROZEN_TRANSMITTER.hour,
    FROZEN_TRANSMITTER.minute,
    zoneOf(FROZEN_TRANSMITTER.siteCode),
  );
  const dropoutFrom = localTimeMs(demoMonth, DROPOUT.day, DROPOUT.hour, DROPOUT.minute, zoneOf(DROPOUT.siteCode));
  return {
    demoMonth,
    historyStartMs,
    declineStartMs: historyStartMs.KFG,
    elementChangeMs,
    frozen: {
      tag: FROZEN_TRANSMITTER.tag,
      fromMs: frozenFrom,
      toMs: frozenFrom + FROZEN_TRANSMITTER.durationMinutes * MS_PER_MINUTE,
    },
    dropout: {
      meterRunTag: DROPOUT.meterRunTag,
      fromMs: dropoutFrom,
      toMs: dropoutFrom + DROPOUT.durationMinutes * MS_PER_MINUTE,
    },
  };
}
