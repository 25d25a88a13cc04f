/**
 * Choice of the DP transmitter of a stacked pair (a low-range and a high-range transmitter on
 * one meter run), with hysteresis so the choice does not chatter at the switch point: switch up
 * to the high-range transmitter when the reading in use rises above a share of the low-range
 * span (e.g. 90 %), back down when it falls below a lower share (e.g. 80 %) (common practice).
 * A pair ranged both ways (the low-range transmitter's lower range value below zero, e.g. −25…+25
 * kPa, on a bi-directional meter run) chooses on the magnitude: a reverse reading's share is
 * |Δp| / |lower range value|, a forward one's Δp / upper range value.
 */
import { formatNumber } from './element-limits';

export type StackedRole = 'low' | 'high';
export type ReadingQuality = 'good' | 'uncertain' | 'bad' | 'substituted';

export interface StackedReading {
  /** Differential pressure, Pa; null when missing. */
  valuePa: number | null;
  quality: ReadingQuality;
}

export interface StackedPairConfig {
  /** Range of the low-range transmitter, Pa (lower range value usually 0; below 0 when ranged both ways). */
  lowLowerRangePa?: number;
  lowUpperRangePa: number;
  /** Upper range value of the high-range transmitter, Pa. */
  highUpperRangePa: number;
  /** Share of the low-range span above which the high-range transmitter is used, e.g. 0.9. */
  switchUpShare: number;
  /** Share of the low-range span below which the low-range transmitter is used again, e.g. 0.8. */
  switchDownShare: number;
}

export type StackedChoiceReason =
  | 'low-below-switch-up'
  | 'switched-up'
  | 'high-above-switch-down'
  | 'switched-down'
  | 'low-unavailable'
  | 'high-unavailable'
  | 'both-unavailable';

export interface StackedPairChoice {
  use: StackedRole | null;
  differentialPressurePa: number | null;
  reason: StackedChoiceReason;
  /** A sentence for the operator, with the numbers. */
  message: string;
  switched: boolean;
  /** Both readings usable and the low-range one inside its range: the two should agree. */
  inOverlap: boolean;
  /** high − low in the overlap, Pa; null outside it. */
  disagreementPa: number | null;
  /** |high − low| as a percent of the reading in use; null outside the overlap or at zero. */
  disagreementPercentOfReading: number | null;
  /** The low-range reading is above its upper range value (saturated); it is never used then unless it is the only one. */
  lowOverRange: boolean;
}

function usable(r: StackedReading | null | undefined): r is { valuePa: number; quality: ReadingQuality } {
  return !!r && r.quality !== 'bad' && r.valuePa !== null && Number.isFinite(r.valuePa);
}

/**
 * Chooses the transmitter to use for one DP sample.
 * @param low low-range reading (null when missing)
 * @param high high-range reading (null when missing)
 * @param previous the transmitter used for the previous sample (null at start-up)
 * @param config ranges and switch shares
 * @returns which transmitter, the DP, why, and the disagreement in the overlap
 */
