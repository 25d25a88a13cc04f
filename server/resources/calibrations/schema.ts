import { z } from 'zod';
import { jsonFieldPayload } from '../../certificates/multipart';
import { idField } from '../../http/params';

const text = (max: number) =>
  z.string().trim().min(1, 'must not be empty').max(max, `must be at most ${max} characters`);
const date = z.iso.date('must be a date YYYY-MM-DD');
const tolerance = z.number().positive('must be above 0').max(10, 'must be at most 10');

/** One point of a calibration as the form gives it, in the transmitter's unit. */
const calibrationPoint = z
  .object({
    appliedValue: z.number({ error: 'must be a number' }),
    indicatedValue: z.number({ error: 'must be a number' }),
    /** This point's tolerance in % of span; the calibration's own when left out. */
    tolerancePercentOfSpan: tolerance.optional(),
  })
  .strict();
export type CalibrationPointInput = z.infer<typeof calibrationPoint>;

/**
 * `POST /api/transmitters/:id/calibrations`: as JSON, or as a multipart form with this object as
 * JSON text in the field `calibration` and the certificate file in the field `certificate`.
 * The errors per point are not given: the server computes them from the range.
 */
export const calibrationBody = z
  .object({
    calibratedOn: date,
    laboratory: text(200),
    /** The laboratory's accreditation, e.g. ISO/IEC 17025 and its accreditation number. */
    accreditation: z
      .object({ standard: text(100).optional(), number: text(100).optional() })
      .strict()
      .optional(),
    /** The tolerance in % of span of every point that gives none; the transmitter's accuracy when left out. */
    tolerancePercentOfSpan: tolerance.optional(),
    asFound: z.array(calibrationPoint).min(1, 'must have at least one point').max(50, 'must have at most 50 points'),
    asLeft: z.array(calibrationPoint).max(50, 'must have at most 50 points').default([]),
    performedBy: text(200),
    nextDue: date,
    notes: text(2000).optional(),
    /** The calibration this record corrects (a calibration is never changed; a correction is a new record). */
    correctsId: idField('calibration').optional(),
  })
  .strict();
export type CalibrationInput = z.infer<typeof calibrationBody>;

/**
 * The calibration of a request: a JSON body as it is, or the JSON text of the multipart field
 * `calibration` (a form cannot carry nested points otherwise).
 */
export function calibrationPayload(body: unknown, multipart: boolean): unknown {
  return jsonFieldPayload(body, multipart, 'calibration');
}
