/**
 * zod schemas of the set-up resources (sites, meter runs, transmitters, configuration versions,
 * devices), shared by the server (validation) and the client (forms name the same field).
 */
import { z } from 'zod';
import { elementSpecSchema, fluidSpecSchema } from './flow-case';

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);
const positive = (what: string) => finite(what).refine((v) => v > 0, `${what} must be > 0`);
const text = (max = 200) => z.string().trim().min(1, 'is required').max(max);

/** IANA zone names only ("America/Denver"): contract days depend on the zone's DST rules. */
const timeZone = z.string().refine((tz) => {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: tz });
    return tz.includes('/') || tz === 'UTC';
  } catch {
    return false;
  }
}, 'must be an IANA time zone such as America/Denver');

export const siteSchema = z.object({
  code: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9_-]{0,31}$/, 'letters, digits, - and _ only (it is part of MQTT topics)'),
  name: text(),
  timeZone,
  contractHour: z.number().int('must be a whole hour').min(0, 'must be 0–23').max(23, 'must be 0–23'),
  basePressurePa: positive('basePressurePa').refine(
    (v) => v > 50_000 && v < 200_000,
    'basePressurePa must be an absolute pressure in Pa (e.g. 101325)',
  ),
  baseTemperatureK: positive('baseTemperatureK').refine(
    (v) => v > 200 && v < 400,
    'baseTemperatureK must be in kelvin (e.g. 288.15)',
  ),
  atmosphericPressurePa: positive('atmosphericPressurePa').refine(
    (v) => v > 40_000 && v < 120_000,
    'atmosphericPressurePa must be in Pa (e.g. 84000 at altitude)',
  ),
  displayUnits: z.enum(['si', 'us']).default('si'),
});

export const pressureUnits = ['Pa', 'kPa', 'MPa', 'mbar', 'bar', 'psi', 'inH2O-4C', 'inH2O-60F', 'inH2O-68F'] as const;
export const temperatureUnits = ['K', 'degC', 'degF'] as const;
/** A direction input (measure 'flow-direction') reads a sign: > 0 forward, < 0 reverse, 0 no flow. */
export const directionUnits = ['sign'] as const;
export const transmitterUnits = [...pressureUnits, ...temperatureUnits, ...directionUnits] as const;
export const measures = ['differential-pressure', 'static-pressure', 'temperature'] as const;
/** Every measure a transmitter may have: the process measures and a bi-directional meter run's direction input. */
export const transmitterMeasures = [...measures, 'flow-direction'] as const;

export const lineSchema = z
  .object({
    insideDiameterM: positive('insideDiameterM').optional(),
    nominalSize: z.string().max(40).optional(),
    schedule: z.string().max(40).optional(),
    flangeClass: z.string().max(40).optional(),
    pipeMaterial: z.string().max(80).optional(),
    elementMaterial: z.string().max(80).optional(),
    upstreamStraightLengthD: finite('upstreamStraightLengthD')
      .refine((v) => v >= 0, 'must be ≥ 0')
      .optional(),
    downstreamStraightLengthD: finite('downstreamStraightLengthD')
      .refine((v) => v >= 0, 'must be ≥ 0')
      .optional(),
    approvals: z.string().max(500).optional(),
    installDate: z.iso.date('must be a date YYYY-MM-DD').optional(),
    expectedServiceLifeYears: finite('expectedServiceLifeYears')
      .refine((v) => v > 0 && v < 200, 'must be 0–200 years')
      .optional(),
    bidirectional: z.boolean().optional(),
  })
  .strict();

/**
 * How a bi-directional meter run knows the direction of flow: 'dp-sign' (the default), a negative DP
 * is reverse flow; 'direction-input', the DP transmitters read magnitude and a transmitter measuring
 * 'flow-direction' says which way.
 */
export const directionSources = ['dp-sign', 'direction-input'] as const;
const directionSourceField = z.enum(directionSources, { error: `must be one of ${directionSources.join(', ')}` });
const REVERSE_ELEMENT_REQUIRED = "required for a bi-directional meter run: the element's constants in reverse flow";

/** directionSource is only for a bi-directional meter run (one with reverseElement). */
function directionSourceRule(
  v: { reverseElement?: unknown; directionSource?: (typeof directionSources)[number] },
  ctx: z.RefinementCtx,
): void {
  if (v.directionSource !== undefined && v.reverseElement === undefined)
    ctx.addIssue({
      code: 'custom',
      path: ['directionSource'],
      message: 'only for a bi-directional meter run: give reverseElement too',
    });
}

/** The largest PostgreSQL bigint: a longer id names no record and must not reach SQL, where it fails the query. */
const maxBigint = 9_223_372_036_854_775_807n;

/** A record id in a body: a positive integer (exact as a JSON number) or a decimal string that fits a bigint. */
const recordId = (what: string) =>
  z
    .union(
      [
        z.number().int().positive().max(Number.MAX_SAFE_INTEGER),
        z
          .string()
          .regex(/^\d+$/)
          .refine((v) => BigInt(v) <= maxBigint),
      ],
      { error: `must be a ${what} id` },
    )
    .transform(String);

