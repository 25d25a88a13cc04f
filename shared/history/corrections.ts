/**
 * Corrections of hourly records (issue 9 §6, §8), pure: how an approved correction changes a
 * computed record, how substituted readings are laid over stored ones, and the estimates for
 * missing time: from the same hours of previous days, or for a well from its sales meter minus the
 * other wells. SI and epoch milliseconds throughout.
 *
 * A record [rs, re) and a correction [cs, ce) overlap for `overlap` ms; the record's share is
 * overlap / (re − rs) and the correction's share is overlap / (ce − cs).
 * - A quantity substitution (massKg M over the correction's period) gives the record M × the
 *   correction's share (pro rata by time), and keeps its own computed mass for the part of the
 *   record outside the correction (pro rata by time). Volume, standard volume and energy follow
 *   mass at the record's own ratios (its own density and heating value that hour) when it has
 *   flow; a record without flow (the usual gap) takes the ratios of the meter run's last records
 *   with flow before the correction (`fallbackRatios`); without either, only mass changes.
 * - An adjustment multiplies every quantity by 1 + (factor − 1) × the record's share, of both
 *   directions on a bi-directional hour (issue 13 §11): a factor corrects a transmitter or the
 *   element, which measure both ways.
 * - A quantity substitution is forward flow: it names no direction, so the server refuses one on a
 *   bi-directional meter run (400 naming massKg) and substituted readings are the way there. Should
 *   a record with a reverse part meet one, the reverse part is kept as computed and the DP bands
 *   (which hold both directions) are scaled by the change of the total of both.
 * - Every record a correction touches is flagged 'corrected', and 'estimated' when the
 *   correction came from an estimate. A substituted quantity carries the estimate's uncertainty
 *   (an estimate), or none (a quantity typed by a person has no stated uncertainty).
 */
import type { DirectionPart, DpBandName, HourlyRecord, Sample } from './types';

/** Quantities per kilogram, to carry a substituted mass into volume, standard volume and energy. */
export interface QuantityRatios {
  volumeM3PerKg: number;
  standardVolumeM3PerKg: number;
  energyJPerKg: number | null;
}

/** One approved correction as the computation applies it. */
export interface CorrectionToApply {
  id: string;
  startMs: number;
  endMs: number;
  kind: 'substitute' | 'adjust';
  /** A quantity substitution: the mass of the whole period [startMs, endMs). */
  massKg: number | null;
  factor: number | null;
  /** A reading substitution (laid over the readings before computing; see substituteSamples). */
  readings: boolean;
  origin: 'manual' | 'estimate';
  /** The estimate's expanded uncertainty, percent (origin 'estimate'). */
  estimateUncertaintyPercent: number | null;
  fallbackRatios: QuantityRatios | null;
}

const addFlag = (flags: string[], flag: string) => (flags.includes(flag) ? flags : [...flags, flag]);

function overlapMs(record: { startMs: number; endMs: number }, c: { startMs: number; endMs: number }): number {
  return Math.max(0, Math.min(record.endMs, c.endMs) - Math.max(record.startMs, c.startMs));
}

function scaleBands(bands: HourlyRecord['dpBands'], scale: number): HourlyRecord['dpBands'] {
  const out = {} as HourlyRecord['dpBands'];
  for (const [band, v] of Object.entries(bands) as [DpBandName, { timeS: number; massKg: number }][]) {
    out[band] = { timeS: v.timeS, massKg: v.massKg * scale };
  }
  return out;
}

function ratiosOf(record: HourlyRecord): QuantityRatios | null {
  if (!(record.massKg > 0)) return null;
  return {
    volumeM3PerKg: record.volumeM3 / record.massKg,
    standardVolumeM3PerKg: record.standardVolumeM3 / record.massKg,
    energyJPerKg: record.energyJ === null ? null : record.energyJ / record.massKg,
  };
}

