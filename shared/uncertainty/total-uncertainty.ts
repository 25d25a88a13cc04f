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
