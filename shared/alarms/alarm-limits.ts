/**
 * Alarm limits: what each condition needs, its defaults, checks that refuse limits that make no
 * sense (naming the field), and the merge of meter-run and transmitter settings over the
 * defaults. Shares are fractions of the transmitter's span (0.1 = 10 %); times in seconds.
 */
import { ALARM_PRIORITIES, type AlarmCondition, type AlarmPriority } from './alarm-codes';

export interface AlarmLimits {
  enabled: boolean;
  priority: AlarmPriority;
  /** The condition must hold this long before the alarm is raised (ISA-18.2 on-delay). */
  onDelayS: number;
  /** The condition must be gone this long before the alarm clears (off-delay). */
  offDelayS: number;
  /** dp-low-in-range: below this share of the active span; dp-over-range: above it. */
  thresholdShareOfSpan?: number;
  /** Hysteresis: the level must come back past the threshold by this share before it clears. */
  deadbandShareOfSpan?: number;
  /** stack-disagreement: |low − high| above this share of the low-range span. */
  toleranceShareOfSpan?: number;
  /** frozen: the window that must show no variation. */
  windowS?: number;
  /** frozen: readings needed in the window. */
  minSamples?: number;
  /** frozen: standard deviation at or below this share of span is "no variation". */
  maxStdDevShareOfSpan?: number;
  /** stale: no reading for longer than this. */
  maxAgeS?: number;
  /** calibration-due, care-due: this many days before the due date. */
  dueSoonDays?: number;
}

export type AlarmLimitField = keyof AlarmLimits;

const common = ['enabled', 'priority', 'onDelayS', 'offDelayS'] as const;

/** The fields each condition takes (besides these, a field is refused). */
export const ALARM_LIMIT_FIELDS: Readonly<Record<AlarmCondition, readonly AlarmLimitField[]>> = {
  'dp-low-in-range': [...common, 'thresholdShareOfSpan', 'deadbandShareOfSpan'],
  'dp-over-range': [...common, 'thresholdShareOfSpan', 'deadbandShareOfSpan'],
  'stack-disagreement': [...common, 'toleranceShareOfSpan', 'deadbandShareOfSpan'],
  frozen: [...common, 'windowS', 'minSamples', 'maxStdDevShareOfSpan'],
  stale: [...common, 'maxAgeS'],
  'bad-quality': [...common],
  'outside-standard-limits': [...common],
  'calibration-due': [...common, 'dueSoonDays'],
  'calibration-overdue': [...common],
  'reconciliation-out-of-tolerance': [...common],
  'balance-out-of-tolerance': [...common],
  'care-due': [...common, 'dueSoonDays'],
  'care-overdue': [...common],
  'reverse-flow': [...common],
};

/**
 * Defaults. Priorities follow TRADE.md §7 (most alarms low, few high): high only where volume
 * goes unmeasured (a saturated DP under-registers flow); DP low in range is medium (the issue).
 * Delays are common practice for process alarms: a few minutes on, a minute off [mem].
 */
export const DEFAULT_ALARM_LIMITS: Readonly<Record<AlarmCondition, AlarmLimits>> = {
  // 10 % of span: below it a 0.075 %-of-span device is worse than 0.75 % of reading (TRADE.md §6).
  // Deadband 2 % of span: clears at 12 %, wider than a transmitter's noise (0.1 % of span or less [mem]).
  'dp-low-in-range': {
    enabled: true,
    priority: 'medium',
    onDelayS: 300,
    offDelayS: 60,
    thresholdShareOfSpan: 0.1,
    deadbandShareOfSpan: 0.02,
  },
  // Above 100 % of span the output saturates (4–20 mA limit near 20.8 mA, NAMUR NE 43 [mem]).
  'dp-over-range': {
    enabled: true,
    priority: 'high',
    onDelayS: 60,
    offDelayS: 60,
    thresholdShareOfSpan: 1,
    deadbandShareOfSpan: 0.02,
  },
  // 2 % of the low span: about 25 × a 0.075 % device's stated accuracy, so only a real fault trips it.
  'stack-disagreement': {
    enabled: true,
    priority: 'medium',
    onDelayS: 300,
    offDelayS: 60,
    toleranceShareOfSpan: 0.02,
    deadbandShareOfSpan: 0.005,
  },
  // 30 minutes without any variation (σ ≤ 0.001 % of span, far below any live signal's noise).
  frozen: {
    enabled: true,
    priority: 'medium',
    onDelayS: 0,
    offDelayS: 0,
    windowS: 1800,
    minSamples: 5,
    maxStdDevShareOfSpan: 1e-5,
  },
  // 10 minutes without a reading: twice the default sample gap of a meter run (300 s).
  stale: { enabled: true, priority: 'medium', onDelayS: 0, offDelayS: 0, maxAgeS: 600 },
  'bad-quality': { enabled: true, priority: 'medium', onDelayS: 30, offDelayS: 60 },
  'outside-standard-limits': { enabled: true, priority: 'low', onDelayS: 0, offDelayS: 0 },
  'calibration-due': { enabled: true, priority: 'low', onDelayS: 0, offDelayS: 0, dueSoonDays: 14 },
  'calibration-overdue': { enabled: true, priority: 'medium', onDelayS: 0, offDelayS: 0 },
  'reconciliation-out-of-tolerance': { enabled: true, priority: 'medium', onDelayS: 0, offDelayS: 0 },
  'balance-out-of-tolerance': { enabled: true, priority: 'medium', onDelayS: 0, offDelayS: 0 },
  // The element's care records (issue 11 §4) are judged as a transmitter's calibration is: same window and priorities.
  'care-due': { enabled: true, priority: 'low', onDelayS: 0, offDelayS: 0, dueSoonDays: 14 },
  'care-overdue': { enabled: true, priority: 'medium', onDelayS: 0, offDelayS: 0 },
  // Reverse flow on a one-way meter run is not counted (issue 13 §11): medium, judged hour by hour.
  'reverse-flow': { enabled: true, priority: 'medium', onDelayS: 0, offDelayS: 0 },
};