function substituteQuantity(record: HourlyRecord, c: CorrectionToApply, overlap: number): HourlyRecord {
  const recordShare = overlap / (record.endMs - record.startMs);
  const keep = 1 - recordShare;
  const substitutedKg = (c.massKg ?? 0) * (overlap / (c.endMs - c.startMs));
  const ratios = ratiosOf(record) ?? c.fallbackRatios;
  const keptKg = record.massKg * keep;
  const massKg = keptKg + substitutedKg;
  let energyJ: number | null;
  if (ratios && ratios.energyJPerKg !== null)
    energyJ = (record.energyJ ?? 0) * keep + substitutedKg * ratios.energyJPerKg;
  else energyJ = record.energyJ === null ? null : record.energyJ * keep;
  // Mass-weighted: the kept part keeps its own uncertainty, the substituted part has the estimate's (or none).
  const substitutedU = c.origin === 'estimate' ? c.estimateUncertaintyPercent : null;
  let uncertaintyPercent: number | null;
  if (!(massKg > 0)) uncertaintyPercent = record.uncertaintyPercent;
  else if ((keptKg > 0 && record.uncertaintyPercent === null) || (substitutedKg > 0 && substitutedU === null))
    uncertaintyPercent = null;
  else uncertaintyPercent = (keptKg * (record.uncertaintyPercent ?? 0) + substitutedKg * (substitutedU ?? 0)) / massKg;
  return {
    ...record,
    massKg,
    volumeM3: record.volumeM3 * keep + substitutedKg * (ratios?.volumeM3PerKg ?? 0),
    standardVolumeM3: record.standardVolumeM3 * keep + substitutedKg * (ratios?.standardVolumeM3PerKg ?? 0),
    energyJ,
    uncertaintyPercent,
    dpBands: bandsAfterSubstitution(record, massKg),
  };
}

/** The DP bands hold both directions' mass: scale them by the change of that total, the reverse part unchanged. */
function bandsAfterSubstitution(record: HourlyRecord, forwardKg: number): HourlyRecord['dpBands'] {
  const reverseKg = record.reverse?.massKg ?? 0;
  const before = record.massKg + reverseKg;
  return before > 0 ? scaleBands(record.dpBands, (forwardKg + reverseKg) / before) : record.dpBands;
}

/** A direction's part scaled like the record's own quantities (its rates and averages stay). */
function scalePart(part: DirectionPart, scale: number): DirectionPart {
  return {
    ...part,
    massKg: part.massKg * scale,
    volumeM3: part.volumeM3 * scale,
    standardVolumeM3: part.standardVolumeM3 * scale,
    energyJ: part.energyJ === null ? null : part.energyJ * scale,
  };
}

function adjust(record: HourlyRecord, factor: number, overlap: number): HourlyRecord {
  const scale = 1 + (factor - 1) * (overlap / (record.endMs - record.startMs));
  return {
    ...record,
    massKg: record.massKg * scale,
    volumeM3: record.volumeM3 * scale,
    standardVolumeM3: record.standardVolumeM3 * scale,
    energyJ: record.energyJ === null ? null : record.energyJ * scale,
    dpBands: scaleBands(record.dpBands, scale),
    ...(record.reverse ? { reverse: scalePart(record.reverse, scale) } : {}),
  };
}

/**
 * Applies the corrections, in the order given (oldest approval first), to one computed record.
 * @returns the corrected record, or the same object when no correction overlaps it
 */
export function correctRecord(record: HourlyRecord, corrections: readonly CorrectionToApply[]): HourlyRecord {
  let out = record;
  for (const c of corrections) {
    const overlap = overlapMs(record, c);
    if (overlap <= 0) continue;
    if (c.kind === 'adjust' && c.factor !== null) out = adjust(out, c.factor, overlap);
    else if (c.kind === 'substitute' && c.massKg !== null) out = substituteQuantity(out, c, overlap);
    let flags = addFlag(out.flags, 'corrected');
    if (c.origin === 'estimate') flags = addFlag(flags, 'estimated');
    out = { ...out, flags };
  }
  return out;
}

/** Substituted readings are this far apart at most (and never further than a sample may cover). */
export const SUBSTITUTE_SAMPLE_STEP_MS = 60_000;

