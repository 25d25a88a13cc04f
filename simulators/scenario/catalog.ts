/**
 * The scenario's meter runs and transmitters in one list, with look-ups by tag.
 */
import { BPM_METER_RUNS } from './bpm-meter-runs';
import { KFG_METER_RUNS } from './kfg-meter-runs';
import { DEMO_SITES } from './sites';
import type { ScenarioMeterRun, ScenarioSite, ScenarioTransmitter } from './scenario-types';

export const DEMO_METER_RUNS: readonly ScenarioMeterRun[] = [...KFG_METER_RUNS, ...BPM_METER_RUNS];

/** Every transmitter of the scenario with its meter run and site. */
export const DEMO_TRANSMITTERS: readonly {
  transmitter: ScenarioTransmitter;
  meterRun: ScenarioMeterRun;
  site: ScenarioSite;
}[] = DEMO_METER_RUNS.flatMap((meterRun) =>
  meterRun.transmitters.map((transmitter) => ({ transmitter, meterRun, site: siteOf(meterRun) })),
);

const meterRunsByTag = new Map(DEMO_METER_RUNS.map((m) => [m.tag, m]));
const transmittersByTag = new Map(DEMO_TRANSMITTERS.map((t) => [t.transmitter.tag, t]));

/**
 * The MQTT password of a demo simulator device, derived from the demo password so that the
 * server's seed and the simulators agree without sharing a secret file.
 * @param demoPassword TALLYRUN_DEMO_PASSWORD
 * @returns `${demoPassword}-device`
 */
export function demoDevicePassword(demoPassword: string): string {
  if (typeof demoPassword !== 'string' || demoPassword.length === 0)
    throw new Error('demoDevicePassword: demoPassword is required');
  return `${demoPassword}-device`;
}

/**
 * @param meterRun a scenario meter run
 * @returns its site
 */
export function siteOf(meterRun: Pick<ScenarioMeterRun, 'siteCode' | 'tag'>): ScenarioSite {
  const site = DEMO_SITES.find((s) => s.code === meterRun.siteCode);
  if (!site) throw new Error(`siteOf: meter run ${meterRun.tag} names an unknown siteCode ${meterRun.siteCode}`);
  return site;
}

/**
 * @param tag meter run tag, e.g. 'KFG-101'
 * @returns the scenario meter run
 */
export function meterRunByTag(tag: string): ScenarioMeterRun {
  const run = meterRunsByTag.get(tag);
  if (!run) throw new Error(`meterRunByTag: no demo meter run tagged ${tag}`);
  return run;
}

/**
 * @param tag transmitter tag, e.g. 'KFG-101-DPH'
 * @returns the transmitter with its meter run and site
 */
export function transmitterByTag(tag: string) {
  const hit = transmittersByTag.get(tag);
  if (!hit) throw new Error(`transmitterByTag: no demo transmitter tagged ${tag}`);
  return hit;
}
