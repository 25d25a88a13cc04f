/**
 * Exact defining constants from which every conversion factor is derived.
 */

/** Standard acceleration of gravity g_n, m/s² (3rd CGPM 1901, exact). */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** International inch, m (international yard and pound agreement 1959, exact). */
export const INCH_M = 0.0254;

/** International foot = 12 in, m (exact). */
export const FOOT_M = 12 * INCH_M;

/** International avoirdupois pound, kg (1959 agreement, exact). */
export const POUND_KG = 0.45359237;

/** Pound-force = 1 lb × g_n, N (exact by the two definitions above). */
export const POUND_FORCE_N = POUND_KG * STANDARD_GRAVITY_M_PER_S2;

/** US gallon = 231 in³ (exact), m³. */
export const US_GALLON_M3 = 231 * INCH_M * INCH_M * INCH_M;

/** International Table calorie, J (5th International Conference on the Properties of Steam, 1956, exact). */
export const IT_CALORIE_J = 4.1868;
