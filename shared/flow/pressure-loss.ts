/**
 * Permanent (non-recoverable) pressure loss of a primary element.
 */
import type { ElementKind } from './flow-types';

/**
 * Orifice plates (ISO 5167-2:2003 §5.4.1 eq. 7) and, by the same relation, nozzles
 * (ISO 5167-3:2003 §5.1.8 / §5.2.8 [mem]):
 * Δϖ = [sqrt(1 − β⁴(1 − C²)) − Cβ²] / [sqrt(1 − β⁴(1 − C²)) + Cβ²] · Δp.
 * Cone meters (ISO 5167-5:2016, TRADE.md §2 [lib]): Δϖ = (1.09 − 0.813β) Δp.
 * Venturi tubes: ISO 5167-4 gives only a range (about 5 % to 20 % of Δp), so null.
 * @param kind element kind
 * @param beta β
 * @param dischargeCoefficient C
 * @param differentialPressurePa Δp, Pa
 * @returns Δϖ in Pa, or null where the standard gives no equation
 */
export function pressureLossPa(
  kind: ElementKind,
  beta: number,
  dischargeCoefficient: number,
  differentialPressurePa: number,
): number | null {
  if (kind === 'orifice' || kind === 'nozzle') {
    const beta2 = beta * beta;
    const root = Math.sqrt(1 - beta2 * beta2 * (1 - dischargeCoefficient * dischargeCoefficient));
    const cb2 = dischargeCoefficient * beta2;
    return ((root - cb2) / (root + cb2)) * differentialPressurePa;
  }
  if (kind === 'cone') return (1.09 - 0.813 * beta) * differentialPressurePa;
  return null;
}
