/**
 * Verification values printed in the IAPWS releases, for the tests in this folder.
 * Units as printed in the releases: T in K, p in MPa, v in m³/kg, h and u in kJ/kg,
 * s and cp in kJ/(kg K), w in m/s, viscosity in µPa·s.
 *
 * Source: IAPWS R7-97(2012) Tables 5, 15, 33, 35, 36, 42 and IAPWS R12-08 Table 4, written
 * down from memory [mem]. Every value is confirmed independently at run time by
 * `if97-vs-python-iapws.test.ts` against Debian's python3-iapws, and the first few match
 * the values quoted in the project's trade handbook (TRADE.md §4).
 */

/** A region-1, 2 or 5 check point (p, T given), R7-97(2012) Tables 5, 15, 42. */
export interface PtCheckPoint {
  table: string;
  temperatureK: number;
  pressureMPa: number;
  v: number;
  h: number;
  u: number;
  s: number;
  cp: number;
  w: number;
}

export const REGION_1_TABLE_5: PtCheckPoint[] = [
  {
    table: 'R7-97(2012) Table 5',
    temperatureK: 300,
    pressureMPa: 3,
    v: 0.100215168e-2,
    h: 0.115331273e3,
    u: 0.112324818e3,
    s: 0.392294792,
    cp: 0.417301218e1,
    w: 0.150773921e4,
  },
  {
    table: 'R7-97(2012) Table 5',
    temperatureK: 300,
    pressureMPa: 80,
    v: 0.971180894e-3,
    h: 0.184142828e3,
    u: 0.106448356e3,
    s: 0.368563852,
    cp: 0.401008987e1,
    w: 0.163469054e4,
  },
  {
    table: 'R7-97(2012) Table 5',
    temperatureK: 500,
    pressureMPa: 3,
    v: 0.1202418e-2,
    h: 0.975542239e3,
    u: 0.971934985e3,
    s: 0.258041912e1,
    cp: 0.465580682e1,
    w: 0.124071337e4,
  },
];

export const REGION_2_TABLE_15: PtCheckPoint[] = [
  {
    table: 'R7-97(2012) Table 15',
    temperatureK: 300,
    pressureMPa: 0.0035,
    v: 0.394913866e2,
    h: 0.254991145e4,
    u: 0.24116916e4,
    s: 0.852238967e1,
    cp: 0.191300162e1,
    w: 0.427920172e3,
  },
  {
    table: 'R7-97(2012) Table 15',
    temperatureK: 700,
    pressureMPa: 0.0035,
    v: 0.923015898e2,
    h: 0.333568375e4,
    u: 0.301262819e4,
    s: 0.101749996e2,
    cp: 0.208141274e1,
    w: 0.644289068e3,
  },
  {
    table: 'R7-97(2012) Table 15',
    temperatureK: 700,
    pressureMPa: 30,
    v: 0.542946619e-2,
    h: 0.263149474e4,
    u: 0.246861076e4,
    s: 0.517540298e1,
    cp: 0.103505092e2,
    w: 0.480386523e3,
  },
];

export const REGION_5_TABLE_42: PtCheckPoint[] = [
  {
    table: 'R7-97(2012) Table 42',
    temperatureK: 1500,
    pressureMPa: 0.5,
    v: 0.13845509e1,
    h: 0.521976855e4,
    u: 0.45274931e4,
    s: 0.965408875e1,
    cp: 0.261609445e1,
    w: 0.91706869e3,
  },
  {
    table: 'R7-97(2012) Table 42',
    temperatureK: 1500,
    pressureMPa: 30,
    v: 0.230761299e-1,
    h: 0.516723514e4,
    u: 0.447495124e4,
    s: 0.772970133e1,
    cp: 0.272724317e1,
    w: 0.928548002e3,
  },
  {
    table: 'R7-97(2012) Table 42',
    temperatureK: 2000,
    pressureMPa: 30,
    v: 0.311385219e-1,
    h: 0.657122604e4,
    u: 0.563707038e4,
    s: 0.853640523e1,
    cp: 0.288569882e1,
    w: 0.106736948e4,
  },
];

/** Region-3 check points (ρ, T given; p is a result), R7-97(2012) Table 33. */
export const REGION_3_TABLE_33 = [
  {
    table: 'R7-97(2012) Table 33',
    temperatureK: 650,
    densityKgPerM3: 500,
    pressureMPa: 0.255837018e2,
    h: 0.186343019e4,
    u: 0.181226279e4,
    s: 0.405427273e1,
    cp: 0.138935717e2,
    w: 0.502005554e3,
  },
  {
    table: 'R7-97(2012) Table 33',
    temperatureK: 650,
    densityKgPerM3: 200,
    pressureMPa: 0.222930643e2,
    h: 0.237512401e4,
    u: 0.226365868e4,
    s: 0.485438792e1,
    cp: 0.446579342e2,
    w: 0.383444594e3,
  },
  {
    table: 'R7-97(2012) Table 33',
    temperatureK: 750,
    densityKgPerM3: 500,
    pressureMPa: 0.783095639e2,
    h: 0.225868845e4,
    u: 0.210206932e4,
    s: 0.446971906e1,
    cp: 0.634165359e1,
    w: 0.760696041e3,
  },
];

/** Saturation pressure, R7-97(2012) Table 35 (eq. (30)). */
export const SATURATION_PRESSURE_TABLE_35 = [
  { temperatureK: 300, pressureMPa: 0.353658941e-2 },
  { temperatureK: 500, pressureMPa: 0.263889776e1 },
  { temperatureK: 600, pressureMPa: 0.123443146e2 },
];

/** Saturation temperature, R7-97(2012) Table 36 (eq. (31)). */
export const SATURATION_TEMPERATURE_TABLE_36 = [
  { pressureMPa: 0.1, temperatureK: 0.372755919e3 },
  { pressureMPa: 1, temperatureK: 0.453035632e3 },
  { pressureMPa: 10, temperatureK: 0.584149488e3 },
];

/** Viscosity without critical enhancement, R12-08 Table 4 (µPa·s). */
export const VISCOSITY_TABLE_4 = [
  { temperatureK: 298.15, densityKgPerM3: 998, viscosityMicroPaS: 889.7351 },
  { temperatureK: 298.15, densityKgPerM3: 1200, viscosityMicroPaS: 1437.649467 },
  { temperatureK: 373.15, densityKgPerM3: 1000, viscosityMicroPaS: 307.883622 },
  { temperatureK: 433.15, densityKgPerM3: 1, viscosityMicroPaS: 14.538324 },
  { temperatureK: 433.15, densityKgPerM3: 1000, viscosityMicroPaS: 217.685358 },
  { temperatureK: 873.15, densityKgPerM3: 1, viscosityMicroPaS: 32.619287 },
  { temperatureK: 873.15, densityKgPerM3: 100, viscosityMicroPaS: 35.802262 },
  { temperatureK: 873.15, densityKgPerM3: 600, viscosityMicroPaS: 77.430195 },
  { temperatureK: 1173.15, densityKgPerM3: 1, viscosityMicroPaS: 44.217245 },
  { temperatureK: 1173.15, densityKgPerM3: 100, viscosityMicroPaS: 47.640433 },
  { temperatureK: 1173.15, densityKgPerM3: 400, viscosityMicroPaS: 64.154608 },
];
