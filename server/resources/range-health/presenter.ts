import type { RangeHealthReport } from './use-cases';

/** The report as JSON: instants as ISO 8601 strings; everything else is already in SI with units in its names. */
export function presentRangeHealth(report: RangeHealthReport) {
  const { meterRunId, fromMs, toMs, ...rest } = report;
  return { meterRunId, from: new Date(fromMs).toISOString(), to: new Date(toMs).toISOString(), ...rest };
}
