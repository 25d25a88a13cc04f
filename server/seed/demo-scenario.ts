/**
 * The demo scenario's set-up (SCENARIO.md): the two sites, seven meter runs with their
 * configuration versions (KFG-101's element change on day 20 of the demo month included), their
 * transmitters, one MQTT device per site for the simulators, and the KFG balance group
 * (demo-month-end.ts; the field totals follow once the history exists, from the simulators). The data live in
 * simulators/scenario (one source for the seed and the simulators).
 *
 * Idempotent, safe on every start: each thing is inserted only when its natural key (site code,
 * meter run tag, transmitter tag, device username) is missing, and nothing that exists is ever
 * updated, so an engineer's later edits stand. A meter run's configuration versions are written
 * only together with the meter run itself.
 */
import type { Sequelize } from 'sequelize';
import { hashPassword } from '../auth/passwords';
import { configVersionSchema, meterRunSchema, siteSchema, transmitterSchema } from '../../shared/schemas/setup';
import {
  DEMO_METER_RUNS,
  DEMO_SITES,
  demoDevicePassword,
  demoMonthAt,
  scenarioTimeline,
  siteOf,
  KFG_SITE,
  type ScenarioMeterRun,
  type ScenarioTimeline,
} from '../../simulators/scenario';
import { seedDemoBalanceGroup } from './demo-month-end';
import { seedDemoCare } from './demo-care';

export interface DemoScenarioSeedResult {
  demoMonth: string;
  sites: number;
  meterRuns: number;
  configVersions: number;
  transmitters: number;
  devices: number;
  /** The month-end balance group (server/seed/demo-month-end.ts). */
  balanceGroups: number;
}

/** Serialises concurrent seeds (server start and a simulator run at once); arbitrary, fixed. */
const SEED_LOCK_KEY = 7_200_418;

/** Who the element change is recorded as made by, when the demo users exist. */
const ELEMENT_CHANGE_ENGINEER = 'engineer@demo.tallyrun';

/**
 * The demo scenario's site, meter run, configuration version and transmitter rows, as the
 * set-up API would take them (validated by the shared zod schemas), for one demo month.
 * @param timeline the scenario's instants for the demo month
 * @returns the rows, keyed by natural keys, with ids left to the caller
 */
export function demoScenarioRows(timeline: ScenarioTimeline) {
  const sites = DEMO_SITES.map((s) => ({ site: siteSchema.parse(s), device: s.device }));
  const meterRuns = DEMO_METER_RUNS.map((run) => {
    const effectiveFrom = new Date(timeline.historyStartMs[run.siteCode]).toISOString();
    // siteId '1' stands in for the real id here: the schema checks its form only.
    const input = meterRunSchema.parse({ ...meterRunFields(run), siteId: '1', effectiveFrom });
    const versions = [
      configVersionSchema.parse({
        effectiveFrom,
        element: run.element,
        fluid: run.fluid,
        reason: 'first configuration (demo scenario)',
      }),
    ];
    if (run.elementChange) {
      versions.push(
        configVersionSchema.parse({
          effectiveFrom: new Date(timeline.elementChangeMs[run.tag]).toISOString(),
          element: run.elementChange.element,
          fluid: run.fluid,
          reason: run.elementChange.reason,
        }),
      );
    }
    const transmitters = run.transmitters.map((t) => transmitterSchema.parse({ ...t, meterRunId: '1' }));
    return { run, input, versions, transmitters };
  });
  return { sites, meterRuns };
}

function meterRunFields(run: ScenarioMeterRun) {
  const {
    siteCode: _siteCode,
    transmitters: _transmitters,
    operating: _operating,
    elementChange: _elementChange,
    ...fields
  } = run;
  return fields;
}

/**
 * Inserts whatever of the demo scenario is missing.
 * @param sequelize connection (migrated)
 * @param options demoPassword: TALLYRUN_DEMO_PASSWORD, from which the devices' MQTT password
 *   derives (`${demoPassword}-device`); nowMs: the present (default Date.now()), which fixes the
 *   demo month (the calendar month before, in the KFG zone)
 * @returns what was created (zeros on a second run)
 */
