import type { Transmitter } from '@/hooks/api/transmitters';
import { defaultUnit, dpRoleProblem, emptyDraft } from './transmitterDraft';

const dp = (tag: string, stackRole: Transmitter['stackRole']): Transmitter => ({
  id: tag,
  meterRunId: '1',
  tag,
  measures: 'differential-pressure',
  unit: 'kPa',
  pressureReference: 'absolute',
  lowerRange: 0,
  upperRange: 50,
  stackRole,
  accuracyPercentOfSpan: 0.075,
  calibrationDue: null,
});

describe('emptyDraft and defaultUnit', () => {
  it('starts a transmitter as a DP transmitter from zero, in inH2O (60 °F) on US sites and kPa on SI sites', () => {
    expect(emptyDraft(true)).toMatchObject({ measures: 'differential-pressure', unit: 'inH2O-60F', lowerRange: '0' });
    expect(emptyDraft(false).unit).toBe('kPa');
  });

  it('starts static pressure in psi or bar and temperature in °F or °C', () => {
    expect(defaultUnit('static-pressure', true)).toBe('psi');
    expect(defaultUnit('static-pressure', false)).toBe('bar');
    expect(defaultUnit('temperature', true)).toBe('degF');
    expect(defaultUnit('temperature', false)).toBe('degC');
    expect(defaultUnit('differential-pressure', false)).toBe('kPa');
  });
});

describe('dpRoleProblem', () => {
  it('lets a meter run without DP take a single transmitter or start a stacked pair', () => {
    expect(dpRoleProblem('single', [])).toBeNull();
    expect(dpRoleProblem('low', [])).toBeNull();
  });

  it('refuses a second single DP transmitter, naming the first', () => {
    expect(dpRoleProblem('single', [dp('DP-1', 'single')])).toBe(
      'this meter run already has its DP from DP-1: a second DP transmitter must make a stacked pair (low and high range) with it',
    );
  });

  it('refuses half a stacked pair beside a single DP transmitter', () => {
    expect(dpRoleProblem('high', [dp('DP-1', 'single')])).toBe(
      'this meter run has a single DP transmitter (DP-1): a stacked pair needs both of its transmitters marked low and high',
    );
  });

  it('lets the other half of a stacked pair in', () => {
    expect(dpRoleProblem('high', [dp('DP-1L', 'low')])).toBeNull();
  });

  it('names both transmitters of a pair when a single one is added to it', () => {
    expect(dpRoleProblem('single', [dp('DP-1L', 'low'), dp('DP-1H', 'high')])).toMatch(/from DP-1L and DP-1H:/);
  });
});
