import type { AlarmLimitsView } from './use-cases';

/**
 * A meter run's limits as JSON. The view is already plain data (stored settings carry ISO
 * times from limits-store); a saved setting's id comes first.
 */
export function presentAlarmLimits(view: AlarmLimitsView, saved?: { id: string }) {
  return saved ? { id: saved.id, ...view } : view;
}
