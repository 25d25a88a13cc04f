/**
 * The contract between the server's history jobs and the pure hourly computation: what the
 * server reads from the database for one hour of one meter run (HourInputs), and the hourly
 * record it stores (HourlyRecord, the quantity transaction record of API MPMS Ch. 21.1).
 * SI throughout: Pa (absolute for static pressure), K, kg, m³, J, s; times are epoch ms (UTC).
 */
import type { ElementSpec } from '../flow/flow-types';
import type { FluidSpec } from '../fluids';
import type { AccuracyKind } from '../uncertainty';
import type { PointTransmitter } from './sample-uncertainty';

export type Quality = 'good' | 'uncertain' | 'bad' | 'substituted';

/** One reading: value in SI (Pa for DP, Pa absolute for static pressure, K for temperature). */
export interface Sample {
  timeMs: number;
  value: number;
  quality: Quality;
}

/** The readings of one DP transmitter, sorted by time, with its calibrated range. */
export interface DpSeries {
  transmitterId: string;
  stackRole: 'single' | 'low' | 'high';
  lowerRangePa: number;
  upperRangePa: number;
  /** Stated accuracy, percent of span; accuracyKind says what kind of figure it is. */
  accuracyPercentOfSpan: number;
  /** 'expanded-k2' (the default when not given) or 'rectangular-limit' (converted by √3, GUM §4.3.7). */
  accuracyKind?: AccuracyKind;
  samples: Sample[];
}

/** An effective-dated configuration of a meter run: its element and fluid (the DESIGN.md case objects). */
export interface ConfigVersionInput {
  id: string;
  effectiveFromMs: number;
  element: ElementSpec;
  fluid: FluidSpec;
  /**
   * The element's constants in reverse flow (a cone or orifice may differ by direction; a calibrated
   * element has its own curve per direction). Present ⇔ the meter run is bi-directional from this version on.
   */
  reverseElement?: ElementSpec;
  /**
   * Only with reverseElement; 'dp-sign' when not given. 'dp-sign': a negative DP is reverse flow.
   * 'direction-input': the DP transmitters read magnitude and HourInputs.direction says which way.
   */
  directionSource?: DirectionSource;
}

export type DirectionSource = 'dp-sign' | 'direction-input';

export interface HourInputs {
  startMs: number;
  endMs: number;
  /** Data are complete up to here (= endMs for a past hour; "now" for the current hour). */
  asOfMs: number;
  /** One series (single) or two (stacked low + high); each includes the latest sample before startMs. */
  dp: DpSeries[];
  /** Pa absolute, sorted; includes the latest sample BEFORE startMs if any. */
  staticPressure: Sample[];
  /** K, sorted; includes the latest sample before startMs if any. */
  temperature: Sample[];
  /**
   * The direction input's samples (measure `flow-direction`, unit `sign`: > 0 forward, < 0 reverse,
   * 0 no flow), sorted, including the latest before startMs; held like P and T for holdLimitS.
   */
  direction?: Sample[];
  /**
   * The static pressure (span in Pa) and temperature (span in K) transmitters' stated accuracies,
   * when known: they enter each sample's uncertainty through the density (ISO 5167-1:2003 §8).
   */
  staticPressureTransmitter?: PointTransmitter;
  temperatureTransmitter?: PointTransmitter;
  /** Sorted by effectiveFromMs; the one in effect at a time applies from that time on. */
  configVersions: ConfigVersionInput[];
  base: { pressurePa: number; temperatureK: number };
  /** A P or T sample older than this is not used. */
  holdLimitS: number;
  /** A DP sample covers at most this long; longer gaps are missing time. */
  maxGapS: number;
  /** Hysteresis of a stacked pair, shares of the low-range transmitter's span (e.g. 0.9 / 0.8). */
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
  /**
   * No-flow cutoff, a share of the active DP transmitter's span: a DP below it (or ≤ 0) is valid
   * time without flow. A dated meter-run setting; NO_FLOW_CUTOFF_SHARE_OF_SPAN (0.005) when not given.
   */
  noFlowCutoffShare?: number;
  /**
   * The transmitter in use at the end of the previous hour (the previous record's finalStackChoice).
   * It is kept at startMs only while the pair of readings in force just before startMs is still in
   * force (found from the latest sample before startMs that dp includes); a reading arriving at
   * startMs is chosen on from it, as in a computation that runs through the boundary.
   */
  initialStackChoice?: 'low' | 'high';
}

