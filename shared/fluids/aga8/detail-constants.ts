/**
 * Constants of the AGA Report No. 8 Part 1 (2017) DETAIL equation of state.
 *
 * Provenance (from the project's data sheet /work/shared/data/aga8-detail.md, section 0):
 *   source: AGA Report No. 8 Part 1 (2017), DETAIL method; coefficient values as published in the NIST public-domain reference implementation usnistgov/AGA8
 *   repository: https://github.com/usnistgov/AGA8, commit 3bdb9ab8ff317c618b0b59d1b704c2c86ddc5fce
 *   constants taken from: AGA8CODE/C/Detail.cpp (routine SetupDetail), blob 3592de7f55232bd29816ff0c178115737535fc49
 *   cross-checked: C, FORTRAN (BLOCK DATA DetailConstants) and VB (SetupDetail) identical for every value
 *   (2601 values compared); the Rust port differs only in two ideal-gas values (methane n0_6 8.74431 vs
 *   8.74432, nitrogen n0_4 0.13731 vs 0.13732), taken as typos there; C/FORTRAN/VB values used here.
 * Generated once from the sheet's machine-readable copy (aga8-detail.json) by a throwaway script;
 * arrays are 0-based (index 0 = term n = 1, component 0 = methane).
 * Units: T in K, molar density D in mol/dm³, P in kPa, R in J/(mol K), M in g/mol.
 */

/** Gas constant of the DETAIL method, J/(mol K) (its own value; do not substitute CODATA). */
export const DETAIL_GAS_CONSTANT = 8.31451;

/** The 21 components in the standard's order, kebab-case as used in compositions. */
export const DETAIL_COMPONENTS = [
  'methane',
  'nitrogen',
  'carbon-dioxide',
  'ethane',
  'propane',
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
  'water',
  'hydrogen-sulfide',
  'helium',
  'argon',
] as const;

export type DetailComponent = (typeof DETAIL_COMPONENTS)[number];

export const DETAIL_COMPONENT_COUNT = 21;

/** Number of equation-of-state terms. */
export const DETAIL_TERM_COUNT = 58;

/** Term a_n coefficients (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_A = new Float64Array([
  0.1538326, 1.341953, -2.998583, -0.04831228, 0.3757965, -1.589575, -0.05358847, 0.88659463, -0.71023704, -1.471722,
  1.32185035, -0.78665925, 2.29129e-9, 0.1576724, -0.4363864, -0.04408159, -0.003433888, 0.03205905, 0.02487355,
  0.07332279, -0.001600573, 0.6424706, -0.4162601, -0.06689957, 0.2791795, -0.6966051, -0.002860589, -0.008098836,
  3.150547, 0.007224479, -0.7057529, 0.5349792, -0.07931491, -1.418465, -5.99905e-17, 0.1058402, 0.03431729,
  -0.007022847, 0.02495587, 0.04296818, 0.7465453, -0.2919613, 7.294616, -9.936757, -0.005399808, -0.2432567,
  0.04987016, 0.003733797, 1.874951, 0.002168144, -0.6587164, 0.000205518, 0.009776195, -0.02048708, 0.01557322,
  0.006862415, -0.001226752, 0.002850908,
]);

/** Term b_n density exponents (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_B = new Float64Array([
  1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 4, 4,
  4, 4, 4, 4, 4, 5, 5, 5, 5, 5, 6, 6, 7, 7, 8, 8, 8, 9, 9,
]);

/** Term k_n exponents of the exponential factor (c_n = 1 where k_n > 0) (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_K = new Float64Array([
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 3, 2, 2, 2, 4, 4, 0, 0, 2, 2, 2, 4, 4, 4, 4, 0, 1, 1, 2, 2, 3, 3, 4, 4, 4, 0, 0,
  2, 2, 2, 4, 4, 0, 2, 2, 4, 4, 0, 2, 0, 2, 1, 2, 2, 2, 2,
]);

/** Term u_n temperature exponents (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_U = new Float64Array([
  0, 0.5, 1, 3.5, -0.5, 4.5, 0.5, 7.5, 9.5, 6, 12, 12.5, -6, 2, 3, 2, 2, 11, -0.5, 0.5, 0, 4, 6, 21, 23, 22, -1, -0.5,
  7, -1, 6, 4, 1, 9, -13, 21, 8, -0.5, 0, 2, 7, 9, 22, 23, 1, 9, 3, 8, 23, 1.5, 5, -0.5, 4, 7, 3, 0, 1, 0,
]);

/** Term g_n orientation flags (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_G = new Float64Array([
  0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 1, 1, 1, 0, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 1, 0, 1, 0, 0,
]);

/** Term q_n quadrupole flags (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_Q = new Float64Array([
  0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0,
  0, 0, 1, 0, 0, 0, 0, 1, 0, 1, 0, 0, 1, 0, 0, 0, 0, 0, 1,
]);

/** Term f_n high-temperature flags (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_F = new Float64Array([
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 1, 0, 0, 0, 0, 1, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
]);

/** Term s_n dipole flags (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_S = new Float64Array([
  0, 0, 0, 0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
]);

/** Term w_n association flags (AGA 8 Part 1 Table of equation-of-state parameters; sheet §2.1). */
export const TERM_W = new Float64Array([
  0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
  0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0,
]);

