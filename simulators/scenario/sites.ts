/**
 * The two demo sites of SCENARIO.md (invented). Base conditions in SI, from the scenario's
 * stated units through shared/units.
 */
import { toSI } from '../../shared/units';
import type { ScenarioSite } from './scenario-types';

/**
 * Kestrel Flats Gathering: a natural gas gathering system on the high plains.
 * Atmospheric pressure 84 kPa is INVENTED for a site near 1,600 m; the standard atmosphere
 * (ISO 2533) gives about 83.5 kPa there [mem]: p = 101325 (1 − 2.25577e-5 h)^5.25588.
 */
export const KFG_SITE: ScenarioSite = {
  code: 'KFG',
  name: 'Kestrel Flats Gathering',
  timeZone: 'America/Denver',
  contractHour: 9,
  basePressurePa: toSI(14.73, 'psi'), // 14.73 psia (SCENARIO.md) = 101 559.8 Pa
  baseTemperatureK: toSI(60, 'degF'), // 60 °F (SCENARIO.md) = 288.706 K
  atmosphericPressurePa: 84_000,
  displayUnits: 'us',
  device: { name: 'Kestrel Flats demo simulator', username: 'kfg-demo-sim' },
};

/**
 * Brackwater Paper Mill: boiler steam, cooling water and treated effluent.
 * Atmospheric pressure 101.325 kPa is INVENTED (a mill on a river near sea level).
 */
export const BPM_SITE: ScenarioSite = {
  code: 'BPM',
  name: 'Brackwater Paper Mill',
  timeZone: 'Europe/Berlin',
  contractHour: 6,
  basePressurePa: 101_325, // SCENARIO.md: 101.325 kPa
  baseTemperatureK: toSI(15, 'degC'), // SCENARIO.md: 15 °C = 288.15 K
  atmosphericPressurePa: 101_325,
  displayUnits: 'si',
  device: { name: 'Brackwater demo simulator', username: 'bpm-demo-sim' },
};

export const DEMO_SITES: readonly ScenarioSite[] = [KFG_SITE, BPM_SITE];
