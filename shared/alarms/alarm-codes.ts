/**
 * The alarm vocabulary of DESIGN.md ("Interfaces"): condition, state and priority codes, used by
 * the server, the API and the client alike. States are those of ISA-18.2 / IEC 62682 (TRADE.md §7).
 */
export const ALARM_CONDITIONS = [
  'dp-low-in-range',
  'dp-over-range',
  'stack-disagreement',
  'frozen',
  'stale',
  'bad-quality',
  'outside-standard-limits',
  'calibration-due',
  'calibration-overdue',
  'reconciliation-out-of-tolerance',
  'balance-out-of-tolerance',
  'care-due',
  'care-overdue',
  'reverse-flow',
] as const;
export type AlarmCondition = (typeof ALARM_CONDITIONS)[number];

/**
 * ISA-18.2 alarm states. "normal" closes an occurrence; "shelved" (operator, time-limited) and
 * "out-of-service" (maintenance) keep the condition tracked but not annunciated.
 */
export const ALARM_STATES = [
  'active-unacknowledged',
  'active-acknowledged',
  'returned-unacknowledged',
  'normal',
  'shelved',
  'out-of-service',
] as const;
export type AlarmState = (typeof ALARM_STATES)[number];

export const ALARM_PRIORITIES = ['high', 'medium', 'low'] as const;
export type AlarmPriority = (typeof ALARM_PRIORITIES)[number];

/** Conditions judged per transmitter (the others belong to the meter run as a whole). */
export const TRANSMITTER_CONDITIONS: readonly AlarmCondition[] = [
  'dp-low-in-range',
  'dp-over-range',
  'frozen',
  'stale',
  'bad-quality',
  'calibration-due',
  'calibration-overdue',
];

/** Conditions that only DP transmitters have. */
export const DP_ONLY_CONDITIONS: readonly AlarmCondition[] = ['dp-low-in-range', 'dp-over-range'];
