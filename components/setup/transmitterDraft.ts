/**
 * A new transmitter as typed in the form, where it starts, and the rule of a meter run's DP
 * transmitters (one single, or one stacked pair) that the form says before sending.
 */
import type { Transmitter } from '@/hooks/api/transmitters';
import type { Measures, TransmitterUnitCode } from './transmitterUnits';

export interface TransmitterDraft {
  tag: string;
  measures: Measures;
  unit: TransmitterUnitCode;
  pressureReference: 'absolute' | 'gauge';
  lowerRange: string;
  upperRange: string;
  stackRole: 'single' | 'low' | 'high';
  accuracyPercentOfSpan: string;
  /** How the data sheet states the accuracy: a k = 2 uncertainty or a ± limit (GUM §4.3.7). */
  accuracyKind: 'expanded-k2' | 'rectangular-limit';
  calibrationDue: string;
}

/** A new transmitter: a DP transmitter ranged from zero in the site's usual DP unit. */
export function emptyDraft(us: boolean): TransmitterDraft {
  return {
    tag: '',
    measures: 'differential-pressure',
    unit: us ? 'inH2O-60F' : 'kPa',
    pressureReference: 'absolute',
    lowerRange: '0',
    upperRange: '',
    stackRole: 'single',
    accuracyPercentOfSpan: '0.075',
    accuracyKind: 'expanded-k2',
    calibrationDue: '',
  };
}

/** The unit a transmitter of this kind starts in on a site of these units. */
export function defaultUnit(what: Measures, us: boolean): TransmitterUnitCode {
  if (what === 'flow-direction') return 'sign';
  if (what === 'temperature') return us ? 'degF' : 'degC';
  if (what === 'static-pressure') return us ? 'psi' : 'bar';
  return us ? 'inH2O-60F' : 'kPa';
}

/**
 * A meter run's DP comes from one transmitter or from one stacked pair (a low and a high range);
 * the history cannot choose among more (shared/history/dp-selector.ts), so the form says so first.
 * @returns the problem with adding a DP transmitter of this role, or null
 */
export function dpRoleProblem(role: TransmitterDraft['stackRole'], existing: Transmitter[]): string | null {
  const dps = existing.filter((t) => t.measures === 'differential-pressure');
  const single = dps.find((t) => t.stackRole === 'single');
  if (role === 'single' && dps.length > 0) {
    return `this meter run already has its DP from ${dps.map((t) => t.tag).join(' and ')}: a second DP transmitter must make a stacked pair (low and high range) with it`;
  }
  if (role !== 'single' && single) {
    return `this meter run has a single DP transmitter (${single.tag}): a stacked pair needs both of its transmitters marked low and high`;
  }
  return null;
}
