import type { Warning } from './warning';

/**
 * What a meter run's fluid is, as stored with the meter run and in a flow calculation case
 * (DESIGN.md "Interfaces", the case's "fluid" object). Overrides (isentropicExponent,
 * viscosityPaS) win over computed values.
 */
export type FluidSpec =
  | { kind: 'water' | 'steam'; isentropicExponent?: number; viscosityPaS?: number }
  | { kind: 'natural-gas'; composition: Record<string, number>; isentropicExponent?: number; viscosityPaS?: number }
  | {
      kind: 'ideal-gas';
      molarMassKgPerMol: number;
      compressibility?: number;
      isentropicExponent?: number;
      viscosityPaS?: number;
    }
  | {
      kind: 'liquid';
      densityKgPerM3: number;
      referenceTemperatureK: number;
      expansionPerK: number;
      viscosityPaS?: number;
      isentropicExponent?: number;
    };

/** The fluid's state at flowing (and optionally base) conditions, as the flow equation needs it. */
export interface FluidState {
  /** Density at flowing conditions, kg/m³. */
  densityKgPerM3: number;
  /** Z at flowing conditions; null for liquids and for water in the liquid phase. */
  compressibility: number | null;
  /** Density at base conditions if `base` was given (for water/liquid: at base T and p), else null. */
  baseDensityKgPerM3: number | null;
  /** κ as ISO 5167 uses it (w²ρ/p for water/steam and natural gas); Infinity for an incompressible liquid unless overridden. */
  isentropicExponent: number;
  /** Dynamic viscosity, Pa·s. */
  viscosityPaS: number;
  /** Molar mass, kg/mol; null for a 'liquid' spec. */
  molarMassKgPerMol: number | null;
  /** False for water in the liquid phase and for 'liquid': the flow engine then uses ε = 1. */
  compressible: boolean;
  /** Non-fatal remarks, e.g. fluid.defaultViscosity, fluid.compositionNormalised, if97.region3. */
  warnings: Warning[];
}
