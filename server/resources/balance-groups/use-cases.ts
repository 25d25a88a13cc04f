import { DateTime } from 'luxon';
import type { Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, notFound } from '../../errors';
import { stationBalance, type MemberVolume, type StationBalance } from '../../../shared/balance/station-balance';
import { allocateProRata, type WellAllocation } from '../../../shared/balance/allocation';
import type { BalanceGroupRecord, BalanceGroupsRepository, MemberTotal } from './repository';
import type { CreateBalanceGroupInput } from './schema';
import { presentBalanceGroup } from './presenter';

export interface BalanceGroupDeps {
  sequelize: Sequelize;
  repository: BalanceGroupsRepository;
}

export const listBalanceGroups = (repository: BalanceGroupsRepository, filter: { siteId?: string }) =>
  repository.list(filter);

/** @throws not found when there is no such group */
export async function getBalanceGroup(repository: BalanceGroupsRepository, id: string): Promise<BalanceGroupRecord> {
  const group = await repository.findById(id);
  if (!group) throw notFound('Balance group');
  return group;
}

/**
 * Creates a balance group with its members and its audit event (the definition as `after`).
 * @throws bad request naming siteId (no such site), inletMeterRunIds / outletMeterRunIds (a meter
 *   run named twice, on both sides, unknown, or of another site); conflict naming name (taken at the site)
 */
export async function createBalanceGroup(
  { sequelize, repository }: BalanceGroupDeps,
  input: CreateBalanceGroupInput,
  actor: SignedInUser,
): Promise<BalanceGroupRecord> {
  if (!(await repository.siteClock(input.siteId))) throw badRequest('siteId: no such site', 'siteId');
  for (const field of ['inletMeterRunIds', 'outletMeterRunIds'] as const) {
    const ids = input[field];
    const twice = ids.find((id, i) => ids.indexOf(id) !== i);
    if (twice) throw badRequest(`${field}: meter run ${twice} is named twice`, field);
  }
  const both = input.outletMeterRunIds.find((id) => input.inletMeterRunIds.includes(id));
  if (both) throw badRequest(`outletMeterRunIds: meter run ${both} is also an inlet`, 'outletMeterRunIds');
  const sites = await repository.meterRunSites([...input.inletMeterRunIds, ...input.outletMeterRunIds]);
  for (const field of ['inletMeterRunIds', 'outletMeterRunIds'] as const) {
    for (const id of input[field]) {
      const site = sites.get(id);
      if (site === undefined) throw badRequest(`${field}: meter run ${id} does not exist`, field);
      if (site !== input.siteId)
        throw badRequest(`${field}: meter run ${id} belongs to another site than ${input.siteId}`, field);
    }
  }
  if (await repository.nameTaken(input.siteId, input.name))
    throw conflict(`The site already has a balance group named ${input.name}.`, 'name', 'duplicate');
  return sequelize.transaction(async (transaction) => {
    const group = await repository.insert(
      {
        siteId: input.siteId,
        name: input.name,
        allowancePercent: input.allowancePercent ?? null,
        allowanceDailyM3: input.allowanceDailyM3 ?? null,
        tolerancePercent: input.tolerancePercent,
        createdBy: actor.id,
        inletMeterRunIds: input.inletMeterRunIds,
        outletMeterRunIds: input.outletMeterRunIds,
      },
      transaction,
    );
    await recordAuditEvent(
      {
        actor,
        action: 'balance-group.create',
        entityType: 'balance-group',
        entityId: group.id,
        before: null,
        after: presentBalanceGroup(group),
      },
      transaction,
    );
    return group;
  });
}

/** One period of a group's balance: its bounds, the balance, and the members that had no total. */
export interface BalancePeriod extends StationBalance {
  startMs: number;
  endMs: number;
  /** Members without a total for the period (counted as zero): the balance is not whole. */
  missingMeterRunIds: string[];
}

