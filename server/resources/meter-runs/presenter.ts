import type { ConfigVersionRecord, MeterRunRecord } from './repository';
import type { ConfigVersionEntry, RecomputeSummary, SettingVersionEntry } from './use-cases';

/** A share as percent, without binary noise (0.005 → 0.5, not 0.5000000000000001). */
const percentOf = (share: number) => Number((share * 100).toPrecision(12));

export const presentConfigVersion = (c: ConfigVersionRecord) => ({
  id: c.id,
  meterRunId: c.meterRunId,
  effectiveFrom: c.effectiveFrom.toISOString(),
  element: c.element,
  fluid: c.fluid,
  // Only on a bi-directional version (issue 13 §11): a one-way version keeps its shape.
  ...(c.reverseElement ? { reverseElement: c.reverseElement, directionSource: c.directionSource } : {}),
  reason: c.reason,
  createdAt: c.createdAt.toISOString(),
});

/** A version in a meter run's configuration history: who made it and what it changed, after the version's own keys. */
export const presentConfigVersionEntry = (e: ConfigVersionEntry) => ({
  ...presentConfigVersion(e.version),
  createdBy: e.createdBy ? { email: e.createdBy.email, name: e.createdBy.name } : null,
  changes: e.changes.map((c) => ({ path: c.path, before: c.before, after: c.after })),
  first: e.first,
});

/** A new version, with the hours it sends back for recomputation. */
export const presentCreatedConfigVersion = (e: ConfigVersionEntry & { recompute: RecomputeSummary }) => ({
  ...presentConfigVersionEntry(e),
  recompute: { from: new Date(e.recompute.fromMs).toISOString(), hours: e.recompute.hours },
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
  noFlowCutoffPercentOfSpan: percentOf(m.noFlowCutoffShare),
  reconciliationTolerancePercent: m.reconciliationTolerancePercent,
  ...(current
    ? {
        element: current.element,
        fluid: current.fluid,
        ...(current.reverseElement
          ? { reverseElement: current.reverseElement, directionSource: current.directionSource }
          : {}),
        configVersionId: current.id,
      }
    : {}),
});

/** One entry of `GET /api/meter-runs/:id/setting-versions`. */
export const presentSettingVersionEntry = (e: SettingVersionEntry) => ({
  kind: e.kind,
  id: e.id,
  subject: e.subject,
  effectiveFrom: e.effectiveFrom.toISOString(),
  values: e.values,
  reason: e.reason,
  createdAt: e.createdAt.toISOString(),
  createdBy: e.createdBy ? { email: e.createdBy.email, name: e.createdBy.name } : null,
  changes: e.changes.map((c) => ({ path: c.path, before: c.before, after: c.after })),
  first: e.first,
});
