/**
 * How a meter run's energy is computed, chosen once per configuration version:
 * - natural gas: standard volume × superior (gross) volumetric calorific value at base
 *   conditions, ISO 6976:2016 (shared/fluids/heating-value), with the combustion reference
 *   temperature equal to the base temperature (15 °C/15 °C, 60 °F/60 °F, 20 °C/20 °C, 0 °C/0 °C
 *   pairs: common practice of gas contracts). The standard volume comes from the AGA 8 base
 *   density and the calorific value from ISO 6976's own compression factor at base; the two Z
 *   differ by about 1e-4 at base conditions (both near 0.998), within ISO 6976's uncertainty.
 *   A base temperature that ISO 6976 does not tabulate gives no energy (reason recorded).
 * - steam: mass × specific enthalpy by IAPWS-IF97 relative to saturated liquid water at the
 *   triple point (273.16 K, 611.657 Pa), the IAPWS zero of internal energy and entropy, so the
 *   figure is the heat content above water at 0.01 °C (a boiler-house convention; a site that
 *   bills against condensate return should subtract its own feedwater enthalpy). Steam lines are
 *   hazardous: these figures are for accounting and never a basis for pressure-system decisions,
 *   which follow local codes and licensed practice.
 * - water, liquid, ideal gas: no energy (null).
 */
import { region1State } from '../fluids/if97';
import { canonicalComponentName } from '../fluids/aga8/detail-composition';
import { iso6976Properties } from '../fluids/heating-value';
import { ISO6976_UNCONFIRMED_COMPONENTS } from '../fluids/heating-value/iso6976-data';
import type { FluidSpec } from '../fluids';

/** Triple point of water, IAPWS R7-97(2012) §2 / IAPWS-95: 273.16 K and 611.657 Pa [std]. */
const TRIPLE_POINT_TEMPERATURE_K = 273.16;
const TRIPLE_POINT_PRESSURE_PA = 611.657;

export type EnergyBasis =
  | {
      kind: 'standard-volume';
      superiorJPerM3: number;
      /**
       * Components present whose ISO 6976 data no worked example has confirmed yet
       * (ISO6976_UNCONFIRMED_COMPONENTS): energy computed with them is flagged on the hour.
       */
      unconfirmedComponents: string[];
    }
  | { kind: 'steam-enthalpy'; referenceEnthalpyJPerKg: number }
  | { kind: 'none'; reason: string };

/**
 * @param fluid the configuration version's fluid
 * @param base base conditions of the site
 * @returns how energy is computed for that fluid, or why it is not
 */
export function energyBasisOf(fluid: FluidSpec, base: { pressurePa: number; temperatureK: number }): EnergyBasis {
  if (fluid.kind === 'natural-gas') {
    try {
      const cv = iso6976Properties(fluid.composition, {
        combustionTemperatureK: base.temperatureK,
        meteringTemperatureK: base.temperatureK,
        meteringPressurePa: base.pressurePa,
      });
      const unconfirmedComponents = Object.entries(fluid.composition)
        .filter(([, x]) => x > 0)
        .map(([name]) => canonicalComponentName(name))
        .filter((name) => ISO6976_UNCONFIRMED_COMPONENTS.includes(name));
      return { kind: 'standard-volume', superiorJPerM3: cv.superiorVolumetricJPerM3, unconfirmedComponents };
    } catch (error) {
      return { kind: 'none', reason: (error as Error).message };
    }
  }
  if (fluid.kind === 'steam') {
    // Region 1 explicitly: at saturation pressure the region selector would take the vapour side.
    const reference = region1State(TRIPLE_POINT_PRESSURE_PA, TRIPLE_POINT_TEMPERATURE_K);
    return { kind: 'steam-enthalpy', referenceEnthalpyJPerKg: reference.specificEnthalpyJPerKg };
  }
  return { kind: 'none', reason: `no energy basis for a ${fluid.kind} fluid` };
}
