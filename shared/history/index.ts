/** Hourly records and period totals of a DP meter run (public surface of this folder). */
export type {
  ConfigVersionInput,
  DirectionPart,
  DirectionSource,
  DpBandName,
  DpSeries,
  HourInputs,
  HourlyRecord,
  PeriodBounds,
  PeriodNet,
  PeriodReverse,
  PeriodTotal,
  Quality,
  RollUpRecord,
  Sample,
  TotalStatus,
} from './types';
export {
  computeHour,
  directionalReading,
  LOW_IN_RANGE_SHARE_OF_SPAN,
  NO_FLOW_CUTOFF_SHARE_OF_SPAN,
} from './compute-hour';
export type { DirectionalReading } from './compute-hour';
export { HOUR_FLAG_ORDER } from './hour-sums';
export type { HourFlag } from './hour-sums';
export { contractDayBounds, contractDayOf, contractMonthBounds, hourStartOf, hourStartsBetween } from './contract-day';
export { rollUpRecords } from './roll-up';
export type { RollUpOptions } from './roll-up';
