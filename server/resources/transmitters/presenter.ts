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
  // Added last (issue 13): whether the accuracy is a k = 2 uncertainty or a ± limit (GUM §4.3.7).
  accuracyKind: t.accuracyKind,
});
