/**
 * Kept apart from api-14-3-orifice.ts so that the pure expansion-factor equations do not pull the
 * fluid property code (AGA 8 and the rest) into every module that evaluates a flow.
 */
import { fluidState, type FluidSpec } from '../fluids';

/**
 * Z_f2/Z_f1 of the downstream-tap expansion factor, from the fluid's own equation of state (AGA 8
 * DETAIL for natural gas) at the two taps: p_f2 as measured and p_f1 = p_f2 + Δp (AGA 3 Part 4
 * procedure 4.3.2.6), both at the flowing temperature (AGA 3 takes one temperature for both taps).
 * A fluid without a compressibility (a liquid) gives 1: Y2 is not used for it.
 * @param fluid the meter run's fluid
 * @param downstreamPressurePa absolute static pressure at the downstream tap, Pa
 * @param differentialPressurePa Δp, Pa
 * @param temperatureK flowing temperature, K
 * @returns Z_f2/Z_f1
 */
export function apiDownstreamCompressibilityRatio(
  fluid: FluidSpec,
  downstreamPressurePa: number,
  differentialPressurePa: number,
  temperatureK: number,
): number {
  if (!(downstreamPressurePa > 0)) {
    throw new Error(
      `apiDownstreamCompressibilityRatio: downstreamPressurePa must be > 0 (got ${downstreamPressurePa})`,
    );
  }
  if (!(differentialPressurePa >= 0)) {
    throw new Error(
      `apiDownstreamCompressibilityRatio: differentialPressurePa must be ≥ 0 (got ${differentialPressurePa})`,
    );
  }
  const z2 = fluidState(fluid, downstreamPressurePa, temperatureK).compressibility;
  const z1 = fluidState(fluid, downstreamPressurePa + differentialPressurePa, temperatureK).compressibility;
  return z1 === null || z2 === null ? 1 : z2 / z1;
}
