import { z } from 'zod';
import { isoInstant } from '../../http/params';
import { calibrationPointSchema, elementSpecSchema } from '../../../shared/schemas/flow-case';
import { DEFAULT_SUM_TOLERANCE } from './gas-composition';

const text = (max = 200) => z.string().trim().min(1, 'is required').max(max);
/** The certificate's number or reference; the file itself comes as the multipart field `certificate`. */
const certificate = z.string().trim().min(1).max(200).optional();
/** When the next calibration, analysis or inspection is due, a date in the site's zone. */
const nextDue = z.iso.date('must be a date YYYY-MM-DD').optional();
const reason = z.string().trim().min(1).max(1000).optional();

/** `POST /api/meter-runs/:id/element-calibrations`: a laboratory curve of C against Re_D (issue 11 §2). */
export const elementCalibrationBody = z
  .object({
    calibratedAt: isoInstant,
    /** When the curve takes effect (default: calibratedAt). */
    effectiveFrom: isoInstant.optional(),
    laboratory: text(),
    certificate,
    /** The certificate's expanded uncertainty of C (k = 2), percent. */
    uncertaintyPercent: z
      .number({ error: 'must be a number' })
      .refine((v) => Number.isFinite(v) && v > 0 && v <= 10, 'must be above 0 and at most 10 %'),
    points: z.array(calibrationPointSchema).min(1, 'needs at least one point').optional(),
    /** The same points as CSV text, header `reynoldsNumber,dischargeCoefficient`. */
    pointsCsv: z.string().max(200_000).optional(),
    /** Which flow direction the curve is for (issue 13 §11): 'reverse' goes into the reverse constants. */
    direction: z.enum(['forward', 'reverse'], { error: 'must be forward or reverse' }).default('forward'),
    nextDue,
    reason,
  })
  .strict()
  .superRefine((b, ctx) => {
    if ((b.points === undefined) === (b.pointsCsv === undefined))
      ctx.addIssue({ code: 'custom', path: ['points'], message: 'give the points either as points or as pointsCsv' });
  });
export type ElementCalibrationInput = z.infer<typeof elementCalibrationBody>;

/** `POST /api/meter-runs/:id/gas-analyses` (issue 11 §3). */
export const gasAnalysisBody = z
  .object({
    sampledAt: isoInstant,
    laboratory: text(),
    certificate,
    /** Mole fractions (sum 1) or mol % (sum 100) by component, in any spelling the fluids module accepts. */
    components: z.record(
      z.string().trim().min(1).max(60),
      z.number({ error: 'must be a number' }).refine((v) => Number.isFinite(v) && v >= 0, 'must be ≥ 0'),
      { error: (iss) => (iss.input === undefined ? 'is required' : 'must be an object of component: fraction') },
    ),
    /** How far the sum may be from 1 (as a fraction; ×100 for mol %). */
    sumTolerance: z
      .number({ error: 'must be a number' })
      .refine((v) => Number.isFinite(v) && v >= 0 && v <= 0.05, 'must be between 0 and 0.05')
      .default(DEFAULT_SUM_TOLERANCE),
    nextDue,
    reason,
  })
  .strict();
export type GasAnalysisInput = z.infer<typeof gasAnalysisBody>;

export const inspectionKinds = ['orifice-plate', 'cone', 'venturi', 'nozzle'] as const;
export type InspectionKind = (typeof inspectionKinds)[number];

const metres = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine((v) => Number.isFinite(v) && v > 0, `${what} must be > 0`);

/** `POST /api/meter-runs/:id/inspections` (issue 11 §3). */
export const inspectionBody = z
  .object({
    inspectedAt: isoInstant,
    kind: z.enum(inspectionKinds, { error: `must be one of ${inspectionKinds.join(', ')}` }),
    measured: z
      .object({
        boreDiameterM: metres('boreDiameterM').optional(),
        coneDiameterM: metres('coneDiameterM').optional(),
        edgeSharp: z.boolean().optional(),
        flatnessMm: z
          .number({ error: 'flatnessMm must be a number' })
          .refine((v) => Number.isFinite(v) && v >= 0, 'flatnessMm must be ≥ 0')
          .optional(),
      })
      .strict()
      .default({}),
    condition: text(1000),
    certificate,
    /** An element change found at inspection: the element now installed. */
    element: elementSpecSchema.optional(),
    nextDue,
    reason,
  })
  .strict();
export type InspectionInput = z.infer<typeof inspectionBody>;

/**
 * The multipart form field that carries each record as JSON text beside its `certificate` file
 * (see jsonFieldPayload).
 */
export const payloadFields = { calibration: 'calibration', analysis: 'analysis', inspection: 'inspection' } as const;
