/**
 * A configuration version ready for thousands of evaluations an hour: base density and energy
 * basis computed once; the element prepared at the flowing temperature and the fluid state at
 * (p, T) recomputed only when the temperature or pressure changes from the previous sample
 * (transmitters that report on change, and both DPs of a stacked pair sharing one P and T, give
 * long runs of equal values). Prepared versions are memoised across calls by id and content,
 * so a server recomputing hour after hour keeps them; the memo holds at most
 * PREPARED_VERSION_LIMIT entries and changes no result, only the time taken.
 */
import { prepareElement, type PreparedElement } from '../flow/prepare-element';
import type { ElementSpec } from '../flow/flow-types';
import { fluidState, type FluidSpec, type FluidState } from '../fluids';
import { energyBasisOf, type EnergyBasis } from './energy-basis';
import type { ConfigVersionInput } from './types';

/** Enough for every meter run of a large site to keep its current and previous version. */
const PREPARED_VERSION_LIMIT = 512;

export interface PreparedConfigVersion {
  id: string;
  element: ElementSpec;
  fluid: FluidSpec;
  /** Density at the site's base conditions, kg/m³ (independent of flowing conditions). */
  baseDensityKgPerM3: number | null;
  energy: EnergyBasis;
  /** The element with diameters at a flowing temperature (last one cached). */
  elementAt(temperatureK: number): PreparedElement;
  /** The fluid at flowing conditions, without base density (last one cached). */
  fluidAt(pressurePa: number, temperatureK: number): FluidState;
}

const memo = new Map<string, PreparedConfigVersion>();

function build(version: ConfigVersionInput, base: { pressurePa: number; temperatureK: number }): PreparedConfigVersion {
  const { element, fluid } = version;
  const baseState = fluidState(fluid, base.pressurePa, base.temperatureK, base);
  // Prepared once here so that a bad element fails the whole computation (a configuration
  // error), not sample by sample as missing time.
  let prepared: PreparedElement | null = prepareElement(element, base.temperatureK);
  let elementTemperatureK = base.temperatureK;
  let stateP = NaN;
  let stateT = NaN;
  let state: FluidState | null = null;
  return {
    id: version.id,
    element,
    fluid,
    baseDensityKgPerM3: baseState.baseDensityKgPerM3,
    energy: energyBasisOf(fluid, base),
    elementAt(temperatureK) {
      if (prepared === null || temperatureK !== elementTemperatureK) {
        prepared = prepareElement(element, temperatureK);
        elementTemperatureK = temperatureK;
      }
      return prepared;
    },
    fluidAt(pressurePa, temperatureK) {
      if (state === null || pressurePa !== stateP || temperatureK !== stateT) {
        state = fluidState(fluid, pressurePa, temperatureK);
        stateP = pressurePa;
        stateT = temperatureK;
      }
      return state;
    },
  };
}

/**
 * @param version configuration version (id, element, fluid)
 * @param base base conditions of the site
 * @returns the prepared version, from the memo when the same id, content and base were seen
 * @throws Error naming the field when the element or fluid is invalid
 */
export function prepareConfigVersion(
  version: ConfigVersionInput,
  base: { pressurePa: number; temperatureK: number },
): PreparedConfigVersion {
  const key = `${version.id}|${base.pressurePa}|${base.temperatureK}|${JSON.stringify(version.element)}|${JSON.stringify(version.fluid)}`;
  const hit = memo.get(key);
  if (hit) {
    // Refresh its place so the least recently used entry is the one dropped.
    memo.delete(key);
    memo.set(key, hit);
    return hit;
  }
  const prepared = build(version, base);
  memo.set(key, prepared);
  if (memo.size > PREPARED_VERSION_LIMIT) memo.delete(memo.keys().next().value as string);
  return prepared;
}
