import type { Transmitter } from '../../models';

export const presentTransmitter = (t: Transmitter) => ({
  id: String(t.id),
  meterRunId: String(t.meterRunId),
  tag: t.tag,
  measures: t.measures,
  unit: t.unit,
  pressureReference: t.pressureReference,
  lowerRange: t.lowerRange,
  upperRange: t.upperRange,
  stackRole: t.stackRole,
  accuracyPercentOfSpan: t.accuracyPercentOfSpan,
  calibrationDue: t.calibrationDue,
});
