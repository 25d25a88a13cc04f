import { Router } from 'express';
import type { Pool } from 'pg';
import { requireCapability } from '../../auth/passport';
import { badRequest, notFound } from '../../errors';
import { recordAuditEvent } from '../../audit';
import { validate } from '../../http/validate';
import { loadStoredLimits, limitsResolver } from '../../alarms/limits-store';
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
  type AlarmLimits,
} from '../../../shared/alarms/alarm-limits';
import { alarmLimitsBody, alarmLimitsQuery } from './schema';

/** Conditions that this server evaluates (the reconciliation and balance ones come with their issue). */
const EVALUATED: AlarmCondition[] = ALARM_CONDITIONS.filter(
  (c) => c !== 'reconciliation-out-of-tolerance' && c !== 'balance-out-of-tolerance',
);

/**
 * Alarm limits of a meter run and its transmitters (`/api/alarm-limits`): every role reads them;
 * engineers and admins change them (they are part of a meter run's configuration). Settings are
 * stored only where they differ from the level above; a field set to null goes back to it.
 */
export function alarmLimitsRouter(pool: Pool, hooks: { changed?(meterRunId: string): void } = {}) {
  const router = Router();

  async function meterRun(id: string) {
    const run = (await pool.query('SELECT id::text, tag FROM meter_runs WHERE id = $1', [id])).rows[0];
    if (!run) throw notFound('Meter run');
    const transmitters = (
      await pool.query('SELECT id::text, tag, measures FROM transmitters WHERE meter_run_id = $1 ORDER BY id', [id])
    ).rows as { id: string; tag: string; measures: string }[];
    return { ...run, transmitters } as { id: string; tag: string; transmitters: typeof transmitters };
  }

  async function describe(meterRunId: string) {
    const run = await meterRun(meterRunId);
    const stored = await loadStoredLimits(pool, meterRunId);
    const resolve = limitsResolver(stored);
    const effective: {
      condition: AlarmCondition;
      transmitterId: string | null;
      transmitterTag: string | null;
      source: string;
      limits: AlarmLimits;
    }[] = [];
    for (const condition of EVALUATED) {
      const points = TRANSMITTER_CONDITIONS.includes(condition)
        ? run.transmitters.filter(
            (t) => !DP_ONLY_CONDITIONS.includes(condition) || t.measures === 'differential-pressure',
          )
        : [null];
      for (const t of points) {
        const source = stored.some((s) => s.condition === condition && s.transmitterId === (t?.id ?? null))
          ? t
            ? 'transmitter'
            : 'meter-run'
          : stored.some((s) => s.condition === condition && s.transmitterId === null)
            ? 'meter-run'
            : 'default';
        effective.push({
          condition,
          transmitterId: t?.id ?? null,
          transmitterTag: t?.tag ?? null,
          source,
          limits: resolve(condition, t?.id ?? null),
        });
      }
    }
    return {
      meterRunId,
      defaults: Object.fromEntries(EVALUATED.map((c) => [c, DEFAULT_ALARM_LIMITS[c]])),
      fields: Object.fromEntries(EVALUATED.map((c) => [c, ALARM_LIMIT_FIELDS[c]])),
      stored,
      effective,
    };
  }

  router.get('/', requireCapability('view'), async (req, res) => {
    const q = validate(alarmLimitsQuery, req.query, 'query');
    res.json(await describe(q.meterRunId));
  });

  router.post('/', requireCapability('configure'), async (req, res) => {
    const { meterRunId, transmitterId = null, condition, ...fields } = validate(alarmLimitsBody, req.body);
    const run = await meterRun(meterRunId).catch(() => {
      throw badRequest(`meterRunId: no meter run ${meterRunId}`, 'meterRunId', 'invalid_field');
    });
    if (transmitterId !== null) {
      const t = run.transmitters.find((x) => x.id === transmitterId);
      if (!t)
        throw badRequest(
          `transmitterId: transmitter ${transmitterId} is not on meter run ${run.tag}`,
          'transmitterId',
          'invalid_field',
        );
      if (!TRANSMITTER_CONDITIONS.includes(condition))
        throw badRequest(
          `transmitterId: ${condition} is set for the whole meter run, not per transmitter`,
          'transmitterId',
          'invalid_field',
        );
      if (DP_ONLY_CONDITIONS.includes(condition) && t.measures !== 'differential-pressure')
        throw badRequest(
          `transmitterId: ${condition} applies to DP transmitters only (${t.tag} measures ${t.measures})`,
          'transmitterId',
          'invalid_field',
        );
    }
    for (const key of Object.keys(fields)) {
      if (!ALARM_LIMIT_FIELDS[condition].includes(key as keyof AlarmLimits)) {
        throw badRequest(
          `${key}: does not apply to ${condition} (it takes ${ALARM_LIMIT_FIELDS[condition].join(', ')})`,
          key,
          'invalid_field',
        );
      }
    }
    const stored = await loadStoredLimits(pool, meterRunId);
    const existing = stored.find((s) => s.condition === condition && s.transmitterId === transmitterId);
    const settings: Record<string, unknown> = { ...(existing?.settings ?? {}) };
    for (const [k, v] of Object.entries(fields)) {
      if (v === null) delete settings[k];
      else if (v !== undefined) settings[k] = v;
    }
    const runLevel =
      transmitterId === null
        ? settings
        : stored.find((s) => s.condition === condition && s.transmitterId === null)?.settings;
    try {
      checkAlarmLimits(
        condition,
        effectiveAlarmLimits(
          condition,
          runLevel as Partial<AlarmLimits>,
          transmitterId === null ? undefined : (settings as Partial<AlarmLimits>),
        ),
      );
    } catch (err) {
      if (err instanceof AlarmLimitError)
        throw badRequest(
          `${err.field}: ${err.message.replace(/^checkAlarmLimits: \S+ /, '')}`,
          err.field,
          'invalid_field',
        );
      throw err;
    }
    const { rows } = await pool.query(
      `INSERT INTO alarm_limits (meter_run_id, transmitter_id, condition, settings, updated_by) VALUES ($1, $2, $3, $4, $5)
       ON CONFLICT (meter_run_id, coalesce(transmitter_id, 0), condition) DO UPDATE SET settings = EXCLUDED.settings, updated_by = EXCLUDED.updated_by, updated_at = now()
       RETURNING id::text`,
      [meterRunId, transmitterId, condition, JSON.stringify(settings), req.user!.id],
    );
    await recordAuditEvent({
      actor: req.user!,
      action: 'alarm-limits.update',
      entityType: 'meter-run',
      entityId: meterRunId,
      before: existing ?? null,
      after: { transmitterId, condition, settings },
    });
    hooks.changed?.(meterRunId);
    res.status(existing ? 200 : 201).json({ id: rows[0].id, ...(await describe(meterRunId)) });
  });

  router.delete('/:id', requireCapability('configure'), async (req, res) => {
    if (!/^\d+$/.test(String(req.params.id))) throw notFound('Alarm limit');
    const { rows } = await pool.query(
      'DELETE FROM alarm_limits WHERE id = $1 RETURNING meter_run_id::text, transmitter_id::text, condition, settings',
      [String(req.params.id)],
    );
    if (!rows[0]) throw notFound('Alarm limit');
    await recordAuditEvent({
      actor: req.user!,
      action: 'alarm-limits.delete',
      entityType: 'meter-run',
      entityId: rows[0].meter_run_id,
      before: rows[0],
      after: null,
    });
    hooks.changed?.(rows[0].meter_run_id);
    res.status(204).end();
  });

  return router;
}
