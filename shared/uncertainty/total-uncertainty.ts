/**
 * Uncertainty of a total (an hour, a day, a month) from its samples' quantities.
 * Assumption, stated for the audit: the systematic part of each sample's uncertainty (C, ε,
 * diameters, transmitter calibration offsets, density model) is FULLY CORRELATED between
 * samples, so it adds linearly, mass-weighted; the random part (transmitter noise and
 * repeatability) is UNCORRELATED, so it adds in quadrature and shrinks with more samples.
 * U_total² = (Σ m_i U_sys,i)² + Σ (m_i U_rnd,i)², relative to Σ m_i. Inputs and result are
 * expanded (k = 2) percentages.
 */

export interface SampleUncertainty {
  /** Quantity of the sample (mass, volume or energy, any consistent unit), ≥ 0. */
  quantity: number;
  systematicPercent: number;
  randomPercent: number;
}

export interface TotalUncertainty {
  total: number;
  expandedPercent: number;
  systematicPercent: number;
  randomPercent: number;
}

/**
 * @param samples each sample's quantity and its systematic and random expanded uncertainty, percent
 * @returns total and its expanded uncertainty, percent (0 % of a zero total)
 */
export function totalUncertainty(samples: readonly SampleUncertainty[]): TotalUncertainty {
  let total = 0;
  let systematic = 0;
  let randomSquares = 0;
  samples.forEach((s, i) => {
    if (!(s.quantity >= 0) || !(s.systematicPercent >= 0) || !(s.randomPercent >= 0)) {
      throw new Error(`totalUncertainty: samples.${i} needs quantity, systematicPercent and randomPercent ≥ 0`);
    }
    total += s.quantity;
    systematic += s.quantity * s.systematicPercent;
    randomSquares += (s.quantity * s.randomPercent) ** 2;
  });
  if (total === 0) return { total, expandedPercent: 0, systematicPercent: 0, randomPercent: 0 };
  const systematicPercent = systematic / total;
  const randomPercent = Math.sqrt(randomSquares) / total;
  return { total, expandedPercent: Math.hypot(systematicPercent, randomPercent), systematicPercent, randomPercent };
}

/**
 * Widens a total's expanded uncertainty for time without a measurement and for quantity resting on
 * estimated (substituted) readings. Rule chosen here: the quantity of the unmeasured time is known
 * only to within ± what the measured mean rate would give over it, a = Q (1 − c)/c for a coverage c,
 * and an estimated share s of the quantity only to within ± itself, a = s Q. Each is a rectangular
 * ± a (GUM, JCGM 100:2008 §4.3.7: u = a/√3), expanded with k = 2 (GUM §6.2), and adds in quadrature
 * to the measured U (independent sources, GUM §5.1.2). Why: no reading says anything about that
 * time or those estimates, and the mean-rate bound is the one an auditor would use in place of it.
 * @param expandedPercent U of the measured part, percent (k = 2)
 * @param coverage share of the elapsed time with a known rate, 0 < c ≤ 1
 * @param estimatedShare share of the quantity that rests on estimated readings, 0 ≤ s ≤ 1
 * @returns the widened U, percent (unchanged for c = 1 and s = 0; the input for c ≤ 0, where there is no quantity)
 */
export function widenForUnmeasuredTime(expandedPercent: number, coverage: number, estimatedShare = 0): number {
  if (!(expandedPercent >= 0))
    throw new Error(`widenForUnmeasuredTime: expandedPercent must be ≥ 0 (got ${expandedPercent})`);
  if (!(coverage <= 1 + 1e-12)) throw new Error(`widenForUnmeasuredTime: coverage must be ≤ 1 (got ${coverage})`);
  if (!(estimatedShare >= 0 && estimatedShare <= 1 + 1e-12))
    throw new Error(`widenForUnmeasuredTime: estimatedShare must be in [0, 1] (got ${estimatedShare})`);
  if (!(coverage > 0)) return expandedPercent;
  const missing = (200 * Math.max(0, 1 - coverage)) / (coverage * Math.sqrt(3));
  const estimated = (200 * estimatedShare) / Math.sqrt(3);
  return Math.sqrt(expandedPercent ** 2 + missing ** 2 + estimated ** 2);
}
