/**
 * Alarm limits of a meter run and its transmitters: GET /api/alarm-limits?meterRunId= (every
 * role reads), POST /api/alarm-limits (engineers and admins; a 400 names the field at fault),
 * DELETE /api/alarm-limits/:id. Shares are fractions of span (0.1 = 10 %), times in seconds.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { ALARM_PRIORITIES, type AlarmCondition, type AlarmPriority } from '@/shared/alarms/alarm-codes';
import type { AlarmLimits } from '@/shared/alarms/alarm-limits';
import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

const limitsSchema = z.looseObject({
  enabled: z.boolean(),
  priority: z.enum(ALARM_PRIORITIES),
  onDelayS: z.number(),
  offDelayS: z.number(),
  thresholdShareOfSpan: z.number().optional(),
  deadbandShareOfSpan: z.number().optional(),
  toleranceShareOfSpan: z.number().optional(),
  windowS: z.number().optional(),
  minSamples: z.number().optional(),
  maxStdDevShareOfSpan: z.number().optional(),
  maxAgeS: z.number().optional(),
  dueSoonDays: z.number().optional(),
});

const alarmLimitsSchema = z.object({
  meterRunId: id,
  effective: z.array(
    z.object({
      condition: z.string(),
      transmitterId: id.nullable(),
      transmitterTag: z.string().nullable(),
      source: z.enum(['default', 'meter-run', 'transmitter']).catch('default'),
      limits: limitsSchema,
    }),
  ),
  stored: z
    .array(z.looseObject({ id: id.optional(), condition: z.string(), transmitterId: id.nullable().optional() }))
    .catch([]),
});
export type MeterRunAlarmLimits = z.infer<typeof alarmLimitsSchema>;
export type EffectiveAlarmLimit = MeterRunAlarmLimits['effective'][number];

export const alarmLimitKeys = {
  all: ['alarm-limits'] as const,
  meterRun: (meterRunId: string) => [...alarmLimitKeys.all, meterRunId] as const,
};

/** @param meterRunId the meter run; the query waits while it is undefined */
export function useAlarmLimits(meterRunId: string | undefined) {
  return useQuery({
    queryKey: alarmLimitKeys.meterRun(meterRunId ?? ''),
    queryFn: ({ signal }) =>
      apiRequest({ path: '/alarm-limits', query: { meterRunId }, schema: alarmLimitsSchema, signal }),
    enabled: meterRunId !== undefined,
  });
}

/** A change of one condition's limits; a field set to null goes back to the level above. */
export type AlarmLimitChange = {
  meterRunId: string;
  transmitterId?: string | null;
  condition: AlarmCondition;
  priority?: AlarmPriority | null;
} & { [K in Exclude<keyof AlarmLimits, 'priority'>]?: AlarmLimits[K] | null };

/** @returns a mutation that stores one condition's limits and refreshes the meter run's limits */
export function useSaveAlarmLimits() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: AlarmLimitChange) =>
      apiRequest({ method: 'POST', path: '/alarm-limits', body: change, schema: alarmLimitsSchema }),
    onSuccess: (limits) => queryClient.setQueryData(alarmLimitKeys.meterRun(limits.meterRunId), limits),
    onSettled: () => queryClient.invalidateQueries({ queryKey: alarmLimitKeys.all }),
  });
}

/** @returns a mutation that removes one stored setting (back to the level above) */
export function useDeleteAlarmLimit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (limitId: string) =>
      apiRequest({ method: 'DELETE', path: `/alarm-limits/${encodeURIComponent(limitId)}`, schema: z.null() }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: alarmLimitKeys.all }),
  });
}
