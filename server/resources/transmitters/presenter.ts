import type { TransmitterRecord } from './repository';

export const presentTransmitter = (t: TransmitterRecord) => ({
  id: t.id,
  meterRunId: t.meterRunId,
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
