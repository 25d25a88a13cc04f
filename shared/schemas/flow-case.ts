/**
 * zod schema of the flow calculation case (DESIGN.md, "Interfaces that checks rely on"): the
 * body of POST /api/calculations/flow and the input of `npm run flow-calc`. Errors carry the
 * field path (e.g. "element.boreDiameterM"); flowCaseErrorFromZod turns them into
 * { code: 'invalid_case', message, field }.
 */
import { z } from 'zod';
import { canonicalComponentName, lookUpComponentName } from '../fluids/aga8/detail-composition';
import { DETAIL_COMPONENTS } from '../fluids/aga8/detail-constants';

const positive = (what: string) => z.number({ error: `${what} must be a number` }).positive(`${what} must be > 0`);
const required = (what: string) => ({
  error: (iss: { input?: unknown }) => (iss.input === undefined ? `${what} is required` : `${what} must be an object`),
});

const materialName = z.enum(['stainless-304', 'stainless-316', 'carbon-steel', 'uns-n04400', 'uns-n10276']);

export const calibrationPointSchema = z.object({
  reynoldsNumber: positive('reynoldsNumber'),
  dischargeCoefficient: positive('dischargeCoefficient').max(1.2, 'dischargeCoefficient must be ≤ 1.2'),
});

export const elementSpecSchema = z
  .object(
    {
      kind: z.enum(['orifice', 'venturi', 'nozzle', 'cone']),
      taps: z.enum(['flange', 'corner', 'D-D/2']).optional(),
      /** Orifice only: ISO 5167-2:2003 (default) or API MPMS 14.3 / AGA Report No. 3 Part 1. */
      method: z.enum(['iso-5167-2', 'api-14.3'], { error: 'method must be iso-5167-2 or api-14.3' }).optional(),
      /** API 14.3 only: the static tap the expansion factor is referred to, as installed (default upstream). */
      expansionReference: z
        .enum(['upstream', 'downstream'], { error: 'expansionReference must be upstream or downstream' })
        .optional(),
      venturiType: z.enum(['as-cast', 'machined', 'rough-welded']).optional(),
      nozzleType: z.enum(['isa-1932', 'long-radius']).optional(),
      pipeDiameterM: positive('pipeDiameterM').max(10, 'pipeDiameterM must be in metres (≤ 10 m)'),
      boreDiameterM: positive('boreDiameterM').optional(),
      coneDiameterM: positive('coneDiameterM').optional(),
      referenceTemperatureK: positive('referenceTemperatureK').optional(),
      pipeExpansionPerK: z.number().min(-1e-3).max(1e-3).optional(),
      elementExpansionPerK: z.number().min(-1e-3).max(1e-3).optional(),
      pipeMaterial: materialName.optional(),
      elementMaterial: materialName.optional(),
      dischargeCoefficient: positive('dischargeCoefficient').max(1.2, 'dischargeCoefficient must be ≤ 1.2').optional(),
      calibration: z.array(calibrationPointSchema).min(1, 'calibration needs at least one point').optional(),
      calibrationUncertaintyPercent: positive('calibrationUncertaintyPercent')
        .max(10, 'calibrationUncertaintyPercent must be ≤ 10 %')
        .optional(),
      /** A fixed dischargeCoefficient measured by a calibration (its U(C) is calibrationUncertaintyPercent, k = 2). */
      dischargeCoefficientCalibrated: z
        .boolean({ error: 'dischargeCoefficientCalibrated must be true or false' })
        .optional(),
      /** Who calibrated the element, and the certificate (reference text). */
      calibrationLaboratory: z
        .string({ error: 'calibrationLaboratory must be text' })
        .trim()
        .min(1, 'calibrationLaboratory must not be empty')
        .max(200, 'calibrationLaboratory must be at most 200 characters')
        .optional(),
    },
    required('element'),
  )
  .superRefine((e, ctx) => {
    const need = (field: keyof typeof e, why: string) => {
      if (e[field] === undefined)
        ctx.addIssue({ code: 'custom', path: [field], message: `${field} is required ${why}` });
    };
    if (e.kind === 'orifice') need('taps', 'for an orifice (flange, corner or D-D/2)');
    if (e.method !== undefined && e.kind !== 'orifice') {
      ctx.addIssue({ code: 'custom', path: ['method'], message: 'method belongs to an orifice element' });
    }
    if (e.method === 'api-14.3' && e.taps !== undefined && e.taps !== 'flange') {
      ctx.addIssue({
        code: 'custom',
        path: ['taps'],
        message: `taps must be flange for method api-14.3 (API MPMS 14.3 Part 1 covers flange taps only; got ${e.taps})`,
      });
    }
    if (e.expansionReference !== undefined && e.method !== 'api-14.3') {
      ctx.addIssue({
        code: 'custom',
        path: ['expansionReference'],
        message: 'expansionReference belongs to an orifice with method api-14.3',
      });
    }
    if (e.kind === 'venturi') need('venturiType', 'for a venturi (as-cast, machined or rough-welded)');
    if (e.kind === 'nozzle') need('nozzleType', 'for a nozzle (isa-1932 or long-radius)');
    if (e.kind === 'cone') {
      need('coneDiameterM', 'for a cone meter');
      if (e.coneDiameterM !== undefined && e.coneDiameterM >= e.pipeDiameterM) {
        ctx.addIssue({
          code: 'custom',
          path: ['coneDiameterM'],
          message: `coneDiameterM (${e.coneDiameterM} m) must be below pipeDiameterM (${e.pipeDiameterM} m)`,
        });
      }
    } else {
      need('boreDiameterM', `for a ${e.kind}`);
      if (e.boreDiameterM !== undefined && e.boreDiameterM >= e.pipeDiameterM) {
        ctx.addIssue({
          code: 'custom',
          path: ['boreDiameterM'],
          message: `boreDiameterM (${e.boreDiameterM} m) must be below pipeDiameterM (${e.pipeDiameterM} m)`,
        });
      }
    }
    if (e.dischargeCoefficient !== undefined && e.calibration !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['calibration'],
        message: 'give either a fixed dischargeCoefficient or a calibration curve, not both',
      });
    }
    if (e.dischargeCoefficientCalibrated === true) {
      need('dischargeCoefficient', 'when dischargeCoefficientCalibrated is true (the calibrated fixed C)');
      need(
        'calibrationUncertaintyPercent',
        "when the fixed C comes from a calibration (the certificate's U(C), k = 2, %)",
      );
    }
    if (
      e.calibrationLaboratory !== undefined &&
      e.calibration === undefined &&
      e.dischargeCoefficientCalibrated !== true
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['calibrationLaboratory'],
        message:
          'calibrationLaboratory belongs to a calibration: give calibration points or a calibrated fixed dischargeCoefficient',
      });
    }
    if (
      e.calibrationUncertaintyPercent !== undefined &&
      e.calibration === undefined &&
      e.dischargeCoefficientCalibrated !== true
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['calibrationUncertaintyPercent'],
        message:
          'calibrationUncertaintyPercent belongs to a calibration curve: give the calibration points too (or set dischargeCoefficientCalibrated for a calibrated fixed C)',
      });
    }
    if (e.calibration) {
      const seen = new Set<number>();
      e.calibration.forEach((p, i) => {
        if (seen.has(p.reynoldsNumber))
          ctx.addIssue({
            code: 'custom',
            path: ['calibration', i, 'reynoldsNumber'],
            message: `two calibration points at Re_D = ${p.reynoldsNumber}`,
          });
        seen.add(p.reynoldsNumber);
      });
    }
  });

