/**
 * A meter run's nominal operating point: mass flow, line state and the DP its element develops
 * there, from the flow engine (shared/flow inverted: qm → Δp). The simulator scales this DP with
 * the square of the load, since qm goes as √Δp (ISO 5167-1 eq. 1) — C and ε barely move over a
 * day's swing, so the computed flow follows the simulated one to a fraction of a percent.
 */
import { differentialPressureForMassFlow, prepareElement } from '../../shared/flow';
import type { ElementSpec } from '../../shared/flow/flow-types';
import { fluidState } from '../../shared/fluids';
import { meterRunByTag, siteOf, type ScenarioMeterRun } from '../scenario';

export interface NominalOperatingPoint {
  massFlowKgPerS: number;
  /** Absolute, at the upstream tap, Pa. */
  staticPressurePa: number;
  temperatureK: number;
  densityKgPerM3: number;
  baseDensityKgPerM3: number | null;
  differentialPressurePa: number;
}

/** By meter run tag, then by element object (the scenario's elements are constants). */
const cache = new Map<string, WeakMap<ElementSpec, NominalOperatingPoint>>();
const massFlowCache = new Map<string, number>();

/**
 * Nominal mass flow of a meter run (an outlet carries its inlets' mass less its loss share).
 * @param run scenario meter run
 * @returns qm, kg/s
 */
export function nominalMassFlowKgPerS(run: ScenarioMeterRun): number {
  const hit = massFlowCache.get(run.tag);
  if (hit !== undefined) return hit;
  const value = computeNominalMassFlowKgPerS(run);
  massFlowCache.set(run.tag, value);
  return value;
}

function computeNominalMassFlowKgPerS(run: ScenarioMeterRun): number {
  const flow = run.operating.flow;
  if (flow.kind === 'balance-outlet') {
    return (
      (1 - flow.lossShare) * flow.inletTags.reduce((sum, tag) => sum + nominalMassFlowKgPerS(meterRunByTag(tag)), 0)
    );
  }
  const site = siteOf(run);
  const staticPressurePa = run.operating.staticPressureGaugePa + site.atmosphericPressurePa;
  const state = fluidState(run.fluid, staticPressurePa, run.operating.temperatureK, {
    pressurePa: site.basePressurePa,
    temperatureK: site.baseTemperatureK,
  });
  if (flow.kind === 'mass') return flow.kgPerS;
  if (flow.kind === 'volume') return flow.m3PerS * state.densityKgPerM3;
  if (state.baseDensityKgPerM3 === null)
    throw new Error(`nominalMassFlowKgPerS: ${run.tag} gives a standard volume but its fluid has no base density`);
  return flow.m3PerS * state.baseDensityKgPerM3;
}

/**
 * @param run scenario meter run
 * @param element the element in use (the run's first one, or the one of a configuration change)
 * @returns the nominal operating point with the DP of that element
 */
export function nominalOperatingPoint(
  run: ScenarioMeterRun,
  element: ElementSpec = run.element,
): NominalOperatingPoint {
  let byElement = cache.get(run.tag);
  if (!byElement) cache.set(run.tag, (byElement = new WeakMap()));
  const hit = byElement.get(element);
  if (hit) return hit;
  const site = siteOf(run);
  const staticPressurePa = run.operating.staticPressureGaugePa + site.atmosphericPressurePa;
  const temperatureK = run.operating.temperatureK;
  const state = fluidState(run.fluid, staticPressurePa, temperatureK, {
    pressurePa: site.basePressurePa,
    temperatureK: site.baseTemperatureK,
  });
  const massFlowKgPerS = nominalMassFlowKgPerS(run);
  const dp = differentialPressureForMassFlow(
    prepareElement(element, temperatureK),
    massFlowKgPerS,
    staticPressurePa,
    state,
  );
  const point = {
    massFlowKgPerS,
    staticPressurePa,
    temperatureK,
    densityKgPerM3: state.densityKgPerM3,
    baseDensityKgPerM3: state.baseDensityKgPerM3,
    differentialPressurePa: dp.differentialPressurePa,
  };
  byElement.set(element, point);
  return point;
}
