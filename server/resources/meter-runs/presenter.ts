import type { ConfigVersion, MeterRun } from '../../models';

export const presentConfigVersion = (c: ConfigVersion) => ({
  id: String(c.id),
  meterRunId: String(c.meterRunId),
  effectiveFrom: c.effectiveFrom.toISOString(),
  element: c.element,
  fluid: c.fluid,
  reason: c.reason,
  createdAt: c.createdAt.toISOString(),
});

export const presentMeterRun = (m: MeterRun, current?: ConfigVersion | null) => ({
  id: String(m.id),
  siteId: String(m.siteId),
  tag: m.tag,
  name: m.name,
  holdLimitS: m.holdLimitS,
  maxGapS: m.maxGapS,
  stackSwitchUpShare: m.stackSwitchUpShare,
  stackSwitchDownShare: m.stackSwitchDownShare,
  line: m.line,
  ...(current ? { element: current.element, fluid: current.fluid, configVersionId: String(current.id) } : {}),
});
