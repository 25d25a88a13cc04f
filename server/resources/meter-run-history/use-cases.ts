import { notFound } from '../../errors';
import { contractDayBounds, contractDayOf, contractMonthBounds } from '../../../shared/history/contract-day';
import type { PeriodNet, TotalStatus } from '../../../shared/history/types';
import { netOf } from '../../history/net-flow';
import type { TimeWindow } from '../../http/params';
import type {
  MeterRunHistoryRepository,
  SiteCalendar,
  StoredHourlyRecord,
  StoredTotal,
  TrendTransmitter,
} from './repository';
import type { TotalsInterval } from './schema';

/**
 * A total with its status decided: stored for days and months, from the clock for hours and empty
 * periods; with net flow (forward − reverse) as its own figure where there is reverse flow.
 */
export type HistoryTotal = Omit<StoredTotal, 'status'> & { status: TotalStatus; net: PeriodNet | null };
export type HistoryHourlyRecord = Omit<StoredHourlyRecord, 'status'> & { status: TotalStatus; net: PeriodNet | null };

/** An hourly record answers at most this many hours (83 days) per request. */
const HOURLY_RECORDS_LIMIT = 2000;
/** Bounds the fill of empty periods: 4000 contract days is more than the longest window allows. */
const MAX_FILLED_PERIODS = 4000;

/**
 * A stored status stands; otherwise a period still running is provisional, and one that has ended
 * is complete, or missing when nothing at all was recorded in it (coverage 0).
 */
const statusAt = (status: TotalStatus | null, endMs: number, nowMs: number, coverage: number): TotalStatus =>
  status ?? (endMs > nowMs ? 'provisional' : coverage > 0 ? 'complete' : 'missing');

/**
 * The site calendar of a meter run, which also proves the meter run exists.
 * @throws not found when the meter run does not exist
 */
export async function meterRunCalendar(repository: MeterRunHistoryRepository, meterRunId: string) {
  const calendar = await repository.siteCalendar(meterRunId);
  if (!calendar) throw notFound('Meter run');
  return calendar;
}

/**
 * Totals of a meter run per hour, contract day or contract month over a window. Every contract
 * day (month) in the window from the one in which the meter run's history starts appears, with
 * zero and coverage 0 (status missing) where nothing was recorded; periods that ended before the
 * history starts are no records and are not listed; hours appear only where a record exists.
 */
export async function totalsForWindow(
  repository: MeterRunHistoryRepository,
  request: TimeWindow & { meterRunId: string; interval: TotalsInterval; calendar: SiteCalendar },
  nowMs = Date.now(),
): Promise<HistoryTotal[]> {
  const { meterRunId, interval, calendar, fromMs, toMs } = request;
  const found = (await repository.totals(meterRunId, interval, fromMs, toMs)).map((t) => ({
    ...t,
    status: statusAt(t.status, t.endMs, nowMs, t.coverage),
    net: netOf(t, t.reverse),
  }));
  if (interval === 'hour') return found;
  // Stored rows carry their own bounds, so the calendar (luxon) is consulted only for the
  // periods that have no row: a year of daily totals stays a few milliseconds.
  const { timeZone, contractHour } = calendar;
  const bounds = (startMs: number) => {
    const name = contractDayOf(startMs, timeZone, contractHour);
    return interval === 'day'
      ? contractDayBounds(name, timeZone, contractHour)
      : contractMonthBounds(name.slice(0, 7), timeZone, contractHour);
  };
  const out: HistoryTotal[] = [];
  // Nothing is filled before the contract day (month) in which the meter run's history starts.
  // (A meter run without any version has no history: nothing is filled.)
  let cursor = calendar.historyStartMs === null ? toMs : bounds(Math.max(fromMs, calendar.historyStartMs)).startMs;
  const fillUntil = (limitMs: number) => {
    for (let guard = 0; cursor < limitMs && guard < MAX_FILLED_PERIODS; guard++) {
      const b = bounds(cursor);
      out.push(emptyTotal(b.startMs, b.endMs, b.hours, nowMs));
      cursor = b.endMs;
    }
  };
  for (const total of found) {
    fillUntil(total.startMs);
    out.push(total);
    cursor = Math.max(cursor, total.endMs);
  }
  fillUntil(toMs);
  return out;
}

