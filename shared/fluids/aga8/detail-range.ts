import type { Warning } from '../warning';

/**
 * Upper mole-fraction limits of the AGA 8 DETAIL "normal range" of gas composition, within
 * which the method's stated uncertainty applies (AGA Report No. 8 Part 1, table of the normal
 * and expanded ranges) [mem]. Methane has a lower limit of 0.45. Butanes and pentanes are
 * limited as totals; hexanes+ as the total of n-hexane and heavier.
 */
const NORMAL_RANGE_MAX: ReadonlyArray<readonly [string, number[], number]> = [
  ['nitrogen', [1], 0.5],
  ['carbon dioxide', [2], 0.3],
  ['ethane', [3], 0.1],
  ['propane', [4], 0.035],
  ['butanes', [5, 6], 0.015],
  ['pentanes', [7, 8], 0.005],
  ['hexanes and heavier', [9, 10, 11, 12, 13], 0.001],
  ['hydrogen', [14], 0.1],
  ['carbon monoxide', [16], 0.03],
  ['water', [17], 0.0005],
  ['hydrogen sulfide', [18], 0.0002],
  ['helium', [19], 0.002],
];

/** Normal-range pressure limit of AGA 8 DETAIL: 1750 psia ≈ 12 MPa [mem]. */
export const DETAIL_NORMAL_MAX_PRESSURE_PA = 12e6;
/** Normal-range temperature limits: 17 °F … 143 °F ≈ 265 K … 335 K [mem]. */
export const DETAIL_NORMAL_MIN_TEMPERATURE_K = 265;
export const DETAIL_NORMAL_MAX_TEMPERATURE_K = 335;
/** Extended-range limits: 40 000 psia ≈ 280 MPa, −200 °F … 400 °F ≈ 143 K … 477 K [mem]. */
export const DETAIL_EXTENDED_MAX_PRESSURE_PA = 280e6;
export const DETAIL_EXTENDED_MIN_TEMPERATURE_K = 143;
export const DETAIL_EXTENDED_MAX_TEMPERATURE_K = 477;

/**
 * Warnings for a composition outside the DETAIL normal range, and a sour-gas caution.
 *
 * @param x mole fractions in DETAIL order (normalised)
 * @returns warnings (empty when inside the normal range and sweet)
 */
export function detailCompositionWarnings(x: Float64Array): Warning[] {
  const out: Warning[] = [];
  const outside: string[] = [];
  if (x[0] < 0.45) outside.push(`methane ${(x[0] * 100).toFixed(4)} % < 45 %`);
  for (const [label, idx, max] of NORMAL_RANGE_MAX) {
    const total = idx.reduce((s, i) => s + x[i], 0);
    if (total > max) outside.push(`${label} ${(total * 100).toFixed(4)} % > ${max * 100} %`);
  }
  if (x[15] > 0) outside.push('oxygen present');
  if (x[20] > 0) outside.push('argon present');
  if (outside.length > 0) {
    out.push({
      code: 'aga8.compositionOutsideNormalRange',
      message: `Composition outside the AGA 8 DETAIL normal range (${outside.join('; ')}); the stated uncertainty of Z does not apply.`,
    });
  }
  if (x[18] > 0) {
    out.push({
      code: 'fluid.sourGas',
      message: `The gas contains hydrogen sulfide (${(x[18] * 1e6).toFixed(1)} ppm mol): sour gas is toxic and corrosive. Follow local codes and licensed practice for sampling, maintenance and materials.`,
    });
  }
  return out;
}

/**
 * Warnings for a (p, T) state outside the DETAIL normal or extended range.
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @returns warnings (empty inside the normal range)
 */
export function detailStateWarnings(pressurePa: number, temperatureK: number): Warning[] {
  if (
    pressurePa > DETAIL_EXTENDED_MAX_PRESSURE_PA ||
    temperatureK < DETAIL_EXTENDED_MIN_TEMPERATURE_K ||
    temperatureK > DETAIL_EXTENDED_MAX_TEMPERATURE_K
  ) {
    return [
      {
        code: 'aga8.outsideExtendedRange',
        message: `p = ${pressurePa} Pa, T = ${temperatureK} K is outside the AGA 8 DETAIL extended range (≤ 280 MPa, 143…477 K); results are extrapolations.`,
      },
    ];
  }
  if (
    pressurePa > DETAIL_NORMAL_MAX_PRESSURE_PA ||
    temperatureK < DETAIL_NORMAL_MIN_TEMPERATURE_K ||
    temperatureK > DETAIL_NORMAL_MAX_TEMPERATURE_K
  ) {
    return [
      {
        code: 'aga8.outsideNormalRange',
        message: `p = ${pressurePa} Pa, T = ${temperatureK} K is outside the AGA 8 DETAIL normal range (≤ 12 MPa, 265…335 K); uncertainty of Z is larger there.`,
      },
    ];
  }
  return [];
}
