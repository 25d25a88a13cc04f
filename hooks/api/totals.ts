/**
 * Totals and hourly records of a meter run: GET /api/meter-runs/:id/totals and
 * /api/meter-runs/:id/hourly-records. Quantities are SI (kg, m³, J, Pa, K); the screens
 * convert them for display (constants/units-display.ts).
 */
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

export const totalIntervals = ['hour', 'day', 'month'] as const;
export type TotalInterval = (typeof totalIntervals)[number];

const totalFields = {
  start: z.string(),
  end: z.string(),
  hours: z.number(),
  flowTimeS: z.number(),
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
  /** Share of the period with valid inputs, 0..1. */
  coverage: z.number(),
  flags: z.array(z.string()),
  /** Expanded (k = 2) uncertainty of the period's quantity, percent. */
  uncertaintyPercent: z.number().nullable(),
  status: z.string(),
  /** The record's version (issue 9): above 1 once it was recomputed; null for a period with no record. */
  version: z.number().nullable().optional(),
};

/** Net flow, forward − reverse, as its own figure (never in place of forward); energy null when either is. */
const netSchema = z.object({
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
});
export type NetFlow = z.infer<typeof netSchema>;

/** A period's reverse flow on a bi-directional meter run; the period's own figures are forward. */
const reverseTotalSchema = z.object({
  flowTimeS: z.number(),
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
});
export type ReverseTotal = z.infer<typeof reverseTotalSchema>;

export const totalSchema = z.object({
  ...totalFields,
  /** Only for a period with reverse flow (a bi-directional meter run). */
  reverse: reverseTotalSchema.optional(),
  net: netSchema.optional(),
});
export type Total = z.infer<typeof totalSchema>;

export const hourlyRecordSchema = z.object({
  ...totalFields,
  averageDpPa: z.number().nullable(),
  averagePressurePa: z.number().nullable(),
  averageTemperatureK: z.number().nullable(),
  integralValue: z.number().nullable(),
  /** Integral multiplier value (API MPMS 21.1): mass = IMV × IV × flow time; absent from records made before issue 9. */
  integralMultiplierValue: z.number().nullable().optional(),
  configVersionId: z.string().nullable(),
  dpBands: z
    .record(z.string(), z.object({ timeS: z.number(), massKg: z.number() }))
    .nullable()
    .catch(null),
  activeTransmitterTimeS: z.record(z.string(), z.number()).nullable().catch(null),
  computedAt: z.string(),
  /**
   * Each term of the hour's U(qm)/qm (k = 2, percent) with where its input comes from (issue 13);
   * null for a record stored before budgets were kept.
   */
  uncertaintyBudget: z
    .array(z.object({ term: z.string(), percent: z.number(), source: z.string() }))
    .nullable()
    .optional(),
  /** The hour's reverse flow on a bi-directional meter run; null on a one-way run (absent from older servers). */
  reverse: reverseTotalSchema
    .extend({
      averageDpPa: z.number().nullable(),
      averagePressurePa: z.number().nullable(),
      averageTemperatureK: z.number().nullable(),
      integralValue: z.number().nullable(),
      integralMultiplierValue: z.number().nullable(),
      uncertaintyPercent: z.number().nullable(),
      uncertaintyBudget: z.array(z.object({ term: z.string(), percent: z.number(), source: z.string() })),
    })
    .nullable()
    .optional(),
  net: netSchema.nullable().optional(),
});
export type HourlyRecord = z.infer<typeof hourlyRecordSchema>;

export const totalKeys = {
  all: ['totals'] as const,
  totals: (meterRunId: string, interval: TotalInterval, from: string, to: string) =>
    [...totalKeys.all, meterRunId, interval, { from, to }] as const,
  hourlyRecords: (meterRunId: string, from: string, to: string) =>
    [...totalKeys.all, meterRunId, 'hourly-records', { from, to }] as const,
};

/**
 * @param meterRunId the meter run
 * @param interval hour, day (contract days) or month (contract months)
 * @param from ISO start of the window
 * @param to ISO end of the window
 */
export function useTotals(meterRunId: string, interval: TotalInterval, from: string, to: string) {
  return useQuery({
    queryKey: totalKeys.totals(meterRunId, interval, from, to),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/totals`,
        query: { interval, from, to },
        schema: z.array(totalSchema),
        signal,
      }),
    placeholderData: keepPreviousData,
  });
}

/**
 * The hourly records query, for useQuery and for fetching outside a component's render (the
 * range check reads a meter run's recent operating point when one is picked).
 * @param meterRunId the meter run
 * @param from ISO start (hours starting at or after it)
 * @param to ISO end (hours starting before it)
 */
export function hourlyRecordsQuery(meterRunId: string, from: string, to: string) {
  return queryOptions({
    queryKey: totalKeys.hourlyRecords(meterRunId, from, to),
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/meter-runs/${encodeURIComponent(meterRunId)}/hourly-records`,
        query: { from, to },
        schema: z.array(hourlyRecordSchema),
        signal,
      }),
  });
}

/**
 * @param meterRunId the meter run
 * @param from ISO start (hours starting at or after it)
 * @param to ISO end (hours starting before it)
 */
export function useHourlyRecords(meterRunId: string, from: string, to: string) {
  return useQuery({ ...hourlyRecordsQuery(meterRunId, from, to), placeholderData: keepPreviousData });
}