/** A period with nothing recorded: zero quantities, coverage 0, flagged as missing data. */
function emptyTotal(startMs: number, endMs: number, hours: number, nowMs: number): HistoryTotal {
  return {
    startMs,
    endMs,
    hours,
    flowTimeS: 0,
    massKg: 0,
    volumeM3: 0,
    standardVolumeM3: 0,
    energyJ: null,
    coverage: 0,
    flags: ['missing-data'],
    uncertaintyPercent: null,
    status: statusAt(null, endMs, nowMs, 0),
    reverse: null,
    net: null,
    version: null,
    firstMassKg: null,
    firstStandardVolumeM3: null,
  };
}

/**
 * The hourly records of a meter run starting in a window (at most 2000).
 * @throws not found when the meter run does not exist
 */
export async function hourlyRecordsForWindow(
  repository: MeterRunHistoryRepository,
  request: TimeWindow & { meterRunId: string },
  nowMs = Date.now(),
): Promise<HistoryHourlyRecord[]> {
  await meterRunCalendar(repository, request.meterRunId);
  const records = await repository.hourlyRecords(
    request.meterRunId,
    request.fromMs,
    request.toMs,
    HOURLY_RECORDS_LIMIT,
  );
  return records.map((r) => ({
    ...r,
    status: statusAt(r.status, r.endMs, nowMs, r.coverage),
    net: netOf(r, r.reverse),
  }));
}

/**
 * How many hours of the meter run wait for recomputation (late data, a back-dated change).
 * @throws not found when the meter run does not exist
 */
export async function recomputeStatus(repository: MeterRunHistoryRepository, meterRunId: string) {
  await meterRunCalendar(repository, meterRunId);
  return repository.recomputeQueue(meterRunId);
}

/** One point of a trend: a time slice's readings, timed at the slice's start. */
export interface TrendPoint {
  timeMs: number;
  min: number;
  max: number;
  mean: number;
  count: number;
}

export interface Trend {
  buckets: number;
  series: (TrendTransmitter & { points: TrendPoint[] })[];
  /** Per hour; `partial` marks the hour still in progress, whose rate is over the seconds elapsed so far. */
  flow: {
    startMs: number;
    massFlowKgPerS: number;
    standardVolumeFlowM3PerS: number;
    coverage: number;
    partial: boolean;
  }[];
}

/**
 * Downsampled trends: per transmitter, min / max / mean of each of `buckets` equal time slices,
 * computed in the database so a month at 1 Hz stays a few hundred points; flow per hour from
 * the hourly records (the record's quantity over its length, or over the seconds elapsed so far
 * for the hour still in progress, marked partial).
 * @throws not found when the meter run does not exist
 */
export async function trendForWindow(
  repository: MeterRunHistoryRepository,
  request: TimeWindow & { meterRunId: string; buckets: number },
  nowMs = Date.now(),
): Promise<Trend> {
  const { meterRunId, fromMs, toMs, buckets } = request;
  await meterRunCalendar(repository, meterRunId);
  const widthMs = (toMs - fromMs) / buckets;
  // The transmitters' slices and the hourly flows are asked at once, on connections of their own:
  // a week at 1 Hz is a scan of a few hundred thousand readings per transmitter, and the database
  // can run them side by side (issue 15: ≤ 100 ms). The answer keeps the transmitters' order.
  const transmitters = await repository.transmitters(meterRunId);
  const [slicesOf, hourlyFlows] = await Promise.all([
    Promise.all(transmitters.map((t) => repository.readingBuckets(t.id, fromMs, toMs, buckets))),
    repository.hourlyFlows(meterRunId, fromMs, toMs),
  ]);
  const series: Trend['series'] = transmitters.map((transmitter, i) => ({
    ...transmitter,
    points: slicesOf[i].map((s) => ({
      timeMs: fromMs + (s.bucket - 1) * widthMs,
      min: s.min,
      max: s.max,
      mean: s.mean,
      count: s.count,
    })),
  }));
  const flow = hourlyFlows.map((h) => {
    // The hour still in progress holds only the seconds elapsed so far: dividing by the whole hour
    // would show a plunge in flow that is not there.
    const partial = h.endMs > nowMs && nowMs > h.startMs;
    const seconds = ((partial ? nowMs : h.endMs) - h.startMs) / 1000;
    return {
      startMs: h.startMs,
      massFlowKgPerS: h.massKg / seconds,
      standardVolumeFlowM3PerS: h.standardVolumeM3 / seconds,
      coverage: h.coverage,
      partial,
    };
  });
  return { buckets, series, flow };
}