export function chooseStackedTransmitter(
  low: StackedReading | null,
  high: StackedReading | null,
  previous: StackedRole | null,
  config: StackedPairConfig,
): StackedPairChoice {
  const twoWay = (config.lowLowerRangePa ?? 0) < 0;
  const lrv = twoWay ? 0 : (config.lowLowerRangePa ?? 0);
  const span = config.lowUpperRangePa - lrv;
  if (!(span > 0))
    throw new Error(
      `chooseStackedTransmitter: config.lowUpperRangePa must exceed lowLowerRangePa (got ${config.lowUpperRangePa})`,
    );
  if (twoWay && !(config.lowUpperRangePa > 0))
    throw new Error(
      `chooseStackedTransmitter: config.lowUpperRangePa must be > 0 for a pair ranged both ways (got ${config.lowUpperRangePa})`,
    );
  if (!(config.highUpperRangePa > config.lowUpperRangePa)) {
    throw new Error(
      `chooseStackedTransmitter: config.highUpperRangePa must exceed config.lowUpperRangePa (got ${config.highUpperRangePa})`,
    );
  }
  if (!(config.switchDownShare > 0 && config.switchDownShare < config.switchUpShare && config.switchUpShare <= 1)) {
    throw new Error(
      `chooseStackedTransmitter: config needs 0 < switchDownShare < switchUpShare ≤ 1 (got ${config.switchDownShare}, ${config.switchUpShare})`,
    );
  }
  const upPa = lrv + config.switchUpShare * span;
  const downPa = lrv + config.switchDownShare * span;
  // Ranged both ways, a reading is compared by its share of the low-range transmitter's range on
  // its side, expressed on the forward side (|Δp| × upper / |lower| for a reverse reading), so a
  // symmetric pair compares |Δp|; one-way readings are compared as they are.
  const reverseScale = twoWay ? config.lowUpperRangePa / -(config.lowLowerRangePa as number) : 1;
  const magnitudeOf = (valuePa: number) => (twoWay && valuePa < 0 ? -valuePa * reverseScale : valuePa);
  const lowOk = usable(low);
  const highOk = usable(high);
  const lowOverRange = lowOk && magnitudeOf(low.valuePa) > config.lowUpperRangePa;
  const pct = (share: number) => `${formatNumber(share * 100)} %`;

  const base = { inOverlap: false, disagreementPa: null, disagreementPercentOfReading: null, lowOverRange } as const;
  if (!lowOk && !highOk) {
    return {
      ...base,
      use: null,
      differentialPressurePa: null,
      reason: 'both-unavailable',
      switched: previous !== null,
      message: 'no usable reading from either DP transmitter (missing or bad quality)',
    };
  }
  if (!highOk) {
    const lowValue = (low as { valuePa: number }).valuePa;
    return {
      ...base,
      use: 'low',
      differentialPressurePa: lowValue,
      reason: 'high-unavailable',
      switched: previous === 'high',
      message: `high-range reading missing or bad: using the low-range transmitter (${formatNumber(lowValue)} Pa${lowOverRange ? ', above its upper range value, so flow is understated' : ''})`,
    };
  }
  const highValue = magnitudeOf(high.valuePa);
  if (!lowOk || lowOverRange) {
    return {
      ...base,
      use: 'high',
      differentialPressurePa: high.valuePa,
      reason: lowOk ? (previous === 'high' ? 'high-above-switch-down' : 'switched-up') : 'low-unavailable',
      switched: previous === 'low',
      message: lowOk
        ? `low-range transmitter above its upper range value (${formatNumber(low.valuePa)} Pa > ${formatNumber(config.lowUpperRangePa)} Pa): using the high-range transmitter (${formatNumber(highValue)} Pa)`
        : `low-range reading missing or bad: using the high-range transmitter (${formatNumber(highValue)} Pa)`,
    };
  }
  // Both usable, low inside its range: the overlap, where the two should agree.
  const lowValue = magnitudeOf(low.valuePa);
  let use: StackedRole;
  let reason: StackedChoiceReason;
  let message: string;
  if (previous === 'high') {
    if (highValue < downPa) {
      use = 'low';
      reason = 'switched-down';
      message = `high-range reading ${formatNumber(highValue)} Pa fell below ${pct(config.switchDownShare)} of the low-range span (${formatNumber(downPa)} Pa): switched down to the low-range transmitter`;
    } else {
      use = 'high';
      reason = 'high-above-switch-down';
      message = `high-range reading ${formatNumber(highValue)} Pa is at or above ${pct(config.switchDownShare)} of the low-range span (${formatNumber(downPa)} Pa): staying on the high-range transmitter`;
    }
  } else if (lowValue > upPa) {
    use = 'high';
    reason = 'switched-up';
    message = `low-range reading ${formatNumber(lowValue)} Pa rose above ${pct(config.switchUpShare)} of its span (${formatNumber(upPa)} Pa): switched up to the high-range transmitter`;
  } else {
    use = 'low';
    reason = 'low-below-switch-up';
    message = `low-range reading ${formatNumber(lowValue)} Pa is at or below ${pct(config.switchUpShare)} of its span (${formatNumber(upPa)} Pa): using the low-range transmitter`;
  }
  const used = use === 'low' ? low.valuePa : high.valuePa;
  const disagreementPa = high.valuePa - low.valuePa;
  return {
    use,
    differentialPressurePa: used,
    reason,
    message,
    switched: previous !== null && previous !== use,
    inOverlap: true,
    disagreementPa,
    disagreementPercentOfReading: used !== 0 ? (Math.abs(disagreementPa) / Math.abs(used)) * 100 : null,
    lowOverRange: false,
  };
}
