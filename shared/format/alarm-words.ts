/**
 * Alarm codes (shared/alarms/alarm-codes.ts, DESIGN.md) in the words people read: the one source
 * for mails, screens and exports alike (components/alarms/alarmWords.ts uses these). A code not
 * listed here is shown as it came, never dropped.
 */
const conditionWords: Record<string, string> = {
  'dp-low-in-range': 'DP low in range',
  'dp-over-range': 'DP over range',
  'stack-disagreement': 'Stacked DP pair disagree',
  frozen: 'Transmitter frozen',
  stale: 'Transmitter silent',
  'bad-quality': 'Bad-quality readings',
  'outside-standard-limits': "Outside the standard's limits",
  'calibration-due': 'Calibration due soon',
  'calibration-overdue': 'Calibration overdue',
  'reconciliation-out-of-tolerance': 'Reconciliation out of tolerance',
  'balance-out-of-tolerance': 'Balance out of tolerance',
  'care-due': 'Element care due soon',
  'care-overdue': 'Element care overdue',
  'reverse-flow': 'Reverse flow on a one-way meter run',
};

/** ISA-18.2 / IEC 62682 names of the states. */
const stateWords: Record<string, string> = {
  'active-unacknowledged': 'Active, unacknowledged',
  'active-acknowledged': 'Active, acknowledged',
  'returned-unacknowledged': 'Returned to normal, unacknowledged',
  normal: 'Normal',
  shelved: 'Shelved',
  'out-of-service': 'Out of service',
};

/** @returns e.g. "DP low in range" for "dp-low-in-range" */
export function alarmConditionWords(condition: string): string {
  return conditionWords[condition] ?? condition;
}

/** @returns the state's ISA-18.2 name, e.g. "Active, unacknowledged" for "active-unacknowledged" */
export function alarmStateName(state: string): string {
  return stateWords[state] ?? state;
}

/** @returns e.g. "active, unacknowledged" for "active-unacknowledged" (lower case: it sits inside a sentence) */
export function alarmStateWords(state: string): string {
  const name = stateWords[state];
  return name ? name[0].toLowerCase() + name.slice(1) : state;
}

/** @returns e.g. "High" for "high" */
export function alarmPriorityWords(priority: string): string {
  return priority ? priority[0].toUpperCase() + priority.slice(1) : priority;
}