const overrides = {
  isentropicExponent: positive('isentropicExponent').max(5, 'isentropicExponent must be ≤ 5').optional(),
  viscosityPaS: positive('viscosityPaS').max(10, 'viscosityPaS must be in Pa·s (≤ 10)').optional(),
};

/**
 * Mole fractions keyed by component name in any spelling the fluids module accepts ("carbon-dioxide",
 * "Carbon Dioxide", "CO2", "i-butane"; one lookup, lookUpComponentName, for every boundary), turned
 * into the canonical kebab-case names. An unknown name is an issue at `composition.<name>` listing
 * close matches; one component given under two spellings is an issue at the second spelling.
 */
const compositionRecord = z
  .record(z.string(), z.number().min(0, 'mole fractions must be ≥ 0').max(1, 'mole fractions must be ≤ 1'), {
    error: (iss) =>
      iss.input === undefined ? 'composition (mole fractions by component) is required for natural gas' : undefined,
  })
  .superRefine((c, ctx) => {
    const firstSpelling = new Map<string, string>();
    for (const key of Object.keys(c)) {
      const found = lookUpComponentName(key);
      if (!found.known) {
        const close = found.closeMatches.length ? `did you mean ${found.closeMatches.join(', ')}? ` : '';
        ctx.addIssue({
          code: 'custom',
          path: [key],
          message: `unknown component "${key}" (${close}known: ${DETAIL_COMPONENTS.join(', ')})`,
        });
        continue;
      }
      const earlier = firstSpelling.get(found.canonical);
      if (earlier !== undefined)
        ctx.addIssue({
          code: 'custom',
          path: [key],
          message: `${found.canonical} is given twice ("${earlier}" and "${key}")`,
        });
      else firstSpelling.set(found.canonical, key);
    }
  })
  .transform((c) => {
    const canonical: Record<string, number> = {};
    for (const [key, fraction] of Object.entries(c)) canonical[canonicalComponentName(key)] = fraction;
    return canonical;
  });

