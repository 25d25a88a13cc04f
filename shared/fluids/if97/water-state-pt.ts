import { if97Region } from './if97-region';
import { region1State } from './region1';
import { region2State } from './region2';
import { region3DensityKgPerM3, region3StateRhoT } from './region3';
import { region5State } from './region5';
import { saturationPressurePa } from './saturation';
import { CRITICAL_TEMPERATURE_K } from './constants';
import { type WaterState } from './water-state';

/**
 * Thermodynamic properties of water or steam at given pressure and temperature by
 * IAPWS-IF97 (IAPWS R7-97(2012)), regions 1, 2, 3 and 5 selected as in `if97Region`.
 *
 * Region 3 has no explicit p,T equation in the release; its density is found by solving the
 * basic equation p(ρ,T) = p (see `region3DensityKgPerM3`), the liquid-like root when
 * p ≥ psat(T) below the critical temperature, the vapour-like root otherwise.
 *
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @returns the state (density, h, u, s, cp, cv, w, κ, region)
 * @throws Error naming the field when p or T is not finite, ≤ 0, or outside IF97's range
 */
export function waterStatePT(pressurePa: number, temperatureK: number): WaterState {
  const region = if97Region(pressurePa, temperatureK);
  switch (region) {
    case 1:
      return region1State(pressurePa, temperatureK);
    case 2:
      return region2State(pressurePa, temperatureK);
    case 5:
      return region5State(pressurePa, temperatureK);
    default: {
      const liquid = temperatureK < CRITICAL_TEMPERATURE_K && pressurePa >= saturationPressurePa(temperatureK);
      const rho = region3DensityKgPerM3(pressurePa, temperatureK, liquid || temperatureK >= CRITICAL_TEMPERATURE_K);
      const state = region3StateRhoT(rho, temperatureK);
      // Report the requested pressure, not the equation's round-trip value (equal to ~1e-14).
      return { ...state, pressurePa };
    }
  }
}
