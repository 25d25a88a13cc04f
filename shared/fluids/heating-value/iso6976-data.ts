/**
 * Component data of ISO 6976:2016 ("Natural gas — Calculation of calorific values, density,
 * relative density and Wobbe indices from composition") for the 21 components that AGA 8
 * DETAIL also knows, in the DETAIL component order (see ../aga8/detail-constants.ts).
 *
 * Sources: ISO 6976:2016 Table 1 (molar mass), Table 2 (summation factors s at 101.325 kPa),
 * Table 3 (ideal-gas gross molar calorific value), Table A.1 (R), A.3 (M_air), A.4 (Z_air),
 * A.5 (enthalpy of vaporisation of water). Methane, ethane, propane, nitrogen and carbon dioxide
 * at 15 °C were written from memory [mem] and are confirmed by reproducing the standard's
 * Annex D example 1 to all printed digits (heating-value tests; values quoted in TRADE.md §4).
 * The other entries were transcribed from an open-source Python transcription of the same
 * tables (found by code search) and agree with my recollection where I had one [mem]
 * (e.g. H2 285.83, CO 282.98, H2S 562.01, n-butane 2877.40 kJ/mol at 25 °C, the standard
 * enthalpies of combustion); they are NOT confirmed by a worked example — see the report.
 * Water and the 15.55 °C columns of methane, ethane, nitrogen and carbon dioxide are confirmed by
 * Annex D example 2 (D.3.3–D.3.7, heating-value tests). STILL UNCONFIRMED by any worked example:
 * isobutane, n-butane, isopentane, n-pentane, n-hexane … n-decane, hydrogen, oxygen, carbon
 * monoxide, hydrogen sulfide, helium, argon (Annex D example 3 has the butanes, pentanes and
 * hexane but also neopentane, which this DETAIL-ordered table lacks, so it cannot be run here).
 */

/** Components whose ISO 6976 data no worked example has confirmed (see above). */
export const ISO6976_UNCONFIRMED_COMPONENTS: readonly string[] = Object.freeze([
  'isobutane',
  'n-butane',
  'isopentane',
  'n-pentane',
  'n-hexane',
  'n-heptane',
  'n-octane',
  'n-nonane',
  'n-decane',
  'hydrogen',
  'oxygen',
  'carbon-monoxide',
  'hydrogen-sulfide',
  'helium',
  'argon',
]);

/** Molar gas constant of ISO 6976:2016 Table A.1 (CODATA 2010), J/(mol K). */
export const ISO6976_GAS_CONSTANT = 8.3144621;
/** Reference pressure p₀ of the summation factors, ISO 6976:2016 Table 2, Pa. */
export const ISO6976_REFERENCE_PRESSURE_PA = 101325;
/** Molar mass of dry air, ISO 6976:2016 Table A.3, g/mol. */
export const ISO6976_AIR_MOLAR_MASS = 28.96546;

/** Combustion reference temperatures of Table 3: 0, 15, 15.55, 20, 25 °C, as K. */
export const COMBUSTION_TEMPERATURES_K = [273.15, 288.15, 288.7, 293.15, 298.15] as const;
/** Metering (volume) reference temperatures of Table 2: 0, 15, 15.55, 20 °C, as K. */
export const METERING_TEMPERATURES_K = [273.15, 288.15, 288.7, 293.15] as const;

/** Compression factor of dry air at the metering temperatures and 101.325 kPa, Table A.4. */
export const AIR_COMPRESSIBILITY = [0.999419, 0.999595, 0.999601, 0.999645] as const;
/** Standard enthalpy of vaporisation of water at the combustion temperatures, Table A.5, kJ/mol. */
export const WATER_VAPORISATION_KJ_PER_MOL = [45.064, 44.431, 44.408, 44.222, 44.013] as const;

export interface Iso6976Component {
  /** Molar mass, g/mol (Table 1). */
  molarMass: number;
  /** Number of hydrogen atoms (Table 1 index b), for the inferior calorific value. */
  hydrogenAtoms: number;
  /** Summation factor at 0, 15, 15.55, 20 °C (Table 2). */
  summationFactor: readonly [number, number, number, number];
  /** Ideal gross (superior) molar calorific value at 0, 15, 15.55, 20, 25 °C, kJ/mol (Table 3; 0 for inerts). */
  grossKJPerMol: readonly [number, number, number, number, number];
}

