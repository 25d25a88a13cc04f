import { aboveWithDeadband, belowWithDeadband } from './level-with-deadband';

// Hysteresis as ISA-18.2 defines an alarm deadband; the values are constructed by hand.
describe('belowWithDeadband', () => {
  it('comes on below the threshold and stays on inside the deadband', () => {
    expect(belowWithDeadband(0.05, false, 0.1, 0.02)).toBe(true);
    expect(belowWithDeadband(0.11, true, 0.1, 0.02)).toBe(true);
    expect(belowWithDeadband(0.11, false, 0.1, 0.02)).toBe(false);
  });
  it('goes off at or above threshold + deadband', () => {
    expect(belowWithDeadband(0.125, true, 0.1, 0.02)).toBe(false);
    expect(belowWithDeadband(0.25, true, 0.2, 0.05)).toBe(false); // exactly at 0.2 + 0.05 (both exact in binary)
  });
});

describe('aboveWithDeadband', () => {
  it('comes on above the threshold and goes off at threshold − deadband', () => {
    expect(aboveWithDeadband(1.01, false, 1, 0.02)).toBe(true);
    expect(aboveWithDeadband(0.99, true, 1, 0.02)).toBe(true);
    expect(aboveWithDeadband(0.98, true, 1, 0.02)).toBe(false);
  });
});