/** A limit that makes no sense; `field` names it (the API answers 400 with it). */
export class AlarmLimitError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(`checkAlarmLimits: ${field} ${message}`);
    this.name = 'AlarmLimitError';
  }
}

/**
 * Checks the limits of one condition (a complete set, i.e. after merging over the defaults).
 * @param condition the condition they are for
 * @param limits the merged limits
 * @returns the limits, unchanged
 * @throws AlarmLimitError naming the first field at fault
 */
export function checkAlarmLimits(condition: AlarmCondition, limits: AlarmLimits): AlarmLimits {
  const allowed = ALARM_LIMIT_FIELDS[condition];
  if (!allowed) throw new AlarmLimitError('condition', `is not an alarm condition (got ${condition})`);
  for (const key of Object.keys(limits)) {
    if (!allowed.includes(key as AlarmLimitField) && limits[key as AlarmLimitField] !== undefined) {
      throw new AlarmLimitError(key, `does not apply to ${condition} (it takes ${allowed.join(', ')})`);
    }
  }
  const number = (field: AlarmLimitField, test: (v: number) => boolean, rule: string) => {
    const v = limits[field];
    if (v === undefined) return;
    if (typeof v !== 'number' || !Number.isFinite(v) || !test(v))
      throw new AlarmLimitError(field, `${rule} (got ${String(v)})`);
  };
  if (typeof limits.enabled !== 'boolean') throw new AlarmLimitError('enabled', 'must be true or false');
  if (!ALARM_PRIORITIES.includes(limits.priority))
    throw new AlarmLimitError('priority', `must be one of ${ALARM_PRIORITIES.join(', ')}`);
  number('onDelayS', (v) => v >= 0, 'must be 0 or more seconds (a delay cannot be negative)');
  number('offDelayS', (v) => v >= 0, 'must be 0 or more seconds (a delay cannot be negative)');
  number('onDelayS', (v) => v <= 86_400, 'must be at most a day (86400 s)');
  number('offDelayS', (v) => v <= 86_400, 'must be at most a day (86400 s)');
  const threshold = limits.thresholdShareOfSpan;
  const deadband = limits.deadbandShareOfSpan ?? 0;
  number('deadbandShareOfSpan', (v) => v >= 0, 'must be 0 or more');
  number(
    'deadbandShareOfSpan',
    (v) => v < 1,
    'must be narrower than the transmitter’s range (below 1 = 100 % of span)',
  );
  if (condition === 'dp-low-in-range') {
    number('thresholdShareOfSpan', (v) => v > 0 && v <= 1, 'must be above 0 and at most 1 (100 % of span)');
    if (threshold !== undefined && threshold + deadband > 1) {
      throw new AlarmLimitError(
        'deadbandShareOfSpan',
        `is wider than the range: threshold + deadband = ${threshold + deadband} would clear above 100 % of span`,
      );
    }
  }
  if (condition === 'dp-over-range') {
    number('thresholdShareOfSpan', (v) => v > 0 && v <= 1.5, 'must be above 0 and at most 1.5 (150 % of span)');
    if (threshold !== undefined && deadband >= threshold) {
      throw new AlarmLimitError(
        'deadbandShareOfSpan',
        `is wider than the range: it must be below the threshold (${threshold})`,
      );
    }
  }
  if (condition === 'stack-disagreement') {
    number(
      'toleranceShareOfSpan',
      (v) => v > 0 && v <= 1,
      'must be above 0 and at most 1 (100 % of the low-range span)',
    );
    const tolerance = limits.toleranceShareOfSpan;
    if (tolerance !== undefined && deadband >= tolerance)
      throw new AlarmLimitError('deadbandShareOfSpan', `must be below the tolerance (${tolerance})`);
  }
  number('windowS', (v) => v >= 60 && v <= 7 * 86_400, 'must be between 60 s and 7 days');
  number('minSamples', (v) => Number.isInteger(v) && v >= 2, 'must be a whole number, 2 or more');
  number('maxStdDevShareOfSpan', (v) => v >= 0 && v < 1, 'must be 0 or more and below 1 (100 % of span)');
  number('maxAgeS', (v) => v > 0 && v <= 30 * 86_400, 'must be above 0 and at most 30 days');
  number(
    'dueSoonDays',
    (v) => Number.isInteger(v) && v >= 0 && v <= 366,
    'must be a whole number of days from 0 to 366',
  );
  return limits;
}

/**
 * The limits in force: defaults, then the meter run's settings, then the transmitter's.
 * @param condition the condition
 * @param meterRunSettings partial limits set for the meter run (or undefined)
 * @param transmitterSettings partial limits set for the transmitter (or undefined)
 * @returns complete limits
 */
export function effectiveAlarmLimits(
  condition: AlarmCondition,
  meterRunSettings?: Partial<AlarmLimits>,
  transmitterSettings?: Partial<AlarmLimits>,
): AlarmLimits {
  const out: AlarmLimits = { ...DEFAULT_ALARM_LIMITS[condition] };
  for (const layer of [meterRunSettings, transmitterSettings]) {
    if (!layer) continue;
    for (const [k, v] of Object.entries(layer)) if (v !== undefined) (out as unknown as Record<string, unknown>)[k] = v;
  }
  return out;
}
