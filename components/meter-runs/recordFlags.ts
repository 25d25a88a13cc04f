/**
 * The flags of an hourly record or a total (GET /api/meter-runs/:id/totals) in words, each with
 * a shape so it reads without colour. `attention` flags are abnormal (the figure is less
 * trustworthy or incomplete) and are the only ones drawn in colour (ISA-101, TRADE.md §7);
 * `note` flags are facts about the record (a substitution, a configuration change) in grey.
 */
export interface RecordFlag {
  label: string;
  shape: string;
  level: 'attention' | 'note';
  /** One line for the reader who wonders what it means. */
  meaning: string;
}

const known: Record<string, RecordFlag> = {
  'low-in-range': {
    label: 'Low in range',
    shape: '▼',
    level: 'attention',
    meaning: 'DP spent time below 10 % of the span, where its error as a share of the reading grows.',
  },
  'over-range': {
    label: 'Over range',
    shape: '↑',
    level: 'attention',
    meaning: 'DP went above the transmitter’s upper range value.',
  },
  'reverse-flow': {
    label: 'Reverse flow',
    shape: '⇄',
    level: 'attention',
    meaning: 'DP showed flow in reverse on a one-way meter run; that time counts as no flow, not as forward flow.',
  },
  'outside-standard-limits': {
    label: 'Outside standard limits',
    shape: '⬡',
    level: 'attention',
    meaning: 'Reynolds number, pressure ratio or geometry outside the standard’s limits.',
  },
  'outside-calibration-range': {
    label: 'Outside calibration',
    shape: '◈',
    level: 'attention',
    meaning: 'Reynolds number outside the laboratory calibration’s points: C was held at the nearest end value.',
  },
  'missing-data': {
    label: 'Missing data',
    shape: '○',
    level: 'attention',
    meaning: 'Part of the period had no valid inputs (see coverage).',
  },
  'bad-quality': {
    label: 'Bad quality',
    shape: '✕',
    level: 'attention',
    meaning: 'Readings marked bad were left out.',
  },
  'calculation-error': {
    label: 'Calculation error',
    shape: '✕',
    level: 'attention',
    meaning: 'The flow could not be computed for part of the period.',
  },
  substituted: {
    label: 'Substituted',
    shape: '◇',
    level: 'note',
    meaning: 'Some readings are substitutes, not measurements.',
  },
  'config-changed': {
    label: 'Configuration changed',
    shape: '△',
    level: 'note',
    meaning: 'A configuration version took effect in this period.',
  },
  'energy-unavailable': {
    label: 'No energy',
    shape: '–',
    level: 'note',
    meaning: 'No heating value for this fluid, so no energy figure.',
  },
  'energy-data-unconfirmed': {
    label: 'Energy data unconfirmed',
    shape: '?',
    level: 'note',
    meaning:
      'The gas holds components whose ISO 6976 data no published worked example has confirmed yet, so the energy figure rests on unchecked table values.',
  },
};

/**
 * @param flag a flag code from the API
 * @returns its words, shape and level (an unknown code is shown as it is, as a note)
 */
export function recordFlag(flag: string): RecordFlag {
  return known[flag] ?? { label: flag, shape: '•', level: 'note', meaning: flag };
}
