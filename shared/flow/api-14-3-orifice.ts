/**
 * The US orifice method: API MPMS Chapter 14.3 / AGA Report No. 3 (1992, reaffirmed 2012), Part 1.
 * Flange-tapped, square-edged concentric orifice plates only (Part 1 gives the equation for flange
 * taps). The discharge coefficient is the 1992 Reader-Harris/Gallagher (RG) equation, the same form as
 * ISO 5167-2:2003 eq. (4) with different constants:
 *
 *   C = Ci(CT) + Tu(1 − 0.23A) + Td(1 − 0.14A) + 0.000511(10⁶β/Re_D)^0.7 + (0.0210 + 0.0049A)β⁴ Cr
 *   Ci(CT) = 0.5961 + 0.0291β² − 0.2290β⁸ + 0.003(1 − β)M1,   M1 = max(2.8 − D/N4, 0)
 *   Tu = [0.0433 + 0.0712e^(−8.5 L1) − 0.1145e^(−6.0 L1)] β⁴/(1 − β⁴)
 *   Td = −0.0116 [M2 − 0.52 M2^1.3] β^1.1,   M2 = 2 L2/(1 − β),   L1 = L2 = N4/D (N4 = 1 in = 0.0254 m)
 *   A = (19000β/Re_D)^0.8,   Cr = (10⁶/Re_D)^0.35 = 250^0.35 X^0.35 with X = 4000/Re_D; for X ≥ 1.1421
 *   (Re_D below about 3502) the procedure uses 250^0.35 (4.3435 − 3.7644/X) instead, which joins smoothly.
 *
 * Where ISO 5167-2:2003 differs: 0.0261β², −0.216β⁸; 0.000521(10⁶β/Re_D)^0.7; (0.0188 + 0.0063A)β^3.5
 * (10⁶/Re_D)^0.3; upstream 0.043 + 0.080e^(−10L1) − 0.123e^(−7L1) with (1 − 0.11A); downstream
 * −0.031(M2 − 0.8M2^1.1)β^1.3 with no A factor; small pipe 0.011(0.75 − β)(2.8 − D/25.4 mm).
 *
 * Sources: the equation and constants are written from memory of AGA Report No. 3 Part 1 (1992) §1.7.2
 * and confirmed against the open implementation shakeelr/AGA3 (aga3.py, procedures 4.3.2.5 and
 * 4.3.2.9 of Part 4), which carries the same A0…A6 and S1…S8 constants.
 */

/** One inch in metres: N4 of AGA 3 for D in metres, and the flange tap distance. */
const INCH_M = 0.0254;

/**
 * Below Re_D = 4000/X_c the 1992 procedure replaces (10⁶/Re_D)^0.35 by a straight fit in 1/X so the
 * equation stays smooth at low Re_D (Part 4 procedure 4.3.2.9; constants from the open implementation).
 */
const LOW_REYNOLDS_X = 1.142139337256165;
const LOW_REYNOLDS_A = 4.343524261523267;
const LOW_REYNOLDS_B = 3.764387693320165;

/**
 * Prepares the 1992 RG equation for one flange-tapped plate.
 * @param beta diameter ratio d/D at flowing temperature
 * @param pipeDiameterM meter tube diameter at flowing temperature, m
 * @returns C as a function of the pipe Reynolds number
 */
export function prepareApiOrificeDischargeCoefficient(
  beta: number,
  pipeDiameterM: number,
): (reynoldsNumber: number) => number {
  if (!(beta > 0 && beta < 1))
    throw new Error(`prepareApiOrificeDischargeCoefficient: beta must be in (0, 1) (got ${beta})`);
  if (!(pipeDiameterM > 0))
    throw new Error(`prepareApiOrificeDischargeCoefficient: pipeDiameterM must be > 0 (got ${pipeDiameterM})`);
  const l1 = INCH_M / pipeDiameterM;
  const l2 = l1;
  const beta2 = beta * beta;
  const beta4 = beta2 * beta2;
  const beta8 = beta4 * beta4;
  const m1 = Math.max(2.8 - pipeDiameterM / INCH_M, 0);
  const m2 = (2 * l2) / (1 - beta);
  const cornerPart = 0.5961 + 0.0291 * beta2 - 0.229 * beta8 + 0.003 * (1 - beta) * m1;
  const tapUpstream = ((0.0433 + 0.0712 * Math.exp(-8.5 * l1) - 0.1145 * Math.exp(-6.0 * l1)) * beta4) / (1 - beta4);
  const tapDownstream = -0.0116 * (m2 - 0.52 * Math.pow(m2, 1.3)) * Math.pow(beta, 1.1);
  return (reynoldsNumber: number): number => {
    if (!(reynoldsNumber > 0))
      throw new Error(`apiOrificeDischargeCoefficient: reynoldsNumber must be > 0 (got ${reynoldsNumber})`);
    const a = Math.pow((19000 * beta) / reynoldsNumber, 0.8);
    // X = 4000/Re_D; (10⁶/Re_D)^0.35 = 250^0.35 X^0.35, replaced below the switch point.
    const x = 4000 / reynoldsNumber;
    const xPower = x < LOW_REYNOLDS_X ? Math.pow(x, 0.35) : LOW_REYNOLDS_A - LOW_REYNOLDS_B / x;
    const reynoldsTerm = Math.pow(250, 0.35) * xPower;
    return (
      cornerPart +
      tapUpstream * (1 - 0.23 * a) +
      tapDownstream * (1 - 0.14 * a) +
      0.000511 * Math.pow((1e6 * beta) / reynoldsNumber, 0.7) +
      (0.021 + 0.0049 * a) * beta4 * reynoldsTerm
    );
  };
}

