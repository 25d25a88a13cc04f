/**
 * What is due in the care of a site's meters: GET /api/sites/:id/care-due?sort=due|-due.
 * Dates are calendar dates (YYYY-MM-DD) in the site's zone; `today` is the site's date.
 */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { apiRequest } from './client';

const id = z.union([z.string(), z.number()]).transform(String);

export const careDueKinds = [
  'transmitter-calibration',
  'element-calibration',
  'gas-analysis',
  'element-inspection',
] as const;
export const careDueStates = ['overdue', 'due-soon', 'ok', 'not-recorded'] as const;
export type CareDueState = (typeof careDueStates)[number];
export type CareDueSort = 'due' | '-due';

const itemSchema = z.object({
  kind: z.enum(careDueKinds),
  meterRunId: id,
  meterRunName: z.string(),
  transmitterId: id.nullable(),
  subject: z.string(),
  lastDoneOn: z.string().nullable(),
  dueOn: z.string().nullable(),
  state: z.enum(careDueStates),
  daysLeft: z.number().nullable(),
  recordUrl: z.string(),
  alarmId: id.nullable(),
});
export type CareDueItem = z.infer<typeof itemSchema>;

const listSchema = z.object({
  site: z.object({ id, name: z.string(), timeZone: z.string() }),
  today: z.string(),
  items: z.array(itemSchema),
});
export type CareDueList = z.infer<typeof listSchema>;

/** @param siteId the site; the query waits while it is null */
export function useCareDue(siteId: string | null, sort: CareDueSort) {
  return useQuery({
    queryKey: ['care-due', siteId ?? '', sort],
    queryFn: ({ signal }) =>
      apiRequest({
        path: `/sites/${encodeURIComponent(siteId ?? '')}/care-due`,
        query: { sort },
        schema: listSchema,
        signal,
      }),
    enabled: siteId !== null,
    placeholderData: keepPreviousData,
  });
}
