/**
 * How an estimate was made, in words for the proposal form and the correction card: the server
 * names the method (`sales-minus-other-wells` for a well behind its sales meter, `previous-days`
 * otherwise) and keeps the members it used in the basis.
 */
import { z } from 'zod';

const salesBasis = z
  .object({
    salesMeter: z.object({ tag: z.string() }).loose(),
    otherWells: z.array(z.object({ tag: z.string() }).loose()),
    allowance: z.object({ percent: z.number().nullable(), dailyM3: z.number().nullable() }).loose(),
  })
  .loose();

/** @returns a sentence naming the method (and, for sales minus the other wells, the meter runs it used) */
export function estimateMethodText(method: string, basis: unknown): string {
  if (method === 'sales-minus-other-wells') {
    const parsed = salesBasis.safeParse(basis);
    if (!parsed.success) return 'From the sales meter minus the other wells over the same hours.';
    const { salesMeter, otherWells, allowance } = parsed.data;
    const others = otherWells.length ? otherWells.map((w) => w.tag).join(', ') : 'no other well';
    const allowed =
      allowance.percent !== null
        ? `, with the allowance of ${allowance.percent} % of the inlet`
        : allowance.dailyM3 !== null
          ? `, with the allowance of ${allowance.dailyM3} m³ a day`
          : '';
    return `From the sales meter ${salesMeter.tag} minus ${others} over the same hours${allowed}.`;
  }
  if (method === 'previous-days') return 'The mean of the same hours over the previous 7 days.';
  return `Method: ${method}.`;
}