/**
 * API 14.3 discharge coefficient of a flange-tapped orifice plate at one Re_D.
 * @param beta diameter ratio d/D
 * @param reynoldsNumber pipe Reynolds number Re_D
 * @param pipeDiameterM meter tube diameter, m
 * @returns C
 */
export function apiOrificeDischargeCoefficient(beta: number, reynoldsNumber: number, pipeDiameterM: number): number {
  return prepareApiOrificeDischargeCoefficient(beta, pipeDiameterM)(reynoldsNumber);
}

function checkExpansionInputs(
  fn: string,
  beta: number,
  differentialPressurePa: number,
  staticPressurePa: number,
  isentropicExponent: number,
): void {
  if (!(beta > 0 && beta < 1)) throw new Error(`${fn}: beta must be in (0, 1) (got ${beta})`);
  if (!(staticPressurePa > 0)) throw new Error(`${fn}: staticPressurePa must be > 0 (got ${staticPressurePa})`);
  if (!(differentialPressurePa >= 0)) {
    throw new Error(`${fn}: differentialPressurePa must be ≥ 0 (got ${differentialPressurePa})`);
  }
  if (!(isentropicExponent > 0)) throw new Error(`${fn}: isentropicExponent must be > 0 (got ${isentropicExponent})`);
}

/**
 * Expansion factor referred to the upstream tap (AGA 3 Part 1 §1.7.3, from memory; same form as the
 * open implementation's procedure 4.3.2.7): Y1 = 1 − (0.41 + 0.35β⁴) x1/κ, x1 = Δp/p_f1.
 * @param beta diameter ratio
 * @param differentialPressurePa Δp, Pa
 * @param upstreamPressurePa absolute static pressure at the upstream tap, Pa
 * @param isentropicExponent κ
 * @returns Y1
 */
export function apiExpansionFactorUpstream(
  beta: number,
  differentialPressurePa: number,
  upstreamPressurePa: number,
  isentropicExponent: number,
): number {
  checkExpansionInputs(
    'apiExpansionFactorUpstream',
    beta,
    differentialPressurePa,
    upstreamPressurePa,
    isentropicExponent,
  );
  if (!(differentialPressurePa < upstreamPressurePa)) {
    throw new Error(
      `apiExpansionFactorUpstream: differentialPressurePa must be below staticPressurePa (got ${differentialPressurePa} with ${upstreamPressurePa})`,
    );
  }
  const beta4 = beta * beta * beta * beta;
  return 1 - ((0.41 + 0.35 * beta4) * (differentialPressurePa / upstreamPressurePa)) / isentropicExponent;
}

/**
 * Expansion factor referred to the downstream tap (AGA 3 Part 1 §1.7.3, from memory), used with the
 * density at the downstream tap: Y2 = Y1 · sqrt[(p_f1/p_f2)(Z_f2/Z_f1)], so Y2 sqrt(ρ2) = Y1 sqrt(ρ1).
 * With x2 = Δp/p_f2 and Z_f2 = Z_f1: Y2 = sqrt(1 + x2) − (0.41 + 0.35β⁴) x2 / (κ sqrt(1 + x2)).
 *
 * The published equation carries Z_f2/Z_f1: it is what makes the mass flow the same whichever tap the
 * density is taken at (ρ = pM/(ZRT), with T the same at both taps). It is not 1 for a real gas: over
 * Δp the compressibility of a lean natural gas near 4 MPa changes by about (1 − Z)·x, so taking it as 1
 * biases Y2 by about half of that (≈ 0.04 % at x = 1 %, Z = 0.92), which is not negligible beside a
 * 0.5 % budget. Pass the ratio from the equation of state at both taps (apiDownstreamCompressibilityRatio).
 * @param beta diameter ratio
 * @param differentialPressurePa Δp, Pa
 * @param downstreamPressurePa absolute static pressure at the downstream tap, Pa
 * @param isentropicExponent κ
 * @param compressibilityRatio Z_f2/Z_f1 (1 when not known: the caller says so)
 * @returns Y2
 */
export function apiExpansionFactorDownstream(
  beta: number,
  differentialPressurePa: number,
  downstreamPressurePa: number,
  isentropicExponent: number,
  compressibilityRatio = 1,
): number {
  checkExpansionInputs(
    'apiExpansionFactorDownstream',
    beta,
    differentialPressurePa,
    downstreamPressurePa,
    isentropicExponent,
  );
  if (!(compressibilityRatio > 0)) {
    throw new Error(`apiExpansionFactorDownstream: compressibilityRatio must be > 0 (got ${compressibilityRatio})`);
  }
  // AGA 3 Part 4 procedure 4.3.2.6: p_f1 = p_f2 + Δp.
  const upstreamPressurePa = downstreamPressurePa + differentialPressurePa;
  const y1 = apiExpansionFactorUpstream(beta, differentialPressurePa, upstreamPressurePa, isentropicExponent);
  return y1 * Math.sqrt((upstreamPressurePa / downstreamPressurePa) * compressibilityRatio);
}