/** Component molar masses M_i, g/mol (DETAIL values, not GERG-2008 or GPA 2145) (sheet §1 / §2.2). */
export const COMPONENT_MI = new Float64Array([
  16.043, 28.0135, 44.01, 30.07, 44.097, 58.123, 58.123, 72.15, 72.15, 86.177, 100.204, 114.231, 128.258, 142.285,
  2.0159, 31.9988, 28.01, 18.0153, 34.082, 4.0026, 39.948,
]);

/** Component energy parameters E_i, K (sheet §1 / §2.2). */
export const COMPONENT_EI = new Float64Array([
  151.3183, 99.73778, 241.9606, 244.1667, 298.1183, 324.0689, 337.6389, 365.5999, 370.6823, 402.636293, 427.72263,
  450.325022, 470.840891, 489.558373, 26.95794, 122.7667, 105.5348, 514.0156, 296.355, 2.610111, 119.6299,
]);

/** Component size parameters K_i, (dm³/mol)^(1/3) (sheet §1 / §2.2). */
export const COMPONENT_KI = new Float64Array([
  0.4619255, 0.4479153, 0.4557489, 0.5279209, 0.583749, 0.6406937, 0.6341423, 0.6738577, 0.6798307, 0.7175118,
  0.7525189, 0.784955, 0.8152731, 0.8437826, 0.3514916, 0.4186954, 0.4533894, 0.3825868, 0.4618263, 0.3589888,
  0.4216551,
]);

/** Component orientation parameters G_i (sheet §1 / §2.2). */
export const COMPONENT_GI = new Float64Array([
  0, 0.027815, 0.189065, 0.0793, 0.141239, 0.256692, 0.281835, 0.332267, 0.366911, 0.289731, 0.337542, 0.383381,
  0.427354, 0.469659, 0.034369, 0.021, 0.038953, 0.3325, 0.0885, 0, 0,
]);

/** Component quadrupole parameters Q_i (sheet §1 / §2.2). */
export const COMPONENT_QI = new Float64Array([
  0, 0, 0.69, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1.06775, 0.633276, 0, 0,
]);

/** Component high-temperature parameters F_i (sheet §1 / §2.2). */
export const COMPONENT_FI = new Float64Array([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0]);

/** Component dipole parameters S_i (sheet §1 / §2.2). */
export const COMPONENT_SI = new Float64Array([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1.5822, 0.39, 0, 0]);

/** Component association parameters W_i (sheet §1 / §2.2). */
export const COMPONENT_WI = new Float64Array([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0]);

/** Binary E*_ij energy parameters, non-default pairs only as [i, j, value] (0-based, i < j); all others 1 (sheet §2.3, 59 pairs). */
export const BINARY_EIJ: ReadonlyArray<readonly [number, number, number]> = [
  [0, 1, 0.97164],
  [0, 2, 0.960644],
  [0, 4, 0.994635],
  [0, 5, 1.01953],
  [0, 6, 0.989844],
  [0, 7, 1.00235],
  [0, 8, 0.999268],
  [0, 9, 1.107274],
  [0, 10, 0.88088],
  [0, 11, 0.880973],
  [0, 12, 0.881067],
  [0, 13, 0.881161],
  [0, 14, 1.17052],
  [0, 16, 0.990126],
  [0, 17, 0.708218],
  [0, 18, 0.931484],
  [1, 2, 1.02274],
  [1, 3, 0.97012],
  [1, 4, 0.945939],
  [1, 5, 0.946914],
  [1, 6, 0.973384],
  [1, 7, 0.95934],
  [1, 8, 0.94552],
  [1, 14, 1.08632],
  [1, 15, 1.021],
  [1, 16, 1.00571],
  [1, 17, 0.746954],
  [1, 18, 0.902271],
  [2, 3, 0.925053],
  [2, 4, 0.960237],
  [2, 5, 0.906849],
  [2, 6, 0.897362],
  [2, 7, 0.726255],
  [2, 8, 0.859764],
  [2, 9, 0.855134],
  [2, 10, 0.831229],
  [2, 11, 0.80831],
  [2, 12, 0.786323],
  [2, 13, 0.765171],
  [2, 14, 1.28179],
  [2, 16, 1.5],
  [2, 17, 0.849408],
  [2, 18, 0.955052],
  [3, 4, 1.02256],
  [3, 6, 1.01306],
  [3, 8, 1.00532],
  [3, 14, 1.16446],
  [3, 17, 0.693168],
  [3, 18, 0.946871],
  [4, 6, 1.0049],
  [4, 14, 1.034787],
  [5, 14, 1.3],
  [6, 14, 1.3],
  [9, 18, 1.008692],
  [10, 18, 1.010126],
  [11, 18, 1.011501],
  [12, 18, 1.012821],
  [13, 18, 1.014089],
  [14, 16, 1.1],
];

