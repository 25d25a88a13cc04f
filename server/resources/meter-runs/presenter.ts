import type { ConfigVersionRecord, MeterRunRecord } from './repository';

export const presentConfigVersion = (c: ConfigVersionRecord) => ({
  id: c.id,
  meterRunId: c.meterRunId,
  effectiveFrom: c.effectiveFrom.toISOString(),
  element: c.element,
  fluid: c.fluid,
  reason: c.reason,
  createdAt: c.createdAt.toISOString(),
});

/** A meter run with the element and fluid of the configuration in force, when there is one. */
export const presentMeterRun = (m: MeterRunRecord, current?: ConfigVersionRecord | null) => ({
  id: m.id,
  siteId: m.siteId,
  tag: m.tag,
  name: m.name,
  holdLimitS: m.holdLimitS,
  maxGapS: m.maxGapS,
  stackSwitchUpShare: m.stackSwitchUpShare,
  stackSwitchDownShare: m.stackSwitchDownShare,
  line: m.line,
  ...(current ? { element: current.element, fluid: current.fluid, configVersionId: current.id } : {}),
});