export const fluidSpecSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.enum(['water', 'steam']), ...overrides }),
    z.object({
      kind: z.literal('natural-gas'),
      composition: compositionRecord
        .refine((c) => Object.keys(c).length > 0, 'composition needs at least one component')
        .refine(
          (c) => Math.abs(Object.values(c).reduce((s, x) => s + x, 0) - 1) <= 0.01,
          'mole fractions must add up to 1 (within 0.01)',
        ),
      ...overrides,
    }),
    z.object({
      kind: z.literal('ideal-gas'),
      molarMassKgPerMol: positive('molarMassKgPerMol').max(1, 'molarMassKgPerMol is in kg/mol (air 0.02897)'),
      compressibility: positive('compressibility').max(3).optional(),
      ...overrides,
    }),
    z.object({
      kind: z.literal('liquid'),
      densityKgPerM3: positive('densityKgPerM3').max(25000),
      referenceTemperatureK: positive('referenceTemperatureK'),
      expansionPerK: z.number().min(-0.01).max(0.01),
      ...overrides,
    }),
  ],
  {
    error: (iss) =>
      iss.input === undefined ? 'fluid is required' : 'kind must be water, steam, natural-gas, ideal-gas or liquid',
  },
);

export const flowConditionsSchema = z
  .object(
    {
      differentialPressurePa: positive('differentialPressurePa'),
      staticPressurePa: positive('staticPressurePa (absolute)'),
      temperatureK: positive('temperatureK'),
    },
    required('conditions'),
  )
  .superRefine((c, ctx) => {
    if (c.differentialPressurePa >= c.staticPressurePa) {
      ctx.addIssue({
        code: 'custom',
        path: ['differentialPressurePa'],
        message: `differentialPressurePa (${c.differentialPressurePa} Pa) must be below the absolute staticPressurePa (${c.staticPressurePa} Pa)`,
      });
    }
  });

export const baseConditionsSchema = z.object({
  pressurePa: positive('pressurePa'),
  temperatureK: positive('temperatureK'),
});

export const flowCaseSchema = z.object(
  {
    element: elementSpecSchema,
    fluid: fluidSpecSchema,
    conditions: flowConditionsSchema,
    base: baseConditionsSchema.optional(),
  },
  required('the case'),
);

export type FlowCaseInput = z.infer<typeof flowCaseSchema>;

/** The error body of a bad case (DESIGN.md): never a number. */
export interface InvalidCaseError {
  code: 'invalid_case';
  message: string;
  field: string | null;
}

/**
 * Turns a zod error into the error body, naming the first issue's field path.
 * @param error the ZodError of flowCaseSchema.safeParse
 * @returns { code: 'invalid_case', message, field }
 */
export function flowCaseErrorFromZod(error: z.ZodError): InvalidCaseError {
  const issue = error.issues[0];
  const field = issue && issue.path.length > 0 ? issue.path.map(String).join('.') : null;
  const more =
    error.issues.length > 1
      ? ` (and ${error.issues.length - 1} more: ${error.issues
          .slice(1, 4)
          .map((i) => i.path.map(String).join('.') || '(case)')
          .join(', ')})`
      : '';
  return { code: 'invalid_case', message: `${field ?? 'case'}: ${issue?.message ?? 'invalid'}${more}`, field };
}

/**
 * Validates a parsed JSON value as a flow case.
 * @param value parsed JSON
 * @returns { ok: true, value } or { ok: false, error }
 */
export function parseFlowCase(
  value: unknown,
): { ok: true; value: FlowCaseInput } | { ok: false; error: InvalidCaseError } {
  const parsed = flowCaseSchema.safeParse(value);
  return parsed.success ? { ok: true, value: parsed.data } : { ok: false, error: flowCaseErrorFromZod(parsed.error) };
}

/** Fields a message may name: the case's own paths, e.g. "element.boreDiameterM" or "fluid.composition.methane". */
const FIELD_IN_MESSAGE = /\b((?:element|fluid|conditions|base)(?:\.[A-Za-z0-9_-]+)+)/;

/**
 * Turns an error thrown by the engine (whose messages name the function and the field) into
 * the error body, picking the field path out of the message when there is one.
 * @param error anything thrown by solveFlowCase
 * @returns { code: 'invalid_case', message, field }
 */
export function flowCaseErrorFromEngine(error: unknown): InvalidCaseError {
  const message = error instanceof Error ? error.message : String(error);
  const match = FIELD_IN_MESSAGE.exec(message);
  // The fluids module names a gas component without the "fluid." prefix.
  const field = match ? match[1] : /\bcomposition\b/.test(message) ? 'fluid.composition' : null;
  return { code: 'invalid_case', message, field };
}
