/**
 * Verification data for the AGA 8 DETAIL tests, copied from the project's data sheet
 * /work/shared/data/aga8-detail.md §10 (sources named per block below).
 */

/** Five AGA 8 example gases, mol % (sheet §10(b), NIST TESTDATA/Tables.xls cells D8:H17). */
export const FIVE_GASES: Record<string, Record<string, number>> = {
  'Gulf Coast': {
    methane: 96.5222,
    nitrogen: 0.2595,
    'carbon-dioxide': 0.5956,
    ethane: 1.8186,
    propane: 0.4596,
    isobutane: 0.0977,
    'n-butane': 0.1007,
    isopentane: 0.0473,
    'n-pentane': 0.0324,
    'n-hexane': 0.0664,
  },
  Amarillo: {
    methane: 90.6724,
    nitrogen: 3.1284,
    'carbon-dioxide': 0.4676,
    ethane: 4.5279,
    propane: 0.828,
    isobutane: 0.1037,
    'n-butane': 0.1563,
    isopentane: 0.0321,
    'n-pentane': 0.0443,
    'n-hexane': 0.0393,
  },
  Ekofisk: {
    methane: 85.9063,
    nitrogen: 1.0068,
    'carbon-dioxide': 1.4954,
    ethane: 8.4919,
    propane: 2.3015,
    isobutane: 0.3486,
    'n-butane': 0.3506,
    isopentane: 0.0509,
    'n-pentane': 0.048,
  },
  'High N2': {
    methane: 81.441,
    nitrogen: 13.465,
    'carbon-dioxide': 0.985,
    ethane: 3.3,
    propane: 0.605,
    isobutane: 0.1,
    'n-butane': 0.104,
  },
  'High CO2': {
    methane: 81.212,
    nitrogen: 5.702,
    'carbon-dioxide': 7.585,
    ethane: 4.303,
    propane: 0.895,
    isobutane: 0.151,
    'n-butane': 0.152,
  },
};

export const GAS_ORDER = ['Gulf Coast', 'Amarillo', 'Ekofisk', 'High N2', 'High CO2'] as const;

/**
 * DETAIL Z of the five gases (sheet §10(b): NIST TESTDATA/Tables.xls, sheet Tables, cells
 * D74:H85, 6 decimals): rows [T K, p MPa, Z per gas in GAS_ORDER].
 */
export const FIVE_GAS_Z: ReadonlyArray<readonly [number, number, number, number, number, number, number]> = [
  [273.15, 0.101325, 0.997412, 0.997308, 0.996787, 0.997675, 0.997214],
  [273.15, 6, 0.847589, 0.840933, 0.803397, 0.866943, 0.834033],
  [273.15, 12, 0.734037, 0.723739, 0.657514, 0.77426, 0.709585],
  [293.15, 0.101325, 0.997975, 0.997893, 0.997469, 0.998197, 0.997818],
  [293.15, 6, 0.885078, 0.880119, 0.85205, 0.900309, 0.875026],
  [293.15, 12, 0.802268, 0.794318, 0.743111, 0.833366, 0.783867],
  [313.15, 0.101325, 0.998409, 0.998343, 0.997994, 0.998599, 0.998283],
  [313.15, 6, 0.91238, 0.908558, 0.886634, 0.924793, 0.904631],
  [313.15, 12, 0.851843, 0.84567, 0.805678, 0.876739, 0.837684],
  [333.15, 0.101325, 0.998749, 0.998695, 0.998405, 0.998913, 0.998646],
  [333.15, 6, 0.93293, 0.929919, 0.912304, 0.943293, 0.926803],
  [333.15, 12, 0.888883, 0.88402, 0.85206, 0.909387, 0.877727],
];

