/**
 * Discharge coefficients of the nozzles of ISO 5167-3:2003.
 */
import type { NozzleType } from './flow-types';

/**
 * Prepares the nozzle C equation for one β so the Re_D iteration only evaluates the Re term.
 * ISA 1932 nozzle, ISO 5167-3 §5.1.6.2: C = 0.9900 − 0.2262β^4.1 − (0.00175β² − 0.0033β^4.15)(1e6/Re_D)^1.15.
 * Long-radius nozzle, ISO 5167-3 §5.2.6.2: C = 0.9965 − 0.00653β^0.5 (1e6/Re_D)^0.5.
 * @param nozzleType 'isa-1932' or 'long-radius'
 * @param beta diameter ratio d/D
 * @returns C as a function of Re_D
 */
export function prepareNozzleDischargeCoefficient(
  nozzleType: NozzleType,
  beta: number,
): (reynoldsNumber: number) => number {
  if (!(beta > 0 && beta < 1))
    throw new Error(`prepareNozzleDischargeCoefficient: beta must be in (0, 1) (got ${beta})`);
  if (nozzleType === 'isa-1932') {
    const infinite = 0.99 - 0.2262 * Math.pow(beta, 4.1);
    const slope = 0.00175 * beta * beta - 0.0033 * Math.pow(beta, 4.15);
    return (re) => infinite - slope * Math.pow(1e6 / re, 1.15);
  }
  if (nozzleType === 'long-radius') {
    const slope = 0.00653 * Math.sqrt(beta);
    return (re) => 0.9965 - slope * Math.sqrt(1e6 / re);
  }
  throw new Error(
    `prepareNozzleDischargeCoefficient: element.nozzleType must be isa-1932 or long-radius (got ${String(nozzleType)})`,
  );
}

/**
 * Nozzle discharge coefficient (ISO 5167-3:2003 §5.1.6.2 and §5.2.6.2).
 * @param nozzleType 'isa-1932' or 'long-radius'
 * @param beta diameter ratio
 * @param reynoldsNumber pipe Reynolds number Re_D
 * @returns C
 */
export function nozzleDischargeCoefficient(nozzleType: NozzleType, beta: number, reynoldsNumber: number): number {
  if (!(reynoldsNumber > 0))
    throw new Error(`nozzleDischargeCoefficient: reynoldsNumber must be > 0 (got ${reynoldsNumber})`);
  return prepareNozzleDischargeCoefficient(nozzleType, beta)(reynoldsNumber);
}
