/**
 * Dynamic viscosity of a natural gas by the Lee–Gonzalez–Eakin correlation (A.L. Lee,
 * M.H. Gonzalez, B.E. Eakin, "The Viscosity of Natural Gases", J. Petroleum Technology 18
 * (1966) 997–1000), in the form usually quoted in petroleum-engineering texts [mem; the same
 * form is in the open neqsim library's documentation]:
 *
 *   μ [cP] = 1e-4 K exp(X ρ^Y),  K = (9.4 + 0.02 M) T^1.5 / (209 + 19 M + T),
 *   X = 3.5 + 986/T + 0.01 M,  Y = 2.4 − 0.2 X,
 *
 * with T in °R, ρ in g/cm³ and M in g/mol. Stated accuracy about 2–4 % for sweet natural gas
 * [mem]. Used as the default when a meter run gives no viscosity: in the flow equation μ only
 * enters through the Reynolds number, and a 4 % error in μ moves an orifice C by well under
 * 0.01 % at typical gas Reynolds numbers (common practice).
 *
 * @param densityKgPerM3 gas density at flowing conditions, kg/m³ (> 0)
 * @param temperatureK temperature, K (> 0)
 * @param molarMassKgPerMol molar mass, kg/mol (> 0)
 * @returns dynamic viscosity, Pa·s
 * @throws Error naming the field when an input is not a finite positive number
 */
export function leeGonzalezEakinViscosityPaS(
  densityKgPerM3: number,
  temperatureK: number,
  molarMassKgPerMol: number,
): number {
  if (!Number.isFinite(densityKgPerM3) || densityKgPerM3 <= 0) {
    throw new Error(`leeGonzalezEakinViscosityPaS: densityKgPerM3 must be a finite number > 0, got ${densityKgPerM3}`);
  }
  if (!Number.isFinite(temperatureK) || temperatureK <= 0) {
    throw new Error(`leeGonzalezEakinViscosityPaS: temperatureK must be a finite number > 0, got ${temperatureK}`);
  }
  if (!Number.isFinite(molarMassKgPerMol) || molarMassKgPerMol <= 0) {
    throw new Error(
      `leeGonzalezEakinViscosityPaS: molarMassKgPerMol must be a finite number > 0, got ${molarMassKgPerMol}`,
    );
  }
  const tR = temperatureK * 1.8; // kelvin → degrees Rankine (exact)
  const m = molarMassKgPerMol * 1000; // g/mol
  const rho = densityKgPerM3 / 1000; // g/cm³
  const k = ((9.4 + 0.02 * m) * Math.pow(tR, 1.5)) / (209 + 19 * m + tR);
  const x = 3.5 + 986 / tR + 0.01 * m;
  const y = 2.4 - 0.2 * x;
  const muCentipoise = 1e-4 * k * Math.exp(x * Math.pow(rho, y));
  return muCentipoise * 1e-3; // 1 cP = 1 mPa·s
}
