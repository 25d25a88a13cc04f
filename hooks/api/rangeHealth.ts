/**
 * Range health of a meter run: GET /api/meter-runs/:id/range-health?from&to&uncertaintyLimitPercent.
 * Shares are fractions (0..1) of the period's flowing time, mass and volume at base conditions
 * in each band of the active DP span; uncertainties are expanded (k = 2), percent; quantities SI.
 * The band arithmetic is shared/range-health/band-shares.ts; the recommendation
 * shared/range-health/range-advice.ts.
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import type { DpBandName } from '@/shared/history/types';
import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

export const dpBandNames = ['0-10', '10-25', '25-50', '50-100', 'over'] as const satisfies readonly DpBandName[];

const bandSchema = z.object({
  band: z.enum(dpBandNames),
  fromPercent: z.number(),
  toPercent: z.number().nullable(),
  flowTimeS: z.number(),
  massKg: z.number(),
  standardVolumeM3: z.number(),
  flowTimeShare: z.number(),
  massShare: z.number(),
  standardVolumeShare: z.number(),
  uncertaintyPercent: z.number().nullable(),
  uncertaintyContributionPercent: z.number(),
});
export type BandShare = z.infer<typeof bandSchema>;

const summaryFields = {
  bands: z.array(bandSchema),
  flowTimeS: z.number(),
  massKg: z.number(),
  standardVolumeM3: z.number(),
  uncertaintyPercent: z.number().nullable(),
};

const transmitterHealthSchema = z.object({
  ...summaryFields,
  transmitterId: id,
  tag: z.string(),
  stackRole: z.enum(['single', 'low', 'high']),
  unit: z.string(),
  lowerRange: z.number(),
  upperRange: z.number(),
  accuracyPercentOfSpan: z.number(),
  /** Seconds this transmitter was the DP in use. */
  activeTimeS: z.number(),
  /** Its share of the meter run's flowing time and mass (0..1). */
  flowTimeShare: z.number(),
  massShare: z.number(),
});
export type TransmitterHealth = z.infer<typeof transmitterHealthSchema>;

const monthShareSchema = z.object({
  flowTimeShare: z.number(),
  massShare: z.number(),
  standardVolumeShare: z.number(),
});

const monthSchema = z.object({
  /** Contract month, "YYYY-MM". */
  month: z.string(),
  flowTimeS: z.number(),
  massKg: z.number(),
  standardVolumeM3: z.number(),
  uncertaintyPercent: z.number().nullable(),
  bands: z.partialRecord(z.enum(dpBandNames), monthShareSchema),
});
export type MonthHealth = z.infer<typeof monthSchema>;

export const recommendationKinds = [
  'none',
  're-range',
  'add-low-range-transmitter',
  'resize-low-range-transmitter',
  'change-element',
  'unavailable',
] as const;

const recommendationSchema = z.object({
  kind: z.union([z.enum(recommendationKinds), z.string()]),
  text: z.string(),
  numbers: z.record(z.string(), z.union([z.number(), z.string(), z.null()])),
  rangeCheck: z
    .looseObject({
      rangeCovered: z.boolean(),
      flows: z.array(
        z.looseObject({ label: z.string(), massFlowKgPerS: z.number(), differentialPressurePa: z.number() }),
      ),
      warnings: z.array(z.looseObject({ code: z.string(), message: z.string() })).catch([]),
    })
    .optional(),
});
export type RangeRecommendation = z.infer<typeof recommendationSchema>;

export const rangeHealthSchema = z.object({
  ...summaryFields,
  meterRunId: id,
  from: z.string(),
  to: z.string(),
  /** Hourly records in the period. */
  hours: z.number(),
  transmitters: z.array(transmitterHealthSchema),
  attribution: z.object({ method: z.string(), apportionedFlowTimeS: z.number() }),
  months: z.array(monthSchema),
  recommendation: recommendationSchema,
});
export type RangeHealth = z.infer<typeof rangeHealthSchema>;

export interface RangeHealthRequest {
  meterRunId: string;
  from: string;
  to: string;
  uncertaintyLimitPercent: number;
}

export const rangeHealthKeys = {
  all: ['range-health'] as const,
  report: (request: RangeHealthRequest) => [...rangeHealthKeys.all, request.meterRunId, request] as const,
};

/** @param request meter run, ISO period and uncertainty limit; waits while null */
export function useRangeHealth(request: RangeHealthRequest | null) {
  return useQuery({
    queryKey: request ? rangeHealthKeys.report(request) : [...rangeHealthKeys.all, 'none'],
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(request!.meterRunId)}/range-health`,
        query: { from: request!.from, to: request!.to, uncertaintyLimitPercent: request!.uncertaintyLimitPercent },
        schema: rangeHealthSchema,
        signal,
      }),
    enabled: request !== null,
    placeholderData: keepPreviousData,
  });
}
