/**
 * Downsampled trends of a meter run: GET /api/meter-runs/:id/trend. Each transmitter's
 * readings come as min / max / mean per time bucket (computed in the database), in the
 * transmitter's own unit; flow comes per hour from the hourly records.
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { transmitterMeasures, transmitterUnits } from '@/shared/schemas/setup';
import { apiRequest } from './client';

const trendPointSchema = z.object({
  time: z.string(),
  min: z.number(),
  max: z.number(),
  mean: z.number(),
  count: z.number(),
});

export const trendSeriesSchema = z.object({
  transmitterId: z.union([z.string(), z.number()]).transform(String),
  tag: z.string(),
  measures: z.enum(transmitterMeasures),
  unit: z.enum(transmitterUnits),
  stackRole: z.enum(['single', 'low', 'high']),
  lowerRange: z.number(),
  upperRange: z.number(),
  points: z.array(trendPointSchema),
});
export type TrendSeries = z.infer<typeof trendSeriesSchema>;

export const trendSchema = z.object({
  from: z.string(),
  to: z.string(),
  buckets: z.number(),
  series: z.array(trendSeriesSchema),
  flow: z.array(
    z.object({
      time: z.string(),
      massFlowKgPerS: z.number(),
      standardVolumeFlowM3PerS: z.number(),
      coverage: z.number(),
      /** The hour still in progress: its rate is over the seconds elapsed so far. */
      partial: z.boolean().optional(),
    }),
  ),
});
export type Trend = z.infer<typeof trendSchema>;

/** Buckets per window: a few per pixel of a wide chart is all a screen can show. */
export const defaultTrendBuckets = 600;

export const trendKeys = {
  all: ['trends'] as const,
  window: (meterRunId: string, from: string, to: string, buckets: number) =>
    [...trendKeys.all, meterRunId, { from, to, buckets }] as const,
};

/**
 * @param meterRunId the meter run
 * @param from ISO start of the window
 * @param to ISO end of the window
 * @param buckets time slices in the window (10–5000)
 */
export function useTrend(meterRunId: string, from: string, to: string, buckets: number = defaultTrendBuckets) {
  return useQuery({
    queryKey: trendKeys.window(meterRunId, from, to, buckets),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/trend`,
        query: { from, to, buckets },
        schema: trendSchema,
        signal,
      }),
    placeholderData: keepPreviousData,
  });
}