/**
 * Lays substituted samples (quality 'substituted') over a time-sorted series inside
 * [startMs, endMs). A sample covers at most `coverMs` (a DP sample maxGapS, a P or T sample the
 * hold limit), so substituted samples are written every min(coverMs, one minute) from startMs.
 * At endMs the stored series takes over again: the stored sample that would have been in force
 * at endMs is repeated there (if it was still within coverMs); if none was, a DP series gets a
 * bad sample at endMs, so the time after the period stays missing as it was. (A P or T series
 * gets nothing: its last substituted value may then be held past endMs, up to the hold limit,
 * until a stored reading arrives.)
 * @param value the substituted value in SI, or 'hold' for the latest usable stored value before startMs
 * @returns the new series, or the series unchanged when there is nothing to hold
 */
export function substituteSamples(
  samples: readonly Sample[],
  startMs: number,
  endMs: number,
  value: number | 'hold',
  options: { coverMs: number; markGapAfter: boolean },
): Sample[] {
  const before = samples.filter((s) => s.timeMs < startMs);
  const after = samples.filter((s) => s.timeMs >= endMs);
  let v: number;
  if (value === 'hold') {
    const held = [...before].reverse().find((s) => s.quality !== 'bad' && Number.isFinite(s.value));
    if (!held) return [...samples];
    v = held.value;
  } else v = value;
  const stepMs = Math.min(options.coverMs, SUBSTITUTE_SAMPLE_STEP_MS);
  const substituted: Sample[] = [];
  for (let t = startMs; t < endMs; t += stepMs) substituted.push({ timeMs: t, value: v, quality: 'substituted' });
  const tail: Sample[] = [];
  if (!(after.length && after[0].timeMs === endMs)) {
    const inForce = [...samples].reverse().find((s) => s.timeMs < endMs);
    if (inForce && inForce.timeMs + options.coverMs > endMs) tail.push({ ...inForce, timeMs: endMs });
    else if (options.markGapAfter) tail.push({ timeMs: endMs, value: Number.NaN, quality: 'bad' });
  }
  return [...before, ...substituted, ...tail, ...after];
}

/**
 * Two-sided 95 % critical values of Student's t (the 0.975 quantile) for 1–30 degrees of freedom,
 * from the table of NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.2.
 */
const T_975 = [
  12.706, 4.303, 3.182, 2.776, 2.571, 2.447, 2.365, 2.306, 2.262, 2.228, 2.201, 2.179, 2.16, 2.145, 2.131, 2.12, 2.11,
  2.101, 2.093, 2.086, 2.08, 2.074, 2.069, 2.064, 2.06, 2.056, 2.052, 2.048, 2.045, 2.042,
];

/** @returns t(0.975, df); beyond 30 degrees of freedom the value for 30 (slightly conservative) */
export function studentT975(degreesOfFreedom: number): number {
  if (!(degreesOfFreedom >= 1)) throw new Error(`studentT975: degreesOfFreedom must be ≥ 1 (got ${degreesOfFreedom})`);
  return T_975[Math.min(Math.floor(degreesOfFreedom), 30) - 1];
}

/** The same hour on previous days: its masses (kg) from records with full coverage. */
export interface EstimateHour {
  startMs: number;
  previousMassesKg: number[];
}

export type PreviousDaysEstimate =
  | {
      ok: true;
      massKg: number;
      /** Expanded (95 %) uncertainty of the estimate, percent of massKg (null when massKg is 0). */
      uncertaintyPercent: number | null;
      hours: { startMs: number; days: number; meanKg: number; standardDeviationKg: number }[];
    }
  | { ok: false; problem: string };

/**
 * The estimate for missing hours from the same hours of previous days: each hour is the mean of
 * its n previous values. Its uncertainty is a 95 % prediction interval for a new value from n
 * values, t(0.975, n − 1) × s × √(1 + 1/n) (s the sample standard deviation), and the hours'
 * intervals are added (taken as fully correlated: a well's day-to-day swing moves neighbouring
 * hours together, so adding is the cautious choice).
 * @returns the estimate, or why none can be made (an hour with fewer than two previous values)
 */