/** Binary U_ij conformal energy parameters, non-default pairs only as [i, j, value] (0-based, i < j); all others 1 (sheet §2.3, 38 pairs). */
export const BINARY_UIJ: ReadonlyArray<readonly [number, number, number]> = [
  [0, 1, 0.886106],
  [0, 2, 0.963827],
  [0, 4, 0.990877],
  [0, 6, 0.992291],
  [0, 8, 1.00367],
  [0, 9, 1.302576],
  [0, 10, 1.191904],
  [0, 11, 1.205769],
  [0, 12, 1.219634],
  [0, 13, 1.233498],
  [0, 14, 1.15639],
  [0, 18, 0.736833],
  [1, 2, 0.835058],
  [1, 3, 0.816431],
  [1, 4, 0.915502],
  [1, 6, 0.993556],
  [1, 14, 0.408838],
  [1, 18, 0.993476],
  [2, 3, 0.96987],
  [2, 9, 1.066638],
  [2, 10, 1.077634],
  [2, 11, 1.088178],
  [2, 12, 1.098291],
  [2, 13, 1.108021],
  [2, 16, 0.9],
  [2, 18, 1.04529],
  [3, 4, 1.065173],
  [3, 5, 1.25],
  [3, 6, 1.25],
  [3, 7, 1.25],
  [3, 8, 1.25],
  [3, 14, 1.61666],
  [3, 18, 0.971926],
  [9, 18, 1.028973],
  [10, 18, 1.033754],
  [11, 18, 1.038338],
  [12, 18, 1.042735],
  [13, 18, 1.046966],
];

/** Binary K_ij size parameters, non-default pairs only as [i, j, value] (0-based, i < j); all others 1 (sheet §2.3, 31 pairs). */
export const BINARY_KIJ: ReadonlyArray<readonly [number, number, number]> = [
  [0, 1, 1.00363],
  [0, 2, 0.995933],
  [0, 4, 1.007619],
  [0, 6, 0.997596],
  [0, 8, 1.002529],
  [0, 9, 0.982962],
  [0, 10, 0.983565],
  [0, 11, 0.982707],
  [0, 12, 0.981849],
  [0, 13, 0.980991],
  [0, 14, 1.02326],
  [0, 18, 1.00008],
  [1, 2, 0.982361],
  [1, 3, 1.00796],
  [1, 14, 1.03227],
  [1, 18, 0.942596],
  [2, 3, 1.00851],
  [2, 9, 0.910183],
  [2, 10, 0.895362],
  [2, 11, 0.881152],
  [2, 12, 0.86752],
  [2, 13, 0.854406],
  [2, 18, 1.00779],
  [3, 4, 0.986893],
  [3, 14, 1.02034],
  [3, 18, 0.999969],
  [9, 18, 0.96813],
  [10, 18, 0.96287],
  [11, 18, 0.957828],
  [12, 18, 0.952441],
  [13, 18, 0.948338],
];

/** Binary G*_ij orientation parameters, non-default pairs only as [i, j, value] (0-based, i < j); all others 1 (sheet §2.3, 5 pairs). */
export const BINARY_GIJ: ReadonlyArray<readonly [number, number, number]> = [
  [0, 2, 0.807653],
  [0, 14, 1.95731],
  [1, 2, 0.982746],
  [2, 3, 0.370296],
  [2, 17, 1.67309],
];

