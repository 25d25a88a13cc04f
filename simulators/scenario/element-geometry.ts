/**
 * Element diameters for a stated beta ratio: what an element maker's data sheet gives, so the
 * demo elements reproduce SCENARIO.md's β exactly when the engine computes β back from them.
 */

/** Diameters are stated to the micrometre, as on a calibration certificate (common practice). */
const DIAMETER_RESOLUTION_M = 1e-6;

const roundToResolution = (diameterM: number) => Math.round(diameterM / DIAMETER_RESOLUTION_M) * DIAMETER_RESOLUTION_M;

function check(functionName: string, pipeDiameterM: number, beta: number) {
  if (!(pipeDiameterM > 0 && Number.isFinite(pipeDiameterM)))
    throw new Error(`${functionName}: pipeDiameterM must be > 0 (got ${pipeDiameterM})`);
  if (!(beta > 0 && beta < 1)) throw new Error(`${functionName}: beta must be between 0 and 1 (got ${beta})`);
}

/**
 * Cone diameter for a beta ratio. ISO 5167-5:2016 defines β = sqrt(1 − dc²/D²), so
 * dc = D · sqrt(1 − β²).
 * @param pipeDiameterM inside diameter of the pipe D, m
 * @param beta beta ratio
 * @returns cone diameter dc, m, to the micrometre
 * @example coneDiameterForBetaM(0.07366, 0.65) // 0.055977
 */
export function coneDiameterForBetaM(pipeDiameterM: number, beta: number): number {
  check('coneDiameterForBetaM', pipeDiameterM, beta);
  return roundToResolution(pipeDiameterM * Math.sqrt(1 - beta * beta));
}

/**
 * Bore (throat) diameter for a beta ratio: β = d/D (ISO 5167-1 §3.3.1), so d = β · D.
 * @param pipeDiameterM inside diameter of the pipe D, m
 * @param beta beta ratio
 * @returns bore diameter d, m, to the micrometre
 */
export function boreDiameterForBetaM(pipeDiameterM: number, beta: number): number {
  check('boreDiameterForBetaM', pipeDiameterM, beta);
  return roundToResolution(pipeDiameterM * beta);
}
