import type { MonthlyVolumes } from './use-cases';

/** The month as JSON: instants as ISO 8601, ids as strings, quantities in SI with units in their names. */
export function presentMonthlyVolumes(volumes: MonthlyVolumes) {
  const { site } = volumes;
  return {
    site: {
      id: site.id,
      code: site.code,
      name: site.name,
      timeZone: site.timeZone,
      contractHour: site.contractHour,
      basePressurePa: site.basePressurePa,
      baseTemperatureK: site.baseTemperatureK,
      displayUnits: site.displayUnits,
    },
    month: volumes.month,
    start: new Date(volumes.startMs).toISOString(),
    end: new Date(volumes.endMs).toISOString(),
    status: volumes.totals.status,
    meterRuns: volumes.meterRuns.map(({ meterRun, ...figures }) => ({
      meterRunId: meterRun.id,
      tag: meterRun.tag,
      name: meterRun.name,
      ...figures,
    })),
    totals: volumes.totals,
  };
}

export type MonthlyVolumesJson = ReturnType<typeof presentMonthlyVolumes>;