export function estimateFromPreviousDays(hours: readonly EstimateHour[]): PreviousDaysEstimate {
  if (!hours.length) return { ok: false, problem: 'the period holds no hour' };
  const out: { startMs: number; days: number; meanKg: number; standardDeviationKg: number }[] = [];
  let massKg = 0;
  let expandedKg = 0;
  for (const h of hours) {
    const n = h.previousMassesKg.length;
    if (n < 2) {
      return {
        ok: false,
        problem: `the hour starting ${new Date(h.startMs).toISOString()} has ${n} complete previous day${n === 1 ? '' : 's'}; an estimate needs two`,
      };
    }
    const mean = h.previousMassesKg.reduce((a, b) => a + b, 0) / n;
    const s = Math.sqrt(h.previousMassesKg.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
    massKg += mean;
    expandedKg += studentT975(n - 1) * s * Math.sqrt(1 + 1 / n);
    out.push({ startMs: h.startMs, days: n, meanKg: mean, standardDeviationKg: s });
  }
  return { ok: true, massKg, uncertaintyPercent: massKg > 0 ? (expandedKg / massKg) * 100 : null, hours: out };
}

/** One hourly record of a balance-group member, as the sales-meter estimate reads it. */
export interface MemberHourRecord {
  startMs: number;
  endMs: number;
  massKg: number;
  standardVolumeM3: number;
  coverage: number;
  flags: readonly string[];
  /** Expanded (95 %) uncertainty, percent of massKg; null when the record has none. */
  uncertaintyPercent: number | null;
}

/** A member of the balance group with its records over the estimate's period. */
export interface EstimateMember {
  meterRunId: string;
  tag: string;
  records: readonly MemberHourRecord[];
}

/** One member's quantities over the period, as the estimate used them. */
export interface MemberQuantity {
  meterRunId: string;
  tag: string;
  massKg: number;
  standardVolumeM3: number;
  /** Expanded uncertainty, kg (null when a record had none). */
  expandedUncertaintyKg: number | null;
}

export type SalesMeterEstimate =
  | {
      ok: true;
      massKg: number;
      standardVolumeM3: number;
      /** Expanded (95 %) uncertainty of the estimate, percent of massKg (null when unknown or massKg is 0). */
      uncertaintyPercent: number | null;
      expandedUncertaintyKg: number | null;
      sales: MemberQuantity;
      otherWells: MemberQuantity[];
      allowance: { massKg: number; standardVolumeM3: number };
    }
  | { ok: false; problem: string };

/** A record counts towards the estimate with (nearly) full coverage and when it is not itself an estimate. */
export const SALES_ESTIMATE_MIN_COVERAGE = 0.99;

/**
 * Sums a member's records over [startMs, endMs), or says why they are not complete: every instant
 * of the period must lie in a record with coverage ≥ 0.99 that is not estimated (an hour split by a
 * configuration version is two records, so time is counted, not records). The hours of one meter
 * share its systematic errors, so their absolute uncertainties add (fully correlated), as the
 * roll-up's mass-weighted percent does.
 */
function memberQuantity(
  member: EstimateMember,
  startMs: number,
  endMs: number,
): { ok: true; q: MemberQuantity } | { ok: false; problem: string } {
  let coveredMs = 0;
  let massKg = 0;
  let standardVolumeM3 = 0;
  let expandedUncertaintyKg: number | null = 0;
  for (const r of member.records) {
    if (r.endMs <= startMs || r.startMs >= endMs) continue;
    if (r.startMs < startMs || r.endMs > endMs)
      return { ok: false, problem: `${member.tag} has a record crossing the period's edge` };
    if (!(r.coverage >= SALES_ESTIMATE_MIN_COVERAGE) || r.flags.includes('estimated')) continue;
    coveredMs += r.endMs - r.startMs;
    massKg += r.massKg;
    standardVolumeM3 += r.standardVolumeM3;
    if (r.uncertaintyPercent === null) {
      if (r.massKg !== 0) expandedUncertaintyKg = null;
    } else if (expandedUncertaintyKg !== null)
      expandedUncertaintyKg += (Math.abs(r.massKg) * r.uncertaintyPercent) / 100;
  }
  if (coveredMs < endMs - startMs)
    return {
      ok: false,
      problem: `${member.tag} has complete, not estimated records for ${(coveredMs / 3_600_000).toFixed(2)} of the ${((endMs - startMs) / 3_600_000).toFixed(2)} hours`,
    };
  return {
    ok: true,
    q: { meterRunId: member.meterRunId, tag: member.tag, massKg, standardVolumeM3, expandedUncertaintyKg },
  };
}

/**
 * The estimate for a well's missing period [startMs, endMs) from its balance group: the sales
 * meter (the group's one outlet) minus the other wells (the other inlets) minus the allowance.
 *
 * The group balances when Σ inlets − sales − allowance = 0 (shared/balance/station-balance.ts).
 * - Allowance a percent of the inlet: with I = well + Σ others, I − S − (a/100)·I = 0, so
 *   I = S / (1 − a/100) and well = S / (1 − a/100) − Σ others. The allowance is a share of the
 *   inlet's gas, so the same share of its mass as of its standard volume: the formula holds for both.
 * - Allowance a fixed standard volume A for the period (the daily allowance × hours / 24):
 *   well = S + A − Σ others; in mass, A is taken at the sales meter's mass per standard m³ over the period.
 * Uncertainty (JCGM 100:2008 GUM §5.1.2, eq. 10, members uncorrelated, absolute): the sales
 * meter's sensitivity is 1 / (1 − a/100) (percent allowance) or 1 (fixed), each other well's −1,
 * the allowance exact: U² = (c_S·U_S)² + Σ U_i²; reported as a percent of the estimate's mass.
 * @returns the estimate, or why none can be made (a member's records incomplete, the result negative)
 */
export function estimateFromSalesMeter(input: {
  startMs: number;
  endMs: number;
  sales: EstimateMember;
  otherWells: readonly EstimateMember[];
  allowance: { percent: number } | { standardVolumeM3: number };
}): SalesMeterEstimate {
  const { startMs, endMs } = input;
  if (!(endMs > startMs)) return { ok: false, problem: 'the period holds no hour' };
  const sales = memberQuantity(input.sales, startMs, endMs);
  if (!sales.ok) return sales;
  const others: MemberQuantity[] = [];
  for (const w of input.otherWells) {
    const q = memberQuantity(w, startMs, endMs);
    if (!q.ok) return q;
    others.push(q.q);
  }
  const S = sales.q;
  const otherMassKg = others.reduce((a, w) => a + w.massKg, 0);
  const otherVolumeM3 = others.reduce((a, w) => a + w.standardVolumeM3, 0);
  let salesSensitivity: number;
  let allowance: { massKg: number; standardVolumeM3: number };
  if ('percent' in input.allowance) {
    const share = input.allowance.percent / 100;
    if (!(share >= 0 && share < 1))
      return { ok: false, problem: `the allowance ${input.allowance.percent} % is not below 100 %` };
    salesSensitivity = 1 / (1 - share);
    // allowance = a·I = S/(1 − a) − S
    allowance = {
      massKg: S.massKg * (salesSensitivity - 1),
      standardVolumeM3: S.standardVolumeM3 * (salesSensitivity - 1),
    };
  } else {
    salesSensitivity = 1;
    const kgPerM3 = S.standardVolumeM3 > 0 ? S.massKg / S.standardVolumeM3 : 0;
    allowance = {
      massKg: input.allowance.standardVolumeM3 * kgPerM3,
      standardVolumeM3: input.allowance.standardVolumeM3,
    };
  }
  const massKg = S.massKg + allowance.massKg - otherMassKg;
  const standardVolumeM3 = S.standardVolumeM3 + allowance.standardVolumeM3 - otherVolumeM3;
  if (massKg < 0)
    return {
      ok: false,
      problem: `the other wells (${otherMassKg.toFixed(1)} kg) exceed the sales meter ${S.tag} with the allowance (${(S.massKg + allowance.massKg).toFixed(1)} kg)`,
    };
  let expandedUncertaintyKg: number | null = null;
  if (S.expandedUncertaintyKg !== null && others.every((w) => w.expandedUncertaintyKg !== null)) {
    const sumSquares =
      (salesSensitivity * S.expandedUncertaintyKg) ** 2 +
      others.reduce((a, w) => a + (w.expandedUncertaintyKg ?? 0) ** 2, 0);
    expandedUncertaintyKg = Math.sqrt(sumSquares);
  }
  return {
    ok: true,
    massKg,
    standardVolumeM3,
    uncertaintyPercent: expandedUncertaintyKg !== null && massKg > 0 ? (expandedUncertaintyKg / massKg) * 100 : null,
    expandedUncertaintyKg,
    sales: S,
    otherWells: others,
    allowance,
  };
}
