import { DateTime } from 'luxon';
import { contractMonthBounds } from '../../../shared/history/contract-day';
import type { PeriodNet, PeriodReverse, TotalStatus } from '../../../shared/history/types';
import { netOf } from '../../history/net-flow';
import { notFound } from '../../errors';
import type { MonthlyVolumesRepository, StoredMonthlyTotal, VolumesMeterRun, VolumesSite } from './repository';

/** The figures of a month compared against (SI units). */
export interface ComparedMonth {
  month: string;
  massKg: number;
  standardVolumeM3: number;
  energyJ: number | null;
}

/** The figures of a meter run or of the site for the month, with their comparisons (SI units). */
export interface MonthFigures {
  massKg: number | null;
  volumeM3: number | null;
  standardVolumeM3: number | null;
  energyJ: number | null;
  coverage: number | null;
  flags: string[];
  /** Expanded uncertainty (k = 2) of the standard volume, percent. */
  uncertaintyPercent: number | null;
  status: TotalStatus;
  previousMonth: ComparedMonth | null;
  yearEarlier: ComparedMonth | null;
  /** Change of the standard volume against the month compared with, percent; null without a figure to compare. */
  changeFromPreviousMonthPercent: number | null;
  changeFromYearEarlierPercent: number | null;
}

export interface MeterRunMonth extends MonthFigures {
  meterRun: VolumesMeterRun;
  /** The stored total's version (1 = never recomputed); null when the month has no total. */
  version: number | null;
  /** Approved corrections overlapping the month. */
  correctionsInForce: number;
  /**
   * A bi-directional meter run's month (issue 13 §11): its reverse flow and net (forward − reverse)
   * as figures of their own; absent on a one-way meter run, whose month keeps its shape.
   */
  reverse?: PeriodReverse;
  net?: PeriodNet;
}

export interface MonthlyVolumes {
  site: VolumesSite;
  month: string;
  startMs: number;
  endMs: number;
  /** Whether any meter run has a total for the month. */
  hasData: boolean;
  meterRuns: MeterRunMonth[];
  /** reverse and net only when a meter run flowed in reverse: forward, reverse and net kept apart. */
  totals: MonthFigures & { correctionsInForce: number; reverse?: PeriodReverse; net?: PeriodNet };
}

/** The month before and the same month a year before `month` (YYYY-MM). */
export function comparedMonths(month: string): { previous: string; yearEarlier: string } {
  const first = DateTime.fromISO(`${month}-01`, { zone: 'utc' });
  return {
    previous: first.minus({ months: 1 }).toFormat('yyyy-MM'),
    yearEarlier: first.minus({ years: 1 }).toFormat('yyyy-MM'),
  };
}

const changePercent = (current: number | null, before: ComparedMonth | null) =>
  current === null || !before || before.standardVolumeM3 === 0
    ? null
    : ((current - before.standardVolumeM3) / before.standardVolumeM3) * 100;

const compared = (t: StoredMonthlyTotal | undefined): ComparedMonth | null =>
  t ? { month: t.month, massKg: t.massKg, standardVolumeM3: t.standardVolumeM3, energyJ: t.energyJ } : null;

/** Adds up the comparisons of several meter runs; null when none had one. */
function sumCompared(list: (ComparedMonth | null)[], month: string): ComparedMonth | null {
  const present = list.filter((c): c is ComparedMonth => c !== null);
  if (!present.length) return null;
  const energies = present.map((c) => c.energyJ).filter((e): e is number => e !== null);
  return {
    month,
    massKg: present.reduce((a, c) => a + c.massKg, 0),
    standardVolumeM3: present.reduce((a, c) => a + c.standardVolumeM3, 0),
    energyJ: energies.length ? energies.reduce((a, e) => a + e, 0) : null,
  };
}

/**
 * The accountant's month: per meter run of the site, the stored monthly total (mass, actual volume,
 * volume at base conditions, energy, coverage, flags, U at k = 2, status), the corrections in force
 * and the change against the month before and the same month a year earlier; then the site's sum.
 *
 * The site's uncertainty treats the meter runs as uncorrelated (GUM, JCGM 100:2008 §5.1.2 with unit
 * sensitivity coefficients): the root-sum-square of each run's absolute expanded uncertainty.
 * @throws not found when the site does not exist
 */
export async function monthlyVolumes(
  repository: MonthlyVolumesRepository,
  request: { siteId: string; month: string },
): Promise<MonthlyVolumes> {
  const site = await repository.site(request.siteId);
  if (!site) throw notFound('Site');
  const { month } = request;
  const { startMs, endMs } = contractMonthBounds(month, site.timeZone, site.contractHour);
  const { previous, yearEarlier } = comparedMonths(month);
  const [runs, stored, corrections] = await Promise.all([
    repository.meterRuns(site.id),
    repository.monthlyTotals(site.id, [month, previous, yearEarlier]),
    repository.correctionsInForce(site.id, startMs, endMs),
  ]);
  const find = (runId: string, m: string) => stored.find((t) => t.meterRunId === runId && t.month === m);

  const meterRuns: MeterRunMonth[] = [];
  for (const run of runs) {
    const total = find(run.id, month);
    const closed = await repository.isClosed(run.id, startMs, endMs);
    const before = compared(find(run.id, previous));
    const yearBefore = compared(find(run.id, yearEarlier));
    const standardVolumeM3 = total?.standardVolumeM3 ?? null;
    meterRuns.push({
      meterRun: run,
      massKg: total?.massKg ?? null,
      volumeM3: total?.volumeM3 ?? null,
      standardVolumeM3,
      energyJ: total?.energyJ ?? null,
      coverage: total?.coverage ?? null,
      flags: total?.flags ?? [],
      uncertaintyPercent: total?.uncertaintyPercent ?? null,
      status: closed ? 'closed' : (total?.status ?? 'provisional'),
      version: total?.version ?? null,
      correctionsInForce: corrections.get(run.id) ?? 0,
      previousMonth: before,
      yearEarlier: yearBefore,
      changeFromPreviousMonthPercent: changePercent(standardVolumeM3, before),
      changeFromYearEarlierPercent: changePercent(standardVolumeM3, yearBefore),
      ...directionsOf(total),
    });
  }

  return {
    site,
    month,
    startMs,
    endMs,
    hasData: meterRuns.some((r) => r.version !== null),
    meterRuns,
    totals: siteTotals(meterRuns, previous, yearEarlier),
  };
}

