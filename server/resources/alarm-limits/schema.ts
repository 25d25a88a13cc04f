import { z } from 'zod';
import { ALARM_CONDITIONS, ALARM_PRIORITIES } from '../../../shared/alarms/alarm-codes';
import { idField } from '../../http/params';

const num = z.number({ error: 'must be a number' }).finite('must be a finite number');
/** A field set to null goes back to the level above (meter run, then the default). */
const opt = <T extends z.ZodType>(s: T) => s.nullable().optional();

/** POST /api/alarm-limits: the settings of one condition for a meter run or one of its transmitters. */
export const alarmLimitsBody = z
  .object({
    meterRunId: idField('meter run'),
    transmitterId: idField('transmitter').nullable().optional(),
    condition: z.enum(ALARM_CONDITIONS, { error: `must be one of ${ALARM_CONDITIONS.join(', ')}` }),
    enabled: opt(z.boolean({ error: 'must be true or false' })),
    priority: opt(z.enum(ALARM_PRIORITIES, { error: `must be one of ${ALARM_PRIORITIES.join(', ')}` })),
    onDelayS: opt(num),
    offDelayS: opt(num),
    thresholdShareOfSpan: opt(num),
    deadbandShareOfSpan: opt(num),
    toleranceShareOfSpan: opt(num),
    windowS: opt(num),
    minSamples: opt(num),
    maxStdDevShareOfSpan: opt(num),
    maxAgeS: opt(num),
    dueSoonDays: opt(num),
  })
  .strict();

export type AlarmLimitsInput = z.infer<typeof alarmLimitsBody>;

/** GET /api/alarm-limits?meterRunId */
export const alarmLimitsQuery = z.object({
  // Absent, the first issue is "is required" (as this query has always answered); otherwise idField's.
  meterRunId: z.string({ error: 'is required' }).and(idField('meter run')),
});
