/**
 * The demo scenario as data (SCENARIO.md): ONE source for the seed (server/seed/demo-scenario.ts)
 * and the simulators.
 */
export type * from './scenario-types';
export { DEMO_SITES, KFG_SITE, BPM_SITE } from './sites';
export { KFG_METER_RUNS, KFG_GAS } from './kfg-meter-runs';
export { BPM_METER_RUNS } from './bpm-meter-runs';
export {
  DEMO_METER_RUNS,
  DEMO_TRANSMITTERS,
  demoDevicePassword,
  siteOf,
  meterRunByTag,
  transmitterByTag,
} from './catalog';
export { FROZEN_TRANSMITTER, DROPOUT, LATE_DATA } from './scenario-events';
export { demoMonthAt, monthOf, localTimeMs, demoHistoryStartMs } from './demo-month';
export { scenarioTimeline, type ScenarioTimeline, type TimeWindow } from './scenario-timeline';