const c = (
  molarMass: number,
  hydrogenAtoms: number,
  summationFactor: readonly [number, number, number, number],
  grossKJPerMol: readonly [number, number, number, number, number],
): Iso6976Component => ({ molarMass, hydrogenAtoms, summationFactor, grossKJPerMol });
const INERT = [0, 0, 0, 0, 0] as const;

/** ISO 6976:2016 data in the AGA 8 DETAIL component order. */
export const ISO6976_COMPONENTS: readonly Iso6976Component[] = [
  c(16.04246, 4, [0.04886, 0.04452, 0.04437, 0.04317], [892.92, 891.51, 891.46, 891.05, 890.58]), // methane
  c(28.0134, 0, [0.0214, 0.017, 0.0169, 0.0156], INERT), // nitrogen
  c(44.0095, 0, [0.0821, 0.0752, 0.0749, 0.073], INERT), // carbon dioxide
  c(30.06904, 6, [0.0997, 0.0919, 0.0916, 0.0895], [1564.35, 1562.14, 1562.06, 1561.42, 1560.69]), // ethane
  c(44.09562, 8, [0.1465, 0.1344, 0.134, 0.1308], [2224.03, 2221.1, 2220.99, 2220.13, 2219.17]), // propane
  c(58.1222, 10, [0.1885, 0.1722, 0.1717, 0.1673], [2874.21, 2870.58, 2870.45, 2869.39, 2868.2]), // isobutane
  c(58.1222, 10, [0.2022, 0.184, 0.1834, 0.1785], [2883.35, 2879.76, 2879.63, 2878.58, 2877.4]), // n-butane
  c(72.14878, 12, [0.2458, 0.2251, 0.2244, 0.2189], [3536.01, 3531.68, 3531.52, 3530.25, 3528.83]), // isopentane
  c(72.14878, 12, [0.2586, 0.2361, 0.2354, 0.2295], [3542.91, 3538.6, 3538.45, 3537.19, 3535.77]), // n-pentane
  c(86.17536, 14, [0.3319, 0.3001, 0.299, 0.2907], [4203.24, 4198.24, 4198.06, 4196.6, 4194.95]), // n-hexane
  c(100.20194, 16, [0.4076, 0.3668, 0.3654, 0.3547], [4862.88, 4857.18, 4856.98, 4855.31, 4853.43]), // n-heptane
  c(114.22852, 18, [0.4845, 0.4346, 0.4329, 0.4198], [5522.41, 5516.01, 5515.78, 5513.9, 5511.8]), // n-octane
  c(128.2551, 20, [0.5617, 0.503, 0.501, 0.4856], [6182.92, 6175.82, 6175.56, 6173.48, 6171.15]), // n-nonane
  c(142.28168, 22, [0.6713, 0.5991, 0.5967, 0.5778], [6842.69, 6834.9, 6834.62, 6832.33, 6829.77]), // n-decane
  c(2.01588, 2, [-0.01, -0.01, -0.01, -0.01], [286.64, 286.15, 286.13, 285.99, 285.83]), // hydrogen
  c(31.9988, 0, [0.0311, 0.0276, 0.0275, 0.0265], INERT), // oxygen
  c(28.0101, 0, [0.0258, 0.0217, 0.0215, 0.0203], [282.8, 282.91, 282.91, 282.95, 282.98]), // carbon monoxide
  // Water: ISO 6976 gives its "gross calorific value" as the enthalpy of vaporisation (Table 3),
  // so that with b = 2 its net value is exactly 0.
  c(18.01528, 2, [0.3093, 0.2562, 0.2546, 0.2419], [45.064, 44.431, 44.408, 44.222, 44.013]), // water
  c(34.08088, 2, [0.1006, 0.0923, 0.092, 0.0898], [562.93, 562.38, 562.36, 562.19, 562.01]), // hydrogen sulfide
  c(4.002602, 0, [-0.01, -0.01, -0.01, -0.01], INERT), // helium
  c(39.948, 0, [0.0307, 0.0273, 0.0272, 0.0262], INERT), // argon
];