/** NIST's 21-component test mixture, mole fractions (sheet §10(a), AGA8CODE/C/Detail_test_01.cpp). */
export const NIST_MIXTURE: Record<string, number> = {
  methane: 0.77824,
  nitrogen: 0.02,
  'carbon-dioxide': 0.06,
  ethane: 0.08,
  propane: 0.03,
  isobutane: 0.0015,
  'n-butane': 0.003,
  isopentane: 0.0005,
  'n-pentane': 0.00165,
  'n-hexane': 0.00215,
  'n-heptane': 0.00088,
  'n-octane': 0.00024,
  'n-nonane': 0.00015,
  'n-decane': 9e-5,
  hydrogen: 0.004,
  oxygen: 0.005,
  'carbon-monoxide': 0.002,
  water: 0.0001,
  'hydrogen-sulfide': 0.0025,
  helium: 0.007,
  argon: 0.001,
};

/** Gas #2 of NIST's "Test Data.xls" (sheet §10(c), also AGA8CODE/RUST/tests/integration-tests.rs), mole fractions. */
export const TEST_DATA_GAS_2: Record<string, number> = {
  methane: 0.9969531,
  nitrogen: 0.002016,
  'carbon-dioxide': 0.0000937,
  ethane: 0.0007671,
  propane: 0.0000679,
  isobutane: 0.0000197,
  'n-butane': 0.0000068,
  isopentane: 0.0000156,
  helium: 0.0000601,
};

/** (T K, D mol/dm³) → P kPa, cv, cp J/(mol K), w m/s (sheet §10(c)). */
export const TEST_DATA_GAS_2_POINTS = [
  { temperatureK: 165.933, molarDensityMolPerL: 1, pressureKPa: 1179.2, cv: 26.4849, cp: 41.4919, w: 309.7709 },
  { temperatureK: 169.184, molarDensityMolPerL: 2, pressureKPa: 2050.6, cv: 29.6179, cp: 58.791, w: 286.869 },
  { temperatureK: 176.24, molarDensityMolPerL: 3, pressureKPa: 2808.8, cv: 32.196, cp: 84.3401, w: 275.0685 },
  { temperatureK: 181.681, molarDensityMolPerL: 4, pressureKPa: 3422.7, cv: 34.3978, cp: 126.207, w: 266.3933 },
];

/**
 * The same table to 9 decimals from the data sheet's verification re-implementation
 * (sheet §10(b) second table; NOT NIST values — [calc], two independent Python implementations
 * agreed). Each rounds to the NIST entry in FIVE_GAS_Z. Used as a tighter regression check.
 */
export const FIVE_GAS_Z_9: ReadonlyArray<readonly [number, number, number, number, number, number, number]> = [
  [273.15, 0.101325, 0.997411775, 0.997308105, 0.996787416, 0.997675401, 0.997213737],
  [273.15, 6, 0.847588595, 0.840933055, 0.803397288, 0.866942761, 0.834032919],
  [273.15, 12, 0.734036668, 0.723739333, 0.65751368, 0.77425964, 0.7095846],
  [293.15, 0.101325, 0.997975205, 0.997892717, 0.997469464, 0.998197252, 0.997818128],
  [293.15, 6, 0.885078011, 0.880119119, 0.85204983, 0.900309116, 0.875026333],
  [293.15, 12, 0.802268485, 0.794318095, 0.743111464, 0.833365649, 0.783867337],
  [313.15, 0.101325, 0.998409425, 0.998343001, 0.997994327, 0.9985988, 0.998283041],
  [313.15, 6, 0.912379982, 0.908558423, 0.886634442, 0.924792693, 0.904630913],
  [313.15, 12, 0.851843407, 0.845669743, 0.805678219, 0.876738547, 0.837683905],
  [333.15, 0.101325, 0.99874923, 0.99869522, 0.99840467, 0.9989125, 0.998646372],
  [333.15, 6, 0.932929629, 0.929919492, 0.912304085, 0.943293174, 0.926802792],
  [333.15, 12, 0.888883243, 0.884020434, 0.852060219, 0.909386748, 0.877727417],
];
