import { badRequest, notFound } from '../../errors';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { limitsResolver, type StoredLimits } from '../../alarms/limits-store';
import {
  ALARM_CONDITIONS,
  DP_ONLY_CONDITIONS,
  TRANSMITTER_CONDITIONS,
  type AlarmCondition,
} from '../../../shared/alarms/alarm-codes';
import {
  ALARM_LIMIT_FIELDS,
  AlarmLimitError,
  DEFAULT_ALARM_LIMITS,
  checkAlarmLimits,
  effectiveAlarmLimits,
  type AlarmLimitField,
  type AlarmLimits,
} from '../../../shared/alarms/alarm-limits';
import type { AlarmLimitsRepository, LimitsMeterRun } from './repository';
import type { AlarmLimitsInput } from './schema';

/** Conditions that this server evaluates: all of them, now that reconciliation and balances are judged. */
const EVALUATED: AlarmCondition[] = [...ALARM_CONDITIONS];

/** Called after a change, with the meter run whose limits changed. */
type Changed = ((meterRunId: string) => void) | undefined;

/**
 * The limits of a meter run: the defaults and fields of each evaluated condition, what is
 * stored, and the limits in force at every alarm point with where they come from.
 * @throws not found when there is no such meter run
 */
export async function alarmLimitsOf(repository: AlarmLimitsRepository, meterRunId: string) {
  const run = await repository.meterRun(meterRunId);
  if (!run) throw notFound('Meter run');
  return describe(meterRunId, run, await repository.storedLimits(meterRunId));
}

export type AlarmLimitsView = Awaited<ReturnType<typeof alarmLimitsOf>>;

function describe(meterRunId: string, run: LimitsMeterRun, stored: StoredLimits[]) {
  const resolve = limitsResolver(stored);
  const isStored = (condition: AlarmCondition, transmitterId: string | null) =>
    stored.some((s) => s.condition === condition && s.transmitterId === transmitterId);
  const effective = EVALUATED.flatMap((condition) => {
    const points = TRANSMITTER_CONDITIONS.includes(condition)
      ? run.transmitters.filter(
          (t) => !DP_ONLY_CONDITIONS.includes(condition) || t.measures === 'differential-pressure',
        )
      : [null];
    return points.map((t) => {
      const transmitterId = t?.id ?? null;
      // The nearest level with a stored setting: the transmitter's, the meter run's, else the default.
      const source =
        t && isStored(condition, t.id) ? 'transmitter' : isStored(condition, null) ? 'meter-run' : 'default';
      return {
        condition,
        transmitterId,
        transmitterTag: t?.tag ?? null,
        source,
        limits: resolve(condition, transmitterId),
      };
    });
  });
  return {
    meterRunId,
    defaults: Object.fromEntries(EVALUATED.map((c) => [c, DEFAULT_ALARM_LIMITS[c]])),
    fields: Object.fromEntries(EVALUATED.map((c) => [c, ALARM_LIMIT_FIELDS[c]])),
    stored,
    effective,
  };
}

/**
 * Stores the settings of one condition at a meter run or one of its transmitters. Only fields
 * given change; a field given as null goes back to the level above. The merged limits are
 * checked before anything is stored, and the change is audited.
 * @returns the setting's id, whether it is new, and the meter run's limits after the change
 * @throws 400 naming the field for an unknown meter run, a transmitter not on it, a condition
 *   not set per transmitter, a field the condition does not take, or limits that make no sense
 */
