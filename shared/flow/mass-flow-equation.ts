/**
 * The general DP equation, ISO 5167-1:2003 §5.1 eq. (1):
 * qm = C/sqrt(1 − β⁴) · ε · (π/4) d² · sqrt(2Δpρ1).
 */

/**
 * @param dischargeCoefficient C
 * @param expansibility ε
 * @param beta diameter ratio (cone: the equivalent β)
 * @param boreDiameterM d at flowing temperature (cone: βD), m
 * @param differentialPressurePa Δp, Pa (≤ 0 gives no flow)
 * @param densityKgPerM3 ρ1 upstream, kg/m³
 * @returns qm, kg/s
 */
export function massFlowFromEquationKgPerS(
  dischargeCoefficient: number,
  expansibility: number,
  beta: number,
  boreDiameterM: number,
  differentialPressurePa: number,
  densityKgPerM3: number,
): number {
  if (!(differentialPressurePa > 0)) return 0;
  const beta4 = beta * beta * beta * beta;
  return (
    (dischargeCoefficient / Math.sqrt(1 - beta4)) *
    expansibility *
    (Math.PI / 4) *
    boreDiameterM *
    boreDiameterM *
    Math.sqrt(2 * differentialPressurePa * densityKgPerM3)
  );
}

/**
 * Pipe Reynolds number from mass flow, Re_D = 4 qm/(π μ D).
 * @param massFlowKgPerS qm, kg/s
 * @param viscosityPaS dynamic viscosity μ, Pa·s
 * @param pipeDiameterM D, m
 * @returns Re_D
 */
export function pipeReynoldsNumber(massFlowKgPerS: number, viscosityPaS: number, pipeDiameterM: number): number {
  return (4 * massFlowKgPerS) / (Math.PI * viscosityPaS * pipeDiameterM);
}
