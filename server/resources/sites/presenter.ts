import type { SiteRecord } from './repository';

export const presentSite = (s: SiteRecord) => ({
  id: s.id,
  code: s.code,
  name: s.name,
  timeZone: s.timeZone,
  contractHour: s.contractHour,
  basePressurePa: s.basePressurePa,
  baseTemperatureK: s.baseTemperatureK,
  atmosphericPressurePa: s.atmosphericPressurePa,
  displayUnits: s.displayUnits,
});