export async function seedDemoScenario(
  sequelize: Sequelize,
  options: { demoPassword: string; nowMs?: number },
): Promise<DemoScenarioSeedResult> {
  if (!options || typeof options.demoPassword !== 'string' || options.demoPassword.length === 0) {
    throw new Error('seedDemoScenario: options.demoPassword is required');
  }
  const demoMonth = demoMonthAt(options.nowMs ?? Date.now(), KFG_SITE.timeZone);
  const rows = demoScenarioRows(scenarioTimeline(demoMonth));
  const created: DemoScenarioSeedResult = {
    demoMonth,
    sites: 0,
    meterRuns: 0,
    configVersions: 0,
    transmitters: 0,
    devices: 0,
    balanceGroups: 0,
  };

  // Hash outside the transaction (bcrypt takes a while) and only when a device is missing.
  const [existingDevices] = await sequelize.query('SELECT username FROM devices WHERE username IN (:usernames)', {
    replacements: { usernames: rows.sites.map((s) => s.device.username) },
  });
  const missingDevices = rows.sites.filter(
    (s) => !(existingDevices as { username: string }[]).some((d) => d.username === s.device.username),
  );
  const passwordHash = missingDevices.length ? await hashPassword(demoDevicePassword(options.demoPassword)) : '';

  await sequelize.transaction(async (transaction) => {
    const q = (sql: string, replacements: Record<string, unknown> = {}) =>
      sequelize.query(sql, { replacements, transaction }).then(([r]) => r as Record<string, unknown>[]);
    await q('SELECT pg_advisory_xact_lock(:key)', { key: SEED_LOCK_KEY });
    const engineer = (
      await q('SELECT id::text FROM users WHERE lower(email) = :email', { email: ELEMENT_CHANGE_ENGINEER })
    )[0] as { id: string } | undefined;

    const siteIds = new Map<string, string>();
    for (const { site } of rows.sites) {
      const inserted = await q(
        `INSERT INTO sites (code, name, time_zone, contract_hour, base_pressure_pa, base_temperature_k, atmospheric_pressure_pa, display_units)
         VALUES (:code, :name, :timeZone, :contractHour, :basePressurePa, :baseTemperatureK, :atmosphericPressurePa, :displayUnits)
         ON CONFLICT (code) DO NOTHING RETURNING id::text`,
        site,
      );
      if (inserted.length) {
        created.sites++;
        await audit(q, null, 'site.create', 'site', String(inserted[0].id), site);
      }
      siteIds.set(
        site.code,
        String((await q('SELECT id::text FROM sites WHERE code = :code', { code: site.code }))[0].id),
      );
    }

    for (const { run, input, versions, transmitters } of rows.meterRuns) {
      const siteId = siteIds.get(siteOf(run).code)!;
      const inserted = await q(
        `INSERT INTO meter_runs (site_id, tag, name, hold_limit_s, max_gap_s, stack_switch_up_share, stack_switch_down_share, line)
         VALUES (:siteId, :tag, :name, :holdLimitS, :maxGapS, :stackSwitchUpShare, :stackSwitchDownShare, CAST(:line AS jsonb))
         ON CONFLICT (tag) DO NOTHING RETURNING id::text`,
        { ...input, siteId, line: JSON.stringify(input.line) },
      );
      const meterRunId = inserted.length
        ? String(inserted[0].id)
        : String((await q('SELECT id::text FROM meter_runs WHERE tag = :tag', { tag: input.tag }))[0].id);
      if (inserted.length) {
        created.meterRuns++;
        await audit(q, null, 'meter-run.create', 'meter-run', meterRunId, { ...input, siteId });
        for (const [i, v] of versions.entries()) {
          // The first configuration is the system's; the element change is recorded as the engineer's.
          const by = i === 0 ? null : (engineer ?? null);
          await q(
            `INSERT INTO config_versions (meter_run_id, effective_from, element, fluid, reason, created_by)
             VALUES (:meterRunId, :effectiveFrom, CAST(:element AS jsonb), CAST(:fluid AS jsonb), :reason, :createdBy)`,
            {
              meterRunId,
              effectiveFrom: v.effectiveFrom,
              element: JSON.stringify(v.element),
              fluid: JSON.stringify(v.fluid),
              reason: v.reason,
              createdBy: by?.id ?? null,
            },
          );
          created.configVersions++;
          await audit(q, by, 'config-version.create', 'meter-run', meterRunId, v);
        }
      }
      for (const t of transmitters) {
        const row = await q(
          `INSERT INTO transmitters (meter_run_id, tag, measures, unit, pressure_reference, lower_range, upper_range, stack_role, accuracy_percent_of_span, calibration_due)
           VALUES (:meterRunId, :tag, :measures, :unit, :pressureReference, :lowerRange, :upperRange, :stackRole, :accuracyPercentOfSpan, :calibrationDue)
           ON CONFLICT (tag) DO NOTHING RETURNING id::text`,
          { ...t, meterRunId, calibrationDue: t.calibrationDue ?? null },
        );
        if (row.length) {
          created.transmitters++;
          await audit(q, null, 'transmitter.create', 'transmitter', String(row[0].id), { ...t, meterRunId });
        }
      }
    }

    for (const { site, device } of missingDevices) {
      const row = await q(
        `INSERT INTO devices (site_id, name, username, password_hash) VALUES (:siteId, :name, :username, :passwordHash)
         ON CONFLICT (username) DO NOTHING RETURNING id::text`,
        { siteId: siteIds.get(site.code), name: device.name, username: device.username, passwordHash },
      );
      if (row.length) {
        created.devices++;
        await audit(q, null, 'device.create', 'device', String(row[0].id), {
          siteCode: site.code,
          name: device.name,
          username: device.username,
        });
      }
    }
  });
  // Through the balance-groups use case, in its own transaction, once the meter runs are committed.
  created.balanceGroups = await seedDemoBalanceGroup(sequelize);
  // Transmitter calibrations through their use case (one overdue, one due soon: the "Care due" screen's demo).
  await seedDemoCare(sequelize, { nowMs: options.nowMs });
  return created;
}

type Query = (sql: string, replacements?: Record<string, unknown>) => Promise<Record<string, unknown>[]>;

/** The seed's changes go into the audit trail like anyone's (actor null: the system). */
async function audit(
  q: Query,
  actor: { id: string } | null,
  action: string,
  entityType: string,
  entityId: string,
  after: unknown,
) {
  await q(
    `INSERT INTO audit_events (actor_id, actor_email, action, entity_type, entity_id, after)
     VALUES (:actorId, :actorEmail, :action, :entityType, :entityId, CAST(:after AS jsonb))`,
    {
      actorId: actor?.id ?? null,
      actorEmail: actor ? ELEMENT_CHANGE_ENGINEER : null,
      action,
      entityType,
      entityId,
      after: JSON.stringify(after),
    },
  );
}
