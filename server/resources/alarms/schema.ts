import { z } from 'zod';
import { ALARM_CONDITIONS, ALARM_PRIORITIES, ALARM_STATES, type AlarmState } from '../../../shared/alarms/alarm-codes';
import { idField, isoInstant } from '../../http/params';

/** A state filter: a state code, or "open" for every state but normal. */
export type AlarmStateFilter = AlarmState | 'open';

const allowedStates: readonly string[] = [...ALARM_STATES, 'open'];
const isStateFilter = (code: string): code is AlarmStateFilter => allowedStates.includes(code);
const splitList = (s: string) =>
  s
    .split(',')
    .map((x) => x.trim())
    .filter(Boolean);
/** A comma-separated list of state codes. */
const stateList = z
  .string()
  .refine(
    (s) => splitList(s).length > 0 && splitList(s).every(isStateFilter),
    `must be one or more of ${ALARM_STATES.join(', ')} or open, comma-separated`,
  )
  .transform((s) => splitList(s).filter(isStateFilter));

/** `GET /api/alarms`: filters, newest first, at most `limit`; `include=events` adds each alarm's log. */
export const alarmListQuery = z.object({
  meterRunId: idField('meter run').optional(),
  siteId: idField('site').optional(),
  transmitterId: idField('transmitter').optional(),
  state: stateList.optional(),
  condition: z.enum(ALARM_CONDITIONS, { error: `must be one of ${ALARM_CONDITIONS.join(', ')}` }).optional(),
  priority: z.enum(ALARM_PRIORITIES, { error: `must be one of ${ALARM_PRIORITIES.join(', ')}` }).optional(),
  from: isoInstant.optional(),
  to: isoInstant.optional(),
  limit: z.coerce.number().int().min(1).max(2000).default(500),
  include: z.enum(['events'], { error: 'must be events' }).optional(),
});

/** `GET /api/alarms/counts`: for the whole system, a site or a meter run. */
export const countsQuery = z.object({
  siteId: idField('site').optional(),
  meterRunId: idField('meter run').optional(),
});

/** ISA-18.2: shelving is time-limited; a day at most here. */
export const MAX_SHELVE_MINUTES = 1440;
export const shelveBody = z
  .object({
    minutes: z
      .number({ error: 'must be a number of minutes' })
      .int('must be a whole number of minutes')
      .min(1, 'must be at least 1')
      .max(MAX_SHELVE_MINUTES, `must be at most ${MAX_SHELVE_MINUTES} (a day)`),
    reason: z
      .string({ error: 'is required: say why the alarm is shelved' })
      .trim()
      .min(1, 'is required: say why the alarm is shelved')
      .max(500),
  })
  .strict();

export const acknowledgeBody = z.object({ comment: z.string().trim().max(500).optional() }).strict();
export const reasonBody = z
  .object({ reason: z.string({ error: 'is required' }).trim().min(1, 'is required').max(500) })
  .strict();
export const optionalReasonBody = z.object({ reason: z.string().trim().max(500).optional() }).strict();
