/** A site's monthly alarm performance against the ISA-18.2 benchmarks: GET /api/alarm-performance. */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);
const point = {
  meterRunId: id.nullable(),
  meterRunTag: z.string().nullable(),
  transmitterId: id.nullable(),
  transmitterTag: z.string().nullable(),
  condition: z.string().nullable(),
};

export const alarmPerformanceSchema = z.object({
  siteId: id,
  month: z.string(),
  timeZone: z.string(),
  from: z.string(),
  to: z.string(),
  operatorPositions: z.number(),
  periods: z.number(),
  annunciations: z.number(),
  averagePer10MinPerOperator: z.number(),
  peakPer10MinPerOperator: z.number(),
  floodPeriods: z.number(),
  floodPercentOfTime: z.number(),
  chattering: z.array(z.object({ ...point, raises: z.number(), mostInOneMinute: z.number() })),
  stale: z.array(
    z.object({
      ...point,
      alarmId: id,
      raisedAt: z.string(),
      clearedAt: z.string().nullable(),
      activeHours: z.number(),
    }),
  ),
  topTen: z.array(z.object({ ...point, raises: z.number(), sharePercent: z.number() })),
  topTenSharePercent: z.number(),
  benchmarks: z.object({
    source: z.string(),
    averagePer10MinVeryLikelyAcceptable: z.number(),
    averagePer10MinMaximumManageable: z.number(),
    floodPercentOfTimeAtMost: z.number(),
    chatteringAlarms: z.number(),
    staleAlarms: z.number(),
  }),
});
export type AlarmPerformance = z.infer<typeof alarmPerformanceSchema>;

/** @param month YYYY-MM; asks only with a site and a well-formed month */
export function useAlarmPerformance(siteId: string | undefined, month: string) {
  return useQuery({
    queryKey: ['alarm-performance', siteId, month],
    queryFn: ({ signal }) =>
      apiRequest({ path: '/alarm-performance', query: { siteId, month }, schema: alarmPerformanceSchema, signal }),
    enabled: Boolean(siteId) && /^\d{4}-(0[1-9]|1[0-2])$/.test(month),
  });
}