export async function setAlarmLimits(
  repository: AlarmLimitsRepository,
  input: AlarmLimitsInput,
  actor: SignedInUser,
  changed?: Changed,
) {
  const { meterRunId, transmitterId = null, condition, ...fields } = input;
  const run = await repository.meterRun(meterRunId);
  if (!run) throw badRequest(`meterRunId: no meter run ${meterRunId}`, 'meterRunId', 'invalid_field');
  if (transmitterId !== null) checkTransmitter(run, transmitterId, condition);
  for (const key of Object.keys(fields)) {
    if (!takes(condition, key))
      throw badRequest(
        `${key}: does not apply to ${condition} (it takes ${ALARM_LIMIT_FIELDS[condition].join(', ')})`,
        key,
        'invalid_field',
      );
  }
  const stored = await repository.storedLimits(meterRunId);
  const existing = stored.find((s) => s.condition === condition && s.transmitterId === transmitterId);
  const settings = overlay(condition, existing?.settings ?? {}, fields);
  const runLevel =
    transmitterId === null
      ? settings
      : stored.find((s) => s.condition === condition && s.transmitterId === null)?.settings;
  checkMerged(condition, runLevel, transmitterId === null ? undefined : settings);

  const id = await repository.save({ meterRunId, transmitterId, condition, settings }, actor.id);
  await recordAuditEvent({
    actor,
    action: 'alarm-limits.update',
    entityType: 'meter-run',
    entityId: meterRunId,
    before: existing ?? null,
    after: { transmitterId, condition, settings },
  });
  changed?.(meterRunId);
  return { id, created: !existing, limits: await alarmLimitsOf(repository, meterRunId) };
}

/** Deletes one stored setting (its point goes back to the level above) and audits it. @throws not found */
export async function deleteAlarmLimit(
  repository: AlarmLimitsRepository,
  id: string,
  actor: SignedInUser,
  changed?: Changed,
) {
  const deleted = await repository.delete(id);
  if (!deleted) throw notFound('Alarm limit');
  await recordAuditEvent({
    actor,
    action: 'alarm-limits.delete',
    entityType: 'meter-run',
    entityId: deleted.meterRunId,
    // The audit log has always kept a deleted setting with its column names; keep old and new entries alike.
    before: {
      meter_run_id: deleted.meterRunId,
      transmitter_id: deleted.transmitterId,
      condition: deleted.condition,
      settings: deleted.settings,
    },
    after: null,
  });
  changed?.(deleted.meterRunId);
}

function checkTransmitter(run: LimitsMeterRun, transmitterId: string, condition: AlarmCondition) {
  const refuse = (message: string) => badRequest(`transmitterId: ${message}`, 'transmitterId', 'invalid_field');
  const t = run.transmitters.find((x) => x.id === transmitterId);
  if (!t) throw refuse(`transmitter ${transmitterId} is not on meter run ${run.tag}`);
  if (!TRANSMITTER_CONDITIONS.includes(condition))
    throw refuse(`${condition} is set for the whole meter run, not per transmitter`);
  if (DP_ONLY_CONDITIONS.includes(condition) && t.measures !== 'differential-pressure')
    throw refuse(`${condition} applies to DP transmitters only (${t.tag} measures ${t.measures})`);
}

/** Whether the condition takes this limit field. */
const takes = (condition: AlarmCondition, key: string): key is AlarmLimitField =>
  ALARM_LIMIT_FIELDS[condition].some((f) => f === key);

type LimitFields = { [K in AlarmLimitField]?: AlarmLimits[K] | null };

/** The stored settings with the given fields laid over: a value replaces, null removes, absent keeps. */
function overlay(condition: AlarmCondition, settings: Partial<AlarmLimits>, fields: LimitFields) {
  const next: Partial<AlarmLimits> = { ...settings };
  const put = <K extends AlarmLimitField>(key: K) => {
    const value = fields[key];
    if (value === null) delete next[key];
    else if (value !== undefined) next[key] = value;
  };
  for (const key of Object.keys(fields)) if (takes(condition, key)) put(key);
  return next;
}

/** Checks the limits the point would have in force; a fault is a 400 naming its field. */
function checkMerged(
  condition: AlarmCondition,
  meterRunSettings: Partial<AlarmLimits> | undefined,
  transmitterSettings: Partial<AlarmLimits> | undefined,
) {
  try {
    checkAlarmLimits(condition, effectiveAlarmLimits(condition, meterRunSettings, transmitterSettings));
  } catch (err) {
    if (err instanceof AlarmLimitError)
      throw badRequest(
        `${err.field}: ${err.message.replace(/^checkAlarmLimits: \S+ /, '')}`,
        err.field,
        'invalid_field',
      );
    throw err;
  }
}
