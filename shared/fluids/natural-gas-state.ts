import type { FluidState } from './fluid-types';
import type { Warning } from './warning';
import { type DetailMixture, prepareDetailMixture } from './aga8/prepare-detail-mixture';
import { detailMolarDensityMolPerM3 } from './aga8/detail-molar-density';
import { detailPropertiesTD } from './aga8/detail-properties';
import { DETAIL_GAS_CONSTANT } from './aga8/detail-constants';
import { detailStateWarnings } from './aga8/detail-range';
import { leeGonzalezEakinViscosityPaS } from './lee-gonzalez-eakin-viscosity';

interface CacheEntry {
  mixture: DetailMixture;
  keys: string[];
  values: number[];
}

/**
 * Prepared mixtures keyed by the composition object itself, so that repeated fluidState calls
 * for the same meter run skip the O(21²) mixture set-up. The entry remembers the composition's
 * entries and is rebuilt if the object was mutated in place.
 */
const cache = new WeakMap<object, CacheEntry>();

function unchanged(entry: CacheEntry, composition: Record<string, number>): boolean {
  let n = 0;
  for (const key in composition) {
    if (entry.keys[n] !== key || entry.values[n] !== composition[key]) return false;
    n++;
  }
  return n === entry.keys.length;
}

/**
 * The prepared AGA 8 DETAIL mixture of a composition object, from the cache when possible.
 *
 * @param composition mole fractions keyed by component name
 * @returns the prepared mixture
 */
export function cachedDetailMixture(composition: Record<string, number>): DetailMixture {
  if (composition === null || typeof composition !== 'object') {
    throw new Error(
      'prepareDetailMixture: fluid.composition must be an object of mole fractions keyed by component name',
    );
  }
  const hit = cache.get(composition);
  if (hit !== undefined && unchanged(hit, composition)) return hit.mixture;
  const mixture = prepareDetailMixture(composition);
  const keys = Object.keys(composition);
  cache.set(composition, { mixture, keys, values: keys.map((k) => composition[k]) });
  return mixture;
}

/**
 * FluidState of a natural gas by AGA 8 Part 1 DETAIL (see fluidState).
 *
 * @param composition mole fractions keyed by component name
 * @param pressurePa absolute pressure, Pa
 * @param temperatureK temperature, K
 * @param base base conditions or undefined
 * @param kappa overriding isentropic exponent, if any (then the caloric part is skipped)
 * @param viscosity overriding viscosity, Pa·s, if any
 * @returns the fluid state
 */
export function naturalGasState(
  composition: Record<string, number>,
  pressurePa: number,
  temperatureK: number,
  base: { pressurePa: number; temperatureK: number } | undefined,
  kappa: number | undefined,
  viscosity: number | undefined,
): FluidState {
  const mix = cachedDetailMixture(composition);
  const m = mix.molarMassKgPerMol;
  const diagnostics = { usedFallback: false };
  const molarDensity = detailMolarDensityMolPerM3(mix, pressurePa, temperatureK, diagnostics);
  const isentropicExponent = kappa ?? detailPropertiesTD(mix, temperatureK, molarDensity).isentropicExponent;
  const density = molarDensity * m;
  const z = pressurePa / (molarDensity * DETAIL_GAS_CONSTANT * temperatureK);
  const warnings: Warning[] = [...mix.warnings, ...detailStateWarnings(pressurePa, temperatureK)];
  if (diagnostics.usedFallback) {
    warnings.push({
      code: 'aga8.densityFallback',
      message: `The AGA 8 DETAIL density iteration did not converge from the ideal-gas start; the root found (Z = ${z.toFixed(4)}) may be liquid-like or metastable. Check that the gas is single-phase (outside its phase envelope) at these conditions.`,
    });
  }
  let mu = viscosity;
  if (mu === undefined) {
    mu = leeGonzalezEakinViscosityPaS(density, temperatureK, m);
    warnings.push({
      code: 'fluid.defaultViscosity',
      message:
        'Viscosity not given: Lee–Gonzalez–Eakin (1966) correlation used (about 2–4 %); it affects only the Reynolds number.',
    });
  }
  return {
    densityKgPerM3: density,
    // Z with the DETAIL gas constant, as the standard defines it: Z = P/(DRT).
    compressibility: z,
    baseDensityKgPerM3:
      base === undefined ? null : detailMolarDensityMolPerM3(mix, base.pressurePa, base.temperatureK) * m,
    isentropicExponent,
    viscosityPaS: mu,
    molarMassKgPerMol: m,
    compressible: true,
    warnings,
  };
}