/**
 * A group's station balance per contract day or contract month whose start lies in [fromMs, toMs),
 * from the daily or monthly totals of its members (shared/balance/station-balance.ts). A fixed
 * daily allowance counts once per contract day, so a month counts it once per day of the month.
 */
export async function balanceForWindow(
  repository: Pick<BalanceGroupsRepository, 'totals'>,
  request: { group: BalanceGroupRecord; interval: 'day' | 'month'; fromMs: number; toMs: number },
): Promise<BalancePeriod[]> {
  const { group, interval } = request;
  const ids = group.members.map((m) => m.meterRunId);
  const totals = await repository.totals(interval, ids, request.fromMs, request.toMs);
  const byPeriod = new Map<string, MemberTotal[]>();
  for (const t of totals) byPeriod.set(t.period, [...(byPeriod.get(t.period) ?? []), t]);
  return [...byPeriod.entries()].map(([period, rows]) => {
    const volumes = (side: 'inlet' | 'outlet'): MemberVolume[] =>
      group.members
        .filter((m) => m.side === side)
        .map((m) => {
          const row = rows.find((r) => r.meterRunId === m.meterRunId);
          return {
            meterRunId: m.meterRunId,
            standardVolumeM3: row?.standardVolumeM3 ?? 0,
            uncertaintyPercent: row?.uncertaintyPercent ?? null,
          };
        });
    const days = interval === 'day' ? 1 : (DateTime.fromISO(period, { zone: 'utc' }).daysInMonth ?? 30);
    return {
      startMs: Math.min(...rows.map((r) => r.startMs)),
      endMs: Math.max(...rows.map((r) => r.endMs)),
      ...stationBalance(group, { inlets: volumes('inlet'), outlets: volumes('outlet'), days }),
      missingMeterRunIds: ids.filter((id) => !rows.some((r) => r.meterRunId === id)),
    };
  });
}

export interface AllocationReport {
  balanceGroupId: string;
  month: string;
  sales: { meterRunId: string; tag: string; standardVolumeM3: number; energyJ: number | null; status: string };
  wells: (WellAllocation & { tag: string; status: string | null })[];
}

/**
 * Pro-rata allocation of the sales meter's month (the group's one outlet) to its inlet meter runs
 * (shared/balance/allocation.ts). An inlet without a monthly total counts as zero.
 * @throws bad request naming outletMeterRunIds when the group has not exactly one outlet;
 *   not found when the sales meter has no total for the month
 */
export async function allocationForMonth(
  repository: BalanceGroupsRepository,
  request: { group: BalanceGroupRecord; month: string },
): Promise<AllocationReport> {
  const { group, month } = request;
  const outlets = group.members.filter((m) => m.side === 'outlet');
  if (outlets.length !== 1)
    throw badRequest(
      `outletMeterRunIds: allocation needs a group whose one outlet is the sales meter; this one has ${outlets.length}`,
      'outletMeterRunIds',
    );
  const inlets = group.members.filter((m) => m.side === 'inlet');
  const totals = await repository.monthTotals(
    group.members.map((m) => m.meterRunId),
    month,
  );
  const sales = totals.find((t) => t.meterRunId === outlets[0].meterRunId);
  if (!sales) throw notFound(`A monthly total of the sales meter ${outlets[0].tag} for ${month}`);
  const own = inlets.map((m) => totals.find((t) => t.meterRunId === m.meterRunId));
  const allocated = allocateProRata(
    sales,
    inlets.map((m, i) => ({
      meterRunId: m.meterRunId,
      standardVolumeM3: own[i]?.standardVolumeM3 ?? 0,
      energyJ: own[i] ? own[i].energyJ : null,
    })),
  );
  return {
    balanceGroupId: group.id,
    month,
    sales: {
      meterRunId: sales.meterRunId,
      tag: outlets[0].tag,
      standardVolumeM3: sales.standardVolumeM3,
      energyJ: sales.energyJ,
      status: sales.status,
    },
    wells: allocated.map((w, i) => ({ ...w, tag: inlets[i].tag, status: own[i]?.status ?? null })),
  };
}