export const meterRunSchema = z
  .object({
    siteId: recordId('site'),
    tag: z
      .string()
      .trim()
      .regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/, 'letters, digits, ., - and _ only'),
    name: text(),
    element: elementSpecSchema,
    fluid: fluidSpecSchema,
    holdLimitS: positive('holdLimitS').default(60),
    maxGapS: positive('maxGapS').default(300),
    stackSwitchUpShare: finite('stackSwitchUpShare')
      .refine((v) => v > 0 && v <= 1, 'must be a share between 0 and 1')
      .default(0.9),
    stackSwitchDownShare: finite('stackSwitchDownShare')
      .refine((v) => v > 0 && v < 1, 'must be a share between 0 and 1')
      .default(0.8),
    line: lineSchema.default({}),
    /** When the first configuration version takes effect (history before it cannot be computed). */
    effectiveFrom: z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' }).optional(),
    reverseElement: elementSpecSchema.optional(),
    directionSource: directionSourceField.optional(),
  })
  .superRefine((m, ctx) => {
    if (m.stackSwitchDownShare >= m.stackSwitchUpShare)
      ctx.addIssue({
        code: 'custom',
        path: ['stackSwitchDownShare'],
        message: 'must be below stackSwitchUpShare (hysteresis)',
      });
    if (m.line.bidirectional === true && m.reverseElement === undefined)
      ctx.addIssue({ code: 'custom', path: ['reverseElement'], message: REVERSE_ELEMENT_REQUIRED });
    if (m.reverseElement !== undefined && m.line.bidirectional !== true)
      ctx.addIssue({
        code: 'custom',
        path: ['line', 'bidirectional'],
        message: 'must be true when reverseElement is given (a bi-directional meter run)',
      });
    directionSourceRule(m, ctx);
  });

export const configVersionSchema = z
  .object({
    effectiveFrom: z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' }),
    element: elementSpecSchema,
    fluid: fluidSpecSchema,
    /** The element's constants in reverse flow: present ⇔ the meter run is bi-directional from effectiveFrom. */
    reverseElement: elementSpecSchema.optional(),
    directionSource: directionSourceField.optional(),
    reason: z.string().trim().min(1, 'is required: say why the configuration changed').max(1000),
  })
  .superRefine(directionSourceRule);

/**
 * What kind of figure a datasheet accuracy is: 'expanded-k2', an expanded uncertainty with k = 2
 * (GUM §6.2), or 'rectangular-limit', a ± limit taken as rectangular, u = a/√3 (GUM §4.3.7).
 */
export const accuracyKinds = ['expanded-k2', 'rectangular-limit'] as const;
export const accuracyKindField = z.enum(accuracyKinds, { error: `must be one of ${accuracyKinds.join(', ')}` });

export const transmitterSchema = z
  .object({
    meterRunId: recordId('meter run'),
    tag: z
      .string()
      .trim()
      .regex(/^[A-Za-z0-9][A-Za-z0-9_.-]{0,63}$/, 'letters, digits, ., - and _ only (it is the MQTT topic)'),
    measures: z.enum(transmitterMeasures, { error: `must be one of ${transmitterMeasures.join(', ')}` }),
    unit: z.enum(transmitterUnits, { error: `must be one of ${transmitterUnits.join(' ')}` }),
    pressureReference: z.enum(['absolute', 'gauge']).default('absolute'),
    lowerRange: finite('lowerRange'),
    upperRange: finite('upperRange'),
    stackRole: z.enum(['single', 'low', 'high']).default('single'),
    accuracyPercentOfSpan: finite('accuracyPercentOfSpan')
      .refine((v) => v > 0 && v < 10, 'must be between 0 and 10 % of span')
      .default(0.075),
    // Optional so that existing callers keep their shape; the database's default is 'expanded-k2'.
    accuracyKind: accuracyKindField.optional(),
    calibrationDue: z.iso.date('must be a date YYYY-MM-DD').optional(),
  })
  .superRefine((t, ctx) => {
    if (t.upperRange <= t.lowerRange)
      ctx.addIssue({ code: 'custom', path: ['upperRange'], message: 'must be above lowerRange' });
    const isTemperature = (temperatureUnits as readonly string[]).includes(t.unit);
    if (t.measures === 'temperature' && !isTemperature)
      ctx.addIssue({
        code: 'custom',
        path: ['unit'],
        message: `a temperature transmitter needs a temperature unit (${temperatureUnits.join(', ')})`,
      });
    const isSign = (directionUnits as readonly string[]).includes(t.unit);
    if (t.measures === 'flow-direction' && !isSign)
      ctx.addIssue({ code: 'custom', path: ['unit'], message: "a direction input needs the unit 'sign'" });
    if (t.measures !== 'temperature' && t.measures !== 'flow-direction' && (isTemperature || isSign))
      ctx.addIssue({
        code: 'custom',
        path: ['unit'],
        message: `a pressure transmitter needs a pressure unit (${pressureUnits.join(', ')})`,
      });
    if (t.measures !== 'differential-pressure' && t.stackRole !== 'single')
      ctx.addIssue({
        code: 'custom',
        path: ['stackRole'],
        message: 'only differential-pressure transmitters can be stacked',
      });
    // pressureReference means nothing for a differential pressure and is ignored there.
  });

export const deviceSchema = z.object({
  name: text(),
  siteId: recordId('site'),
});

export type SiteInput = z.infer<typeof siteSchema>;
export type MeterRunInput = z.infer<typeof meterRunSchema>;
export type TransmitterInput = z.infer<typeof transmitterSchema>;
export type ConfigVersionInput = z.infer<typeof configVersionSchema>;
