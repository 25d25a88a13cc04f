/**
 * A meter run's primary element and fluid in a few words, for lists and headers. β comes from
 * the flow engine (shared/flow prepareElement at the element's reference temperature), so the
 * cone's β = √(1 − dc²/D²) is not written a second time here. It imports the flow engine's
 * modules it uses, not shared/flow's index: the index brings the whole solver and the fluid
 * properties with it, which the web client then loads on every first visit (issue 15 item 4).
 */
import type { FluidSpec } from '@/shared/fluids';
import type { ElementSpec } from '@/shared/flow/flow-types';
import { prepareElement } from '@/shared/flow/prepare-element';
import { DEFAULT_REFERENCE_TEMPERATURE_K } from '@/shared/flow/thermal-expansion';
import { fromSI } from '@/shared/units';

const elementNames: Record<ElementSpec['kind'], string> = {
  orifice: 'Orifice',
  venturi: 'Venturi',
  nozzle: 'Nozzle',
  cone: 'Cone',
};
const subtypeNames: Record<string, string> = {
  flange: 'flange taps',
  corner: 'corner taps',
  'D-D/2': 'D and D/2 taps',
  'as-cast': 'as-cast',
  machined: 'machined',
  'rough-welded': 'rough-welded',
  'isa-1932': 'ISA 1932',
  'long-radius': 'long-radius',
};

/**
 * @param element the primary element
 * @returns β at the element's reference temperature, or null when the geometry is incomplete
 */
export function betaOf(element: ElementSpec): number | null {
  try {
    return prepareElement(element, element.referenceTemperatureK ?? DEFAULT_REFERENCE_TEMPERATURE_K).beta;
  } catch {
    return null;
  }
}

/**
 * @param element the primary element
 * @returns e.g. "Orifice, flange taps" or "Cone, calibrated"
 */
export function elementName(element: ElementSpec): string {
  const subtype = element.taps ?? element.venturiType ?? element.nozzleType;
  const detail = subtype
    ? (subtypeNames[subtype] ?? subtype)
    : element.kind === 'cone'
      ? element.calibration
        ? 'calibrated'
        : 'uncalibrated'
      : undefined;
  return detail ? `${elementNames[element.kind]}, ${detail}` : elementNames[element.kind];
}

const fluidNames: Record<FluidSpec['kind'], string> = {
  'natural-gas': 'Natural gas',
  'ideal-gas': 'Gas (ideal)',
  water: 'Water',
  steam: 'Steam',
  liquid: 'Liquid',
};

/**
 * @param fluid the fluid
 * @returns its kind in words, e.g. "Natural gas"
 */
export function fluidName(fluid: FluidSpec): string {
  return fluidNames[fluid.kind] ?? fluid.kind;
}

/**
 * @param fluid the fluid
 * @returns the facts that define it, e.g. "methane 91.4 %, ethane 4.21 %, …" or "M 18.04 g/mol, Z 1"
 */
export function fluidDetail(fluid: FluidSpec): string {
  switch (fluid.kind) {
    case 'natural-gas': {
      const parts = Object.entries(fluid.composition)
        .sort((a, b) => b[1] - a[1])
        .map(([name, fraction]) => `${name} ${(fraction * 100).toPrecision(3)} %`);
      return `${parts.slice(0, 4).join(', ')}${parts.length > 4 ? ` and ${parts.length - 4} more (mole fractions)` : ' (mole fractions)'}`;
    }
    case 'ideal-gas':
      return `molar mass ${(fluid.molarMassKgPerMol * 1000).toPrecision(4)} g/mol, Z ${fluid.compressibility ?? 1}`;
    case 'liquid':
      return `${fluid.densityKgPerM3} kg/m³ at ${fromSI(fluid.referenceTemperatureK, 'degC').toFixed(1)} °C`;
    default:
      return 'IAPWS-IF97 properties';
  }
}
