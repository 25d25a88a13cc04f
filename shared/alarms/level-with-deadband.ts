/**
 * Level conditions with a deadband (hysteresis): a condition that comes on past a limit goes
 * off only once the value is back past the limit by the deadband, so noise around the limit
 * does not toggle it (ISA-18.2 "alarm deadband"). Pure functions of the value and the previous
 * state.
 */

/**
 * A "too low" condition: on below the threshold, off at or above threshold + deadband.
 * @param value the value (e.g. share of span)
 * @param previous the condition's previous state
 * @param threshold the limit
 * @param deadband how far above the limit the value must come back to clear (≥ 0)
 * @returns the new state
 */
export function belowWithDeadband(value: number, previous: boolean, threshold: number, deadband: number): boolean {
  if (value < threshold) return true;
  if (value >= threshold + deadband) return false;
  return previous;
}

/**
 * A "too high" condition: on above the threshold, off at or below threshold − deadband.
 * @param value the value
 * @param previous the condition's previous state
 * @param threshold the limit
 * @param deadband how far below the limit the value must come back to clear (≥ 0)
 * @returns the new state
 */
export function aboveWithDeadband(value: number, previous: boolean, threshold: number, deadband: number): boolean {
  if (value > threshold) return true;
  if (value <= threshold - deadband) return false;
  return previous;
}
