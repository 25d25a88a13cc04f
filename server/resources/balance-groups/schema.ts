import { z } from 'zod';
import { idField, isoInstantOrDate } from '../../http/params';

const percent = z.number({ error: 'must be a number' }).finite('must be a finite number');
const meterRunIds = z
  .array(idField('meter run'), { error: 'must be a list of meter run ids' })
  .min(1, 'must name at least one meter run')
  .max(100, 'must name at most 100 meter runs');

/**
 * `POST /api/balance-groups`: inlet and outlet meter runs of one site, an allowance for fuel and
 * losses (a percent of the inlet, or a fixed daily volume at base conditions: exactly one) and a
 * tolerance in percent of the inlet.
 */
export const createBalanceGroupBody = z
  .object({
    siteId: idField('site'),
    name: z.string({ error: 'is required' }).trim().min(1, 'is required').max(200, 'must be at most 200 characters'),
    inletMeterRunIds: meterRunIds,
    outletMeterRunIds: meterRunIds,
    allowancePercent: percent.min(0, 'must be 0 or more').max(50, 'must be at most 50').optional(),
    allowanceDailyM3: percent.min(0, 'must be 0 or more').optional(),
    tolerancePercent: percent.positive('must be above 0').max(100, 'must be at most 100'),
  })
  .strict()
  .superRefine((body, ctx) => {
    if ((body.allowancePercent === undefined) === (body.allowanceDailyM3 === undefined))
      ctx.addIssue({
        code: 'custom',
        path: ['allowancePercent'],
        message: 'give exactly one of allowancePercent and allowanceDailyM3',
      });
  });
export type CreateBalanceGroupInput = z.infer<typeof createBalanceGroupBody>;

/** `GET /api/balance-groups?siteId=` */
export const balanceGroupsQuery = z.object({ siteId: idField('site').optional() });

/** `GET /api/balance-groups/:id/balance?interval=day|month&from&to` (dates are the site's contract days). */
export const balanceQuery = z.object({
  interval: z.enum(['day', 'month'], { error: 'must be day or month' }).default('day'),
  from: isoInstantOrDate,
  to: isoInstantOrDate,
});

/** A balance reads daily or monthly totals; 400 days covers a year with its neighbouring months. */
export const BALANCE_MAX_DAYS = 400;

/** `GET /api/balance-groups/:id/allocation?month=YYYY-MM` */
export const allocationQuery = z.object({
  month: z.string({ error: 'must be a month YYYY-MM' }).regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'must be a month YYYY-MM'),
});
