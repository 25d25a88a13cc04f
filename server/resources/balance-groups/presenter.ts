import type { BalanceGroupRecord } from './repository';
import type { AllocationReport, BalancePeriod } from './use-cases';

const iso = (ms: number) => new Date(ms).toISOString();

/** A balance group as JSON (ids as strings); also its definition in the audit trail. */
export function presentBalanceGroup(g: BalanceGroupRecord) {
  const side = (s: 'inlet' | 'outlet') => g.members.filter((m) => m.side === s);
  return {
    id: g.id,
    siteId: g.siteId,
    name: g.name,
    inletMeterRunIds: side('inlet').map((m) => m.meterRunId),
    outletMeterRunIds: side('outlet').map((m) => m.meterRunId),
    allowancePercent: g.allowancePercent,
    allowanceDailyM3: g.allowanceDailyM3,
    tolerancePercent: g.tolerancePercent,
    members: g.members.map((m) => ({ meterRunId: m.meterRunId, tag: m.tag, side: m.side })),
    version: g.version,
    createdAt: iso(g.createdAtMs),
  };
}

/** One period of a balance, with the keys of DESIGN.md first. */
export function presentBalancePeriod(p: BalancePeriod) {
  return {
    start: iso(p.startMs),
    end: iso(p.endMs),
    inletStandardVolumeM3: p.inletStandardVolumeM3,
    outletStandardVolumeM3: p.outletStandardVolumeM3,
    allowanceM3: p.allowanceM3,
    imbalanceM3: p.imbalanceM3,
    imbalancePercent: p.imbalancePercent,
    uncertaintyM3: p.uncertaintyM3,
    withinTolerance: p.withinTolerance,
    exceedsUncertainty: p.exceedsUncertainty,
    missingMeterRunIds: p.missingMeterRunIds,
  };
}

export function presentAllocation(a: AllocationReport) {
  return {
    balanceGroupId: a.balanceGroupId,
    month: a.month,
    sales: a.sales,
    wells: a.wells.map((w) => ({
      meterRunId: w.meterRunId,
      tag: w.tag,
      status: w.status,
      standardVolumeM3: w.standardVolumeM3,
      energyJ: w.energyJ,
      factor: w.factor,
      allocatedStandardVolumeM3: w.allocatedStandardVolumeM3,
      energyFactor: w.energyFactor,
      allocatedEnergyJ: w.allocatedEnergyJ,
    })),
  };
}
