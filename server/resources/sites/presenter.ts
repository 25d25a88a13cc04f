import type { Site } from '../../models';

export const presentSite = (s: Site) => ({
  id: String(s.id),
  code: s.code,
  name: s.name,
  timeZone: s.timeZone,
  contractHour: s.contractHour,
  basePressurePa: s.basePressurePa,
  baseTemperatureK: s.baseTemperatureK,
  atmosphericPressurePa: s.atmosphericPressurePa,
  displayUnits: s.displayUnits,
});
