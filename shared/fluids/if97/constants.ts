/**
 * Constants of IAPWS-IF97, the industrial formulation for water and steam
 * (IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997
 * for the Thermodynamic Properties of Water and Steam").
 *
 * SI units throughout: the release works in kJ, MPa; this module converts once,
 * here, so every caller sees J, Pa, K.
 */

/** Specific gas constant of water, R7-97(2012) eq. (1): 0.461526 kJ/(kg K). */
export const IF97_GAS_CONSTANT_J_PER_KG_K = 461.526;

/** Critical temperature, R7-97(2012) eq. (3): 647.096 K. */
export const CRITICAL_TEMPERATURE_K = 647.096;

/** Critical pressure, R7-97(2012) eq. (4): 22.064 MPa. */
export const CRITICAL_PRESSURE_PA = 22.064e6;

/** Critical density, R7-97(2012) eq. (5): 322 kg/m³. */
export const CRITICAL_DENSITY_KG_PER_M3 = 322;

/** Lowest temperature of the formulation's range of validity (R7-97(2012) §1). */
export const IF97_MIN_TEMPERATURE_K = 273.15;

/** Upper temperature of regions 1–3 and 2 (R7-97(2012) §1, Fig. 1). */
export const IF97_MAX_TEMPERATURE_REGION_2_K = 1073.15;

/** Upper temperature of region 5 (R7-97(2012) §1, Fig. 1). */
export const IF97_MAX_TEMPERATURE_K = 2273.15;

/** Upper pressure of regions 1–3 (R7-97(2012) §1): 100 MPa. */
export const IF97_MAX_PRESSURE_PA = 100e6;

/** Upper pressure of region 5 (R7-97(2012) §1): 50 MPa. */
export const IF97_MAX_PRESSURE_REGION_5_PA = 50e6;

/** The 623.15 K isotherm separating region 1 from region 3 (R7-97(2012) Fig. 1). */
export const REGION_1_3_TEMPERATURE_K = 623.15;