/**
 * The figures of one flow direction over a record. The record's own figures are forward flow; the
 * reverse part of a bi-directional meter run is kept apart in this shape (never netted in a record).
 */
export interface DirectionPart {
  flowTimeS: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
  /** Magnitude, Pa, flow-weighted over this direction's flowing time. */
  averageDpPa: number | null;
  averagePressurePa: number | null;
  averageTemperatureK: number | null;
  integralValue: number | null;
  /** massKg = IMV × IV × flowTimeS. */
  integralMultiplierValue: number | null;
  uncertaintyPercent: number | null;
  uncertaintyBudget: { name: string; percent: number; source: string }[];
}

/** Bands of the DP reading as a share of the ACTIVE transmitter's span, percent. */
export type DpBandName = '0-10' | '10-25' | '25-50' | '50-100' | 'over';

export interface HourlyRecord {
  startMs: number;
  endMs: number;
  flowTimeS: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
  averageDpPa: number | null;
  averagePressurePa: number | null;
  averageTemperatureK: number | null;
  integralValue: number | null;
  /**
   * Integral multiplier value (API MPMS 21.1), kg/(√(Pa·kg/m³)·s)·s: massKg = IMV × IV × flowTimeS,
   * so a third party can recompute the quantity from the record alone; null without flow.
   * computeHour always sets it (optional only so records built by hand elsewhere still type-check).
   */
  integralMultiplierValue?: number | null;
  coverage: number;
  flags: string[];
  uncertaintyPercent: number | null;
  /**
   * The hour's uncertainty budget (ISO 5167-1:2003 §8): per term, its flow-weighted share of
   * U(qm)/qm in percent (sensitivity × input, k = 2) and where the input comes from. Empty without
   * flow. computeHour always sets it; not stored yet (optional so stored records still type-check).
   */
  uncertaintyBudget?: { name: string; percent: number; source: string }[];
  configVersionId: string | null;
  /**
   * Reverse flow of a bi-directional meter run, apart from the record's own (forward) figures;
   * null on a one-way meter run. computeHour always sets it (optional so records built by hand
   * elsewhere still type-check).
   */
  reverse?: DirectionPart | null;
  /**
   * Flowing time and mass per band of the DP as a share of the ACTIVE transmitter's span in the
   * direction of flow (both directions: the band times sum to flowTimeS + reverse.flowTimeS).
   */
  dpBands: Record<DpBandName, { timeS: number; massKg: number }>;
  /** Per transmitter id, the time its reading was the one in use (flowing or not; also when P or T was missing). */
  activeTransmitterTimeS: Record<string, number>;
  finalStackChoice: 'low' | 'high' | null;
}

/** The part of an hourly record that a roll-up sums (an HourlyRecord fits). */
export type RollUpRecord = Pick<
  HourlyRecord,
  | 'startMs'
  | 'endMs'
  | 'flowTimeS'
  | 'massKg'
  | 'volumeM3'
  | 'standardVolumeM3'
  | 'energyJ'
  | 'coverage'
  | 'flags'
  | 'uncertaintyPercent'
  | 'reverse'
>;

/** 'missing': the period has ended and nothing at all was recorded in it (coverage 0) — not complete. */
export type TotalStatus = 'provisional' | 'complete' | 'missing' | 'closed';

/** One entry of GET /api/meter-runs/:id/totals (DESIGN.md, "Interfaces"). */
export interface PeriodTotal {
  start: string;
  end: string;
  hours: number;
  flowTimeS: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
  coverage: number;
  flags: string[];
  uncertaintyPercent: number | null;
  status: TotalStatus;
  /** Reverse flow of the period: present only when some hour of it has a reverse part. */
  reverse?: PeriodReverse;
  /** Forward − reverse: present with reverse (energyJ null when either is null). */
  net?: PeriodNet;
}

export interface PeriodReverse {
  flowTimeS: number;
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
}

export interface PeriodNet {
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
}

/** A period [startMs, endMs) and its length in hours (23, 24 or 25 for a contract day). */
export interface PeriodBounds {
  startMs: number;
  endMs: number;
  hours: number;
}
