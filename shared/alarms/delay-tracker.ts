/**
 * On- and off-delays of one alarm point (ISA-18.2 §"alarm delay"): the condition as observed
 * (raw) must persist for the on-delay before the alarm becomes active, and be gone for the
 * off-delay before it clears. A change back within the delay cancels the pending transition, so
 * a signal chattering across its limit raises nothing new. Pure: the caller keeps the state
 * (a small JSON-able object) and walks time forward.
 */

export interface DelayTrackerState {
  /** The condition as last observed. */
  raw: boolean;
  /** When `raw` took its current value, epoch ms. */
  rawSinceMs: number;
  /** Whether the alarm is active (raised and not cleared). */
  active: boolean;
  /** When `active` took its current value, epoch ms (null: never changed). */
  activeSinceMs: number | null;
  /** When the current raw episode began, kept for the alarm's onset time. */
  onsetMs: number | null;
}

export interface DelayTransition {
  kind: 'raise' | 'clear';
  /** When the alarm is raised or cleared (the delay elapsed), epoch ms. */
  timeMs: number;
  /** When the condition began (raise) or ended (clear), epoch ms. */
  onsetMs: number;
}

export interface Delays {
  onDelayMs: number;
  offDelayMs: number;
}

/** @returns the state of a point that has never been in alarm */
export function initialDelayTracker(): DelayTrackerState {
  return { raw: false, rawSinceMs: 0, active: false, activeSinceMs: null, onsetMs: null };
}

/**
 * Fires the pending transition if its delay has elapsed by `timeMs` (the raw state is known to
 * have held until then).
 * @param state the point's state (mutated)
 * @param timeMs the time reached, epoch ms
 * @param delays on- and off-delay
 * @returns the transition, or null
 */
export function advanceDelayTracker(state: DelayTrackerState, timeMs: number, delays: Delays): DelayTransition | null {
  if (state.raw === state.active) return null;
  const dueMs = state.rawSinceMs + (state.raw ? delays.onDelayMs : delays.offDelayMs);
  if (dueMs > timeMs) return null;
  // Never before the previous transition of this point (a clock-raised alarm cleared by a late reading).
  const atMs = Math.max(dueMs, state.activeSinceMs ?? -Infinity);
  state.active = state.raw;
  state.activeSinceMs = atMs;
  return { kind: state.active ? 'raise' : 'clear', timeMs: atMs, onsetMs: state.rawSinceMs };
}

/**
 * Records an observation of the condition at a time (after firing what was due before it).
 * @param state the point's state (mutated)
 * @param raw whether the condition holds; null = cannot be judged now (the state is held)
 * @param timeMs the observation's time, epoch ms (non-decreasing for one point)
 * @param delays on- and off-delay
 * @returns the transitions that happened up to and at timeMs, in time order
 */
export function observeCondition(
  state: DelayTrackerState,
  raw: boolean | null,
  timeMs: number,
  delays: Delays,
): DelayTransition[] {
  const out: DelayTransition[] = [];
  const due = advanceDelayTracker(state, timeMs, delays);
  if (due) out.push(due);
  if (raw === null || raw === state.raw) return out;
  state.raw = raw;
  state.rawSinceMs = timeMs;
  if (raw) state.onsetMs = timeMs;
  const now = advanceDelayTracker(state, timeMs, delays);
  if (now) out.push(now);
  return out;
}
