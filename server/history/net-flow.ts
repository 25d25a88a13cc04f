import type { PeriodNet, PeriodReverse } from '../../shared/history/types';

/**
 * Net flow of a period of a bi-directional meter run: forward − reverse, figure by figure (a
 * record's own figures are forward flow, issue 13 §11; nothing is netted inside a record, so net
 * is its own figure beside both). Energy is null when either side has none.
 * @returns null when the period has no reverse part (a one-way meter run)
 */
export function netOf(
  forward: { massKg: number; volumeM3: number; standardVolumeM3: number; energyJ: number | null },
  reverse: PeriodReverse | null,
): PeriodNet | null {
  if (!reverse) return null;
  return {
    massKg: forward.massKg - reverse.massKg,
    volumeM3: forward.volumeM3 - reverse.volumeM3,
    standardVolumeM3: forward.standardVolumeM3 - reverse.standardVolumeM3,
    energyJ: forward.energyJ !== null && reverse.energyJ !== null ? forward.energyJ - reverse.energyJ : null,
  };
}