/** Ideal-gas coefficients n0_1..n0_7 per component, RAW as tabulated (before the sheet §6 adjustment of n0_1, n0_3). */
export const IDEAL_N0: ReadonlyArray<readonly number[]> = [
  [29.83843397, -15999.69151, 4.00088, 0.76315, 0.0046, 8.74432, -4.46921], // methane
  [17.56770785, -2801.729072, 3.50031, 0.13732, -0.1466, 0.90066, 0.0], // nitrogen
  [20.65844696, -4902.171516, 3.50002, 2.04452, -1.06044, 2.03366, 0.01393], // carbon-dioxide
  [36.73005938, -23639.65301, 4.00263, 4.33939, 1.23722, 13.1974, -6.01989], // ethane
  [44.70909619, -31236.63551, 4.02939, 6.60569, 3.197, 19.1921, -8.37267], // propane
  [34.30180349, -38525.50276, 4.06714, 8.97575, 5.25156, 25.1423, 16.1388], // isobutane
  [36.53237783, -38957.80933, 4.33944, 9.44893, 6.89406, 24.4618, 14.7824], // n-butane
  [43.17218626, -51198.30946, 4.0, 11.7618, 20.1101, 33.1688, 0.0], // isopentane
  [42.67837089, -45215.83, 4.0, 8.95043, 21.836, 33.4032, 0.0], // n-pentane
  [46.99717188, -52746.83318, 4.0, 11.6977, 26.8142, 38.6164, 0.0], // n-hexane
  [52.07631631, -57104.81056, 4.0, 13.7266, 30.4707, 43.5561, 0.0], // n-heptane
  [57.25830934, -60546.76385, 4.0, 15.6865, 33.8029, 48.1731, 0.0], // n-octane
  [62.09646901, -66600.12837, 4.0, 18.0241, 38.1235, 53.3415, 0.0], // n-nonane
  [65.93909154, -74131.45483, 4.0, 21.0069, 43.4931, 58.3657, 0.0], // n-decane
  [13.07520288, -5836.943696, 2.47906, 0.95806, 0.45444, 1.56039, -1.3756], // hydrogen
  [16.8017173, -2318.32269, 3.50146, 1.07558, 1.01334, 0.0, 0.0], // oxygen
  [17.45786899, -2635.244116, 3.50055, 1.02865, 0.00493, 0.0, 0.0], // carbon-monoxide
  [21.57882705, -7766.733078, 4.00392, 0.01059, 0.98763, 3.06904, 0.0], // water
  [21.5830944, -6069.035869, 4.0, 3.11942, 1.00243, 0.0, 0.0], // hydrogen-sulfide
  [10.04639507, -745.375, 2.5, 0.0, 0.0, 0.0, 0.0], // helium
  [10.04639507, -745.375, 2.5, 0.0, 0.0, 0.0, 0.0], // argon
];

/** Ideal-gas θ0_4..θ0_7 per component, K (0 = term absent); k = 4, 6 sinh terms, k = 5, 7 cosh terms. */
export const IDEAL_THETA0: ReadonlyArray<readonly number[]> = [
  [820.659, 178.41, 1062.82, 1090.53], // methane
  [662.738, 680.562, 1740.06, 0.0], // nitrogen
  [919.306, 865.07, 483.553, 341.109], // carbon-dioxide
  [559.314, 223.284, 1031.38, 1071.29], // ethane
  [479.856, 200.893, 955.312, 1027.29], // propane
  [438.27, 198.018, 1905.02, 893.765], // isobutane
  [468.27, 183.636, 1914.1, 903.185], // n-butane
  [292.503, 910.237, 1919.37, 0.0], // isopentane
  [178.67, 840.538, 1774.25, 0.0], // n-pentane
  [182.326, 859.207, 1826.59, 0.0], // n-hexane
  [169.789, 836.195, 1760.46, 0.0], // n-heptane
  [158.922, 815.064, 1693.07, 0.0], // n-octane
  [156.854, 814.882, 1693.79, 0.0], // n-nonane
  [164.947, 836.264, 1750.24, 0.0], // n-decane
  [228.734, 326.843, 1651.71, 1671.69], // hydrogen
  [2235.71, 1116.69, 0.0, 0.0], // oxygen
  [1550.45, 704.525, 0.0, 0.0], // carbon-monoxide
  [268.795, 1141.41, 2507.37, 0.0], // water
  [1833.63, 847.181, 0.0, 0.0], // hydrogen-sulfide
  [0.0, 0.0, 0.0, 0.0], // helium
  [0.0, 0.0, 0.0, 0.0], // argon
];