/** The site's sum of its meter runs' months. */
/** The month's reverse and net flow, only where the meter run flowed in reverse (a bi-directional run). */
function directionsOf(total: StoredMonthlyTotal | undefined): { reverse?: PeriodReverse; net?: PeriodNet } {
  const net = total ? netOf(total, total.reverse) : null;
  return total?.reverse && net ? { reverse: total.reverse, net } : {};
}

function siteTotals(runs: MeterRunMonth[], previous: string, yearEarlier: string) {
  const withTotal = runs.filter((r) => r.version !== null);
  const sum = (pick: (r: MeterRunMonth) => number | null) => {
    const values = withTotal.map(pick).filter((v): v is number => v !== null);
    return values.length ? values.reduce((a, v) => a + v, 0) : null;
  };
  const standardVolumeM3 = sum((r) => r.standardVolumeM3);
  // Absolute expanded uncertainties add in quadrature; a run without one leaves the sum's unknown.
  const unknownU = withTotal.some((r) => r.uncertaintyPercent === null);
  const uAbsM3 = Math.sqrt(
    withTotal.reduce((a, r) => a + (((r.uncertaintyPercent ?? 0) / 100) * (r.standardVolumeM3 ?? 0)) ** 2, 0),
  );
  const before = sumCompared(
    runs.map((r) => r.previousMonth),
    previous,
  );
  const yearBefore = sumCompared(
    runs.map((r) => r.yearEarlier),
    yearEarlier,
  );
  const statuses = runs.map((r) => r.status);
  // A site's month is missing only when every meter run's is (nothing recorded anywhere).
  const status: TotalStatus =
    statuses.length && statuses.every((s) => s === 'closed')
      ? 'closed'
      : statuses.some((s) => s === 'provisional') || !statuses.length
        ? 'provisional'
        : statuses.every((s) => s === 'missing')
          ? 'missing'
          : 'complete';
  return {
    massKg: sum((r) => r.massKg),
    volumeM3: sum((r) => r.volumeM3),
    standardVolumeM3,
    energyJ: sum((r) => r.energyJ),
    // The site's month is as covered as its least covered meter run.
    coverage: withTotal.length ? Math.min(...withTotal.map((r) => r.coverage ?? 0)) : null,
    flags: [...new Set(withTotal.flatMap((r) => r.flags))].sort(),
    uncertaintyPercent: unknownU || !standardVolumeM3 || !withTotal.length ? null : (uAbsM3 / standardVolumeM3) * 100,
    status,
    correctionsInForce: runs.reduce((a, r) => a + r.correctionsInForce, 0),
    previousMonth: before,
    yearEarlier: yearBefore,
    changeFromPreviousMonthPercent: changePercent(standardVolumeM3, before),
    changeFromYearEarlierPercent: changePercent(standardVolumeM3, yearBefore),
    ...siteDirections(withTotal),
  };
}

/**
 * The site's reverse flow (the sum of its bi-directional meter runs' reverse parts; flowTimeS is
 * meter-run seconds) and its net: the site's forward total − that reverse, never netted per run
 * in place of the forward figures (issue 13 §11). Nothing when no meter run flowed in reverse.
 */
export function siteDirections(runs: MeterRunMonth[]): { reverse?: PeriodReverse; net?: PeriodNet } {
  const parts = runs.flatMap((r) => (r.reverse ? [r.reverse] : []));
  if (!parts.length) return {};
  const add = (pick: (p: PeriodReverse) => number) => parts.reduce((a, p) => a + pick(p), 0);
  const reverse: PeriodReverse = {
    flowTimeS: add((p) => p.flowTimeS),
    massKg: add((p) => p.massKg),
    volumeM3: add((p) => p.volumeM3),
    standardVolumeM3: add((p) => p.standardVolumeM3),
    energyJ: parts.some((p) => p.energyJ === null) ? null : add((p) => p.energyJ ?? 0),
  };
  const forward = (pick: (r: MeterRunMonth) => number | null) => runs.reduce((a, r) => a + (pick(r) ?? 0), 0);
  const net = netOf(
    {
      massKg: forward((r) => r.massKg),
      volumeM3: forward((r) => r.volumeM3),
      standardVolumeM3: forward((r) => r.standardVolumeM3),
      energyJ: runs.some((r) => r.energyJ === null) ? null : forward((r) => r.energyJ),
    },
    reverse,
  );
  return net ? { reverse, net } : { reverse };
}
