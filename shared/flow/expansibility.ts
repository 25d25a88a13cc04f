/**
 * Expansibility factors ε of the primary elements. Each takes the pressure ratio τ = p2/p1 or
 * Δp/p1 and the isentropic exponent κ; the standards give them for τ ≥ 0.75 (the caller warns).
 */

function checkInputs(
  fn: string,
  beta: number,
  differentialPressurePa: number,
  staticPressurePa: number,
  isentropicExponent: number,
): void {
  if (!(beta > 0 && beta < 1)) throw new Error(`${fn}: beta must be in (0, 1) (got ${beta})`);
  if (!(staticPressurePa > 0)) throw new Error(`${fn}: staticPressurePa must be > 0 (got ${staticPressurePa})`);
  if (!(differentialPressurePa >= 0 && differentialPressurePa < staticPressurePa)) {
    throw new Error(
      `${fn}: differentialPressurePa must be in [0, staticPressurePa) (got ${differentialPressurePa} with staticPressurePa ${staticPressurePa})`,
    );
  }
  if (!(isentropicExponent > 0)) throw new Error(`${fn}: isentropicExponent must be > 0 (got ${isentropicExponent})`);
}

/**
 * Orifice plate, ISO 5167-2:2003 §5.3.2.2 eq. (5): ε = 1 − (0.351 + 0.256β⁴ + 0.93β⁸)(1 − τ^(1/κ)).
 * @param beta diameter ratio
 * @param differentialPressurePa Δp, Pa
 * @param staticPressurePa upstream absolute pressure p1, Pa
 * @param isentropicExponent κ
 * @returns ε
 */
export function orificeExpansibility(
  beta: number,
  differentialPressurePa: number,
  staticPressurePa: number,
  isentropicExponent: number,
): number {
  checkInputs('orificeExpansibility', beta, differentialPressurePa, staticPressurePa, isentropicExponent);
  const beta4 = beta * beta * beta * beta;
  // 1 − τ^(1/κ) with τ = 1 − Δp/p1, written with log1p/expm1 so a small Δp keeps its digits.
  const oneMinusTauPower = -Math.expm1(Math.log1p(-differentialPressurePa / staticPressurePa) / isentropicExponent);
  return 1 - (0.351 + 0.256 * beta4 + 0.93 * beta4 * beta4) * oneMinusTauPower;
}

/**
 * Venturi tubes and nozzles, ISO 5167-4:2003 §5.6 eq. (2) and ISO 5167-3:2003 §5.2.3 (isentropic
 * flow through a contraction):
 * ε = sqrt{ [κτ^(2/κ)/(κ−1)] · [(1−β⁴)/(1−β⁴τ^(2/κ))] · [(1−τ^((κ−1)/κ))/(1−τ)] }.
 * At τ = 1 the last factor tends to (κ−1)/κ and ε to 1; at κ = 1 the first and last factors
 * together tend to τ² ln(1/τ)/(1−τ), used so the function stays finite there.
 * @param beta diameter ratio
 * @param differentialPressurePa Δp, Pa
 * @param staticPressurePa upstream absolute pressure p1, Pa
 * @param isentropicExponent κ
 * @returns ε
 */
export function isentropicExpansibility(
  beta: number,
  differentialPressurePa: number,
  staticPressurePa: number,
  isentropicExponent: number,
): number {
  checkInputs('isentropicExpansibility', beta, differentialPressurePa, staticPressurePa, isentropicExponent);
  if (differentialPressurePa === 0) return 1;
  const k = isentropicExponent;
  const beta4 = beta * beta * beta * beta;
  // x = 1 − τ = Δp/p1 and ln τ = log1p(−x): small differentials keep their digits (no 1 − τ cancellation).
  const x = differentialPressurePa / staticPressurePa;
  const lnTau = Math.log1p(-x);
  const tau2k = Math.exp((2 / k) * lnTau);
  const area = (1 - beta4) / (1 - beta4 * tau2k);
  let energy: number; // [κτ^(2/κ)/(κ−1)]·[(1−τ^((κ−1)/κ))/(1−τ)]
  if (Math.abs(k - 1) < 1e-9) {
    energy = (Math.exp(2 * lnTau) * -lnTau) / x;
  } else {
    energy = ((k * tau2k) / (k - 1)) * (-Math.expm1(((k - 1) / k) * lnTau) / x);
  }
  return Math.sqrt(energy * area);
}

/**
 * Cone meter, ISO 5167-5:2016 §5.5 eq.: ε = 1 − (0.649 + 0.696β⁴) Δp/(κ p1).
 * @param beta diameter ratio sqrt(1 − dc²/D²)
 * @param differentialPressurePa Δp, Pa
 * @param staticPressurePa upstream absolute pressure p1, Pa
 * @param isentropicExponent κ
 * @returns ε
 */
export function coneExpansibility(
  beta: number,
  differentialPressurePa: number,
  staticPressurePa: number,
  isentropicExponent: number,
): number {
  checkInputs('coneExpansibility', beta, differentialPressurePa, staticPressurePa, isentropicExponent);
  const beta4 = beta * beta * beta * beta;
  return 1 - ((0.649 + 0.696 * beta4) * differentialPressurePa) / (isentropicExponent * staticPressurePa);
}
