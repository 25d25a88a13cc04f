/**
 * One entry for both POST /api/calculations/flow and `npm run flow-calc`: an untrusted JSON
 * value in, either the result or the error body out (never a number for a bad case).
 */
import { flowCaseErrorFromEngine, parseFlowCase, type InvalidCaseError } from '../schemas/flow-case';
import type { FlowCase, FlowResult } from './flow-types';
import { solveFlowCase } from './solve-flow-case';

/** The result, with a natural gas's composition echoed under the canonical component names it was solved with. */
export type FlowCalculationResult = FlowResult & { composition?: Record<string, number> };

export type FlowCalculation = { ok: true; result: FlowCalculationResult } | { ok: false; error: InvalidCaseError };

const NUMERIC_FIELDS = [
  'beta',
  'dischargeCoefficient',
  'expansibility',
  'reynoldsNumber',
  'densityKgPerM3',
  'massFlowKgPerS',
  'volumeFlowM3PerS',
] as const;

/**
 * Validates the case with the zod schema, solves it and checks the numbers are finite.
 * @param value parsed JSON of a flow case
 * @returns { ok: true, result } or { ok: false, error: { code, message, field } }
 */
export function calculateFlow(value: unknown): FlowCalculation {
  const parsed = parseFlowCase(value);
  if (!parsed.ok) return parsed;
  try {
    const result = solveFlowCase(parsed.value as FlowCase);
    const bad = NUMERIC_FIELDS.find((k) => !Number.isFinite(result[k]));
    if (bad) {
      return {
        ok: false,
        error: {
          code: 'invalid_case',
          message: `calculateFlow: the case gives a non-finite ${bad} (${result[bad]})`,
          field: null,
        },
      };
    }
    const fluid = parsed.value.fluid;
    return { ok: true, result: fluid.kind === 'natural-gas' ? { ...result, composition: fluid.composition } : result };
  } catch (error) {
    return { ok: false, error: flowCaseErrorFromEngine(error) };
  }
}
