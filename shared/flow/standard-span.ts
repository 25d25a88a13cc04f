/**
 * Rounds a transmitter span down to a sensible standard span: the 1–1.25–1.5–2–2.5–3–4–5–6–7.5
 * series per decade in the transmitter's unit (common practice for DP ranges, e.g. 25, 50,
 * 100, 150, 250 inH2O or 10, 25, 50, 100, 250, 500 mbar).
 */
const SERIES = [1, 1.25, 1.5, 2, 2.5, 3, 4, 5, 6, 7.5];

/**
 * @param valueInUnit the largest span that still meets the requirement, in the unit
 * @returns the largest value of the series not above it
 */
export function standardSpanAtOrBelow(valueInUnit: number): number {
  if (!(valueInUnit > 0 && Number.isFinite(valueInUnit)))
    throw new Error(`standardSpanAtOrBelow: valueInUnit must be finite and > 0 (got ${valueInUnit})`);
  const decade = Math.pow(10, Math.floor(Math.log10(valueInUnit)));
  let best = 0;
  for (const s of [...SERIES, 10]) {
    const candidate = Number((s * decade).toPrecision(12));
    if (candidate <= valueInUnit * (1 + 1e-12)) best = candidate;
  }
  return best;
}
