/**
 * Discharge coefficient of a square-edged orifice plate: the Reader-Harris/Gallagher equation,
 * ISO 5167-2:2003 §5.3.2.1 eq. (4), with the small-pipe term for D < 71.12 mm.
 */
import type { OrificeTaps } from './flow-types';

/** 2.8 in, the pipe diameter below which ISO 5167-2 §5.3.2.1 adds the small-pipe term. */
const SMALL_PIPE_LIMIT_M = 2.8 * 0.0254;

/**
 * Tap distances of ISO 5167-2 §5.3.2.1: L1 = l1/D upstream, L2' = l2'/D downstream.
 * @param taps tapping arrangement
 * @param pipeDiameterM pipe diameter, m (flange taps sit 25.4 mm from the plate)
 * @returns L1 and L2'
 */
export function orificeTapDistances(taps: OrificeTaps, pipeDiameterM: number): { l1: number; l2: number } {
  switch (taps) {
    case 'corner':
      return { l1: 0, l2: 0 };
    case 'D-D/2':
      return { l1: 1, l2: 0.47 };
    case 'flange':
      return { l1: 0.0254 / pipeDiameterM, l2: 0.0254 / pipeDiameterM };
    default:
      throw new Error(`orificeTapDistances: element.taps must be flange, corner or D-D/2 (got ${String(taps)})`);
  }
}

/**
 * Prepares the Reader-Harris/Gallagher equation for one plate: every term that depends only on
 * β, D and the taps is computed once, so the Re_D iteration costs three powers per step.
 * @param beta diameter ratio d/D at flowing temperature
 * @param pipeDiameterM pipe diameter at flowing temperature, m
 * @param taps tapping arrangement
 * @returns C as a function of the pipe Reynolds number
 */
export function prepareOrificeDischargeCoefficient(
  beta: number,
  pipeDiameterM: number,
  taps: OrificeTaps,
): (reynoldsNumber: number) => number {
  if (!(beta > 0 && beta < 1))
    throw new Error(`prepareOrificeDischargeCoefficient: beta must be in (0, 1) (got ${beta})`);
  if (!(pipeDiameterM > 0))
    throw new Error(`prepareOrificeDischargeCoefficient: pipeDiameterM must be > 0 (got ${pipeDiameterM})`);
  const { l1, l2 } = orificeTapDistances(taps, pipeDiameterM);
  const beta2 = beta * beta;
  const beta4 = beta2 * beta2;
  const beta8 = beta4 * beta4;
  const m2 = (2 * l2) / (1 - beta);
  // C∞ terms that do not depend on Re_D.
  const constantPart =
    0.5961 + 0.0261 * beta2 - 0.216 * beta8 - 0.031 * (m2 - 0.8 * Math.pow(m2, 1.1)) * Math.pow(beta, 1.3);
  // Upstream tapping term (0.043 + 0.080e^(−10 L1) − 0.123e^(−7 L1)) β⁴/(1 − β⁴), multiplied by (1 − 0.11A).
  const upstream = ((0.043 + 0.08 * Math.exp(-10 * l1) - 0.123 * Math.exp(-7 * l1)) * beta4) / (1 - beta4);
  const smallPipe = pipeDiameterM < SMALL_PIPE_LIMIT_M ? 0.011 * (0.75 - beta) * (2.8 - pipeDiameterM / 0.0254) : 0;
  const slopeFactor = 0.000521 * Math.pow(1e6 * beta, 0.7); // · Re^−0.7
  const aFactor = Math.pow(19000 * beta, 0.8); // A = aFactor · Re^−0.8
  const beta35 = Math.pow(beta, 3.5) * Math.pow(1e6, 0.3); // · Re^−0.3
  const fixed = constantPart + smallPipe;
  return (reynoldsNumber: number): number => {
    const lnInvRe = -Math.log(reynoldsNumber);
    const a = aFactor * Math.exp(0.8 * lnInvRe);
    return (
      fixed +
      slopeFactor * Math.exp(0.7 * lnInvRe) +
      (0.0188 + 0.0063 * a) * beta35 * Math.exp(0.3 * lnInvRe) +
      upstream * (1 - 0.11 * a)
    );
  };
}

/**
 * Reader-Harris/Gallagher discharge coefficient (ISO 5167-2:2003 eq. 4).
 * @param beta diameter ratio d/D
 * @param reynoldsNumber pipe Reynolds number Re_D
 * @param pipeDiameterM pipe diameter, m
 * @param taps tapping arrangement
 * @returns C
 */
export function orificeDischargeCoefficient(
  beta: number,
  reynoldsNumber: number,
  pipeDiameterM: number,
  taps: OrificeTaps,
): number {
  if (!(reynoldsNumber > 0))
    throw new Error(`orificeDischargeCoefficient: reynoldsNumber must be > 0 (got ${reynoldsNumber})`);
  return prepareOrificeDischargeCoefficient(beta, pipeDiameterM, taps)(reynoldsNumber);
}
