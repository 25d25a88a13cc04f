import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, notFound } from '../../errors';
import { configDifference, type FieldChange } from '../../../shared/config/config-difference';
import { hourStartOf } from '../../../shared/history/contract-day';
import type { ConfigVersionAuthor, ConfigVersionRecord, MeterRunRecord, MeterRunRepository } from './repository';
import type { CreateConfigVersionInput, CreateMeterRunInput, MeterRunChanges } from './schema';
import { presentConfigVersion, presentMeterRun } from './presenter';

/** Before this, a meter run created without an effective date has no history to compute. */
const beginningOfHistory = new Date('2000-01-01T00:00:00Z');

/**
 * How far ahead a version may be dated: enough for a change planned for tomorrow's contract
 * hour, not so far that a mistyped year lies in wait unnoticed.
 */
const futureLimitMs = 24 * 3_600_000;

export interface MeterRunHooks {
  /**
   * A configuration version (or a meter run setting) took effect at `from`: hours from then on
   * must be recomputed; `configVersionId` names the version, so record versions can cite it.
   */
  configChanged(meterRunId: string, from: Date, configVersionId?: string): Promise<void>;
}

export interface MeterRunDeps {
  sequelize: Sequelize;
  repository: MeterRunRepository;
  hooks: MeterRunHooks;
}

/** A meter run and the configuration version in force (null before its first one takes effect). */
export interface MeterRunWithConfig {
  meterRun: MeterRunRecord;
  config: ConfigVersionRecord | null;
}

/** A unique index refused the write: the same tag, or two versions at one instant. */
async function refusingDuplicates<T>(write: () => Promise<T>, duplicate: () => Error): Promise<T> {
  try {
    return await write();
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw duplicate();
    throw err;
  }
}

/** Meter runs by tag (of one site, or all) with the configuration in force at `at`. */
export async function listMeterRuns(
  repository: MeterRunRepository,
  filter: { siteId?: string },
  at = new Date(),
): Promise<MeterRunWithConfig[]> {
  const runs = await repository.list(filter.siteId);
  // Newest first, so the first version met per meter run is the one in force.
  const versions = await repository.configsEffectiveBy(
    runs.map((m) => m.id),
    at,
  );
  const current = new Map<string, ConfigVersionRecord>();
  for (const v of versions) if (!current.has(v.meterRunId)) current.set(v.meterRunId, v);
  return runs.map((meterRun) => ({ meterRun, config: current.get(meterRun.id) ?? null }));
}

/** @throws not found when the meter run does not exist */
export async function getMeterRun(repository: MeterRunRepository, meterRunId: string): Promise<MeterRunWithConfig> {
  const meterRun = await repository.findById(meterRunId);
  if (!meterRun) throw notFound('Meter run');
  return { meterRun, config: await repository.currentConfig(meterRun.id, new Date()) };
}

/**
 * Creates a meter run and its first configuration version in one transaction, with its audit event.
 * @throws bad request naming siteId when the site does not exist; conflict naming tag for a tag in use
 */
export async function createMeterRun(
  { sequelize, repository }: MeterRunDeps,
  input: CreateMeterRunInput,
  actor: SignedInUser,
): Promise<MeterRunWithConfig> {
  if (!(await repository.siteExists(input.siteId)))
    throw badRequest(`siteId: no site ${input.siteId}`, 'siteId', 'invalid_field');
  return refusingDuplicates(
    () =>
      sequelize.transaction(async (transaction) => {
        const meterRun = await repository.create(
          {
            siteId: input.siteId,
            tag: input.tag,
            name: input.name,
            holdLimitS: input.holdLimitS,
            maxGapS: input.maxGapS,
            stackSwitchUpShare: input.stackSwitchUpShare,
            stackSwitchDownShare: input.stackSwitchDownShare,
            line: input.line,
          },
          transaction,
        );
        const config = await repository.createConfigVersion(
          {
            meterRunId: meterRun.id,
            effectiveFrom: input.effectiveFrom ? new Date(input.effectiveFrom) : beginningOfHistory,
            element: input.element,
            fluid: input.fluid,
            reason: 'first configuration',
            createdBy: actor.id,
          },
          transaction,
        );
        await recordAuditEvent(
          {
            actor,
            action: 'meter-run.create',
            entityType: 'meter-run',
            entityId: meterRun.id,
            after: presentMeterRun(meterRun, config),
          },
          transaction,
        );
        return { meterRun, config };
      }),
    () => conflict(`A meter run tagged ${input.tag} already exists.`, 'tag', 'duplicate'),
  );
}

/**
 * Changes a meter run in place, with its audit event. A new hold limit or gap changes how every
 * hour is computed, so all its history is queued for recomputation.
 * @throws not found when the meter run does not exist
 */
export async function updateMeterRun(
  { sequelize, repository, hooks }: MeterRunDeps,
  request: { meterRunId: string; changes: MeterRunChanges; actor: SignedInUser },
): Promise<MeterRunWithConfig> {
  const { meterRunId, changes, actor } = request;
  const meterRun = await sequelize.transaction(async (transaction) => {
    const before = await repository.lockForUpdate(meterRunId, transaction);
    if (!before) throw notFound('Meter run');
    const after = await repository.update(before.id, changes, transaction);
    await recordAuditEvent(
      {
        actor,
        action: 'meter-run.update',
        entityType: 'meter-run',
        entityId: after.id,
        before: presentMeterRun(before),
        after: presentMeterRun(after),
      },
      transaction,
    );
    return after;
  });
  if (changes.holdLimitS !== undefined || changes.maxGapS !== undefined)
    await hooks.configChanged(meterRun.id, beginningOfHistory);
  return { meterRun, config: await repository.currentConfig(meterRun.id, new Date()) };
}

/** A configuration version as the history lists it: who made it and what it changed. */
export interface ConfigVersionEntry {
  version: ConfigVersionRecord;
  createdBy: ConfigVersionAuthor | null;
  /** Field by field, against the version in force just before it (by effective time). */
  changes: FieldChange[];
  /** The meter run's first version: its history starts here, and it has nothing to differ from. */
  first: boolean;
}

/** The hours a new version sends back to the history worker. */
export interface RecomputeSummary {
  /** The start of the hour that contains the effective time, on the site's clock. */
  fromMs: number;
  /** Hourly records already computed from `fromMs` on, each recomputed with the new version. */
  hours: number;
}

const configOf = (v: ConfigVersionRecord) => ({ element: v.element, fluid: v.fluid });

/** @throws not found when the meter run does not exist */
export async function listConfigVersions(
  repository: MeterRunRepository,
  meterRunId: string,
): Promise<ConfigVersionEntry[]> {
  if (!(await repository.findById(meterRunId))) throw notFound('Meter run');
  const history = await repository.configVersionHistory(meterRunId);
  return history.map(({ version, createdBy }, i) => ({
    version,
    createdBy,
    changes: i === 0 ? [] : configDifference(configOf(history[i - 1].version), configOf(version)),
    first: i === 0,
  }));
}

/**
 * An effective time must fall inside the meter run's history: not before its first version
 * (there are no hours there to compute, and the first version's own time would be rewritten
 * silently) and not more than a day ahead.
 */
function checkEffectiveFrom(effectiveFrom: Date, firstVersion: ConfigVersionRecord | undefined, nowMs: number) {
  const limitMs = nowMs + futureLimitMs;
  if (effectiveFrom.getTime() > limitMs)
    throw badRequest(
      `effectiveFrom: must be at most one day ahead (no later than ${new Date(limitMs).toISOString()})`,
      'effectiveFrom',
      'invalid_field',
    );
  if (firstVersion && effectiveFrom.getTime() < firstVersion.effectiveFrom.getTime())
    throw badRequest(
      `effectiveFrom: must not be before the meter run's history starts (its first configuration version, ${firstVersion.effectiveFrom.toISOString()})`,
      'effectiveFrom',
      'invalid_field',
    );
}

/**
 * Adds a configuration version, with its audit event and reason, and queues the hours from the
 * one containing its effective time for recomputation (a back-dated version changes history
 * already computed; the hour it falls in is computed in two parts, old version then new).
 * @throws not found when the meter run does not exist; bad request naming effectiveFrom outside
 *   the history; conflict naming effectiveFrom for a taken instant
 */
export async function addConfigVersion(
  { sequelize, repository, hooks }: MeterRunDeps,
  request: { meterRunId: string; input: CreateConfigVersionInput; actor: SignedInUser; nowMs?: number },
): Promise<ConfigVersionEntry & { recompute: RecomputeSummary }> {
  const { input, actor } = request;
  const meterRun = await repository.findById(request.meterRunId);
  if (!meterRun) throw notFound('Meter run');
  const effectiveFrom = new Date(input.effectiveFrom);
  const before = await repository.configVersionHistory(meterRun.id);
  checkEffectiveFrom(effectiveFrom, before[0]?.version, request.nowMs ?? Date.now());
  const timeZone = await repository.siteTimeZone(meterRun.siteId);
  const fromMs = timeZone ? hourStartOf(effectiveFrom.getTime(), timeZone) : effectiveFrom.getTime();
  const version = await refusingDuplicates(
    async () => {
      const created = await sequelize.transaction(async (transaction) => {
        const row = await repository.createConfigVersion(
          {
            meterRunId: meterRun.id,
            effectiveFrom,
            element: input.element,
            fluid: input.fluid,
            reason: input.reason,
            createdBy: actor.id,
          },
          transaction,
        );
        await recordAuditEvent(
          {
            actor,
            action: 'config-version.create',
            entityType: 'meter-run',
            entityId: meterRun.id,
            after: presentConfigVersion(row),
            reason: input.reason,
          },
          transaction,
        );
        return row;
      });
      await hooks.configChanged(meterRun.id, new Date(fromMs), created.id);
      return created;
    },
    () => conflict('A configuration version with this effective time already exists.', 'effectiveFrom', 'duplicate'),
  );
  const entries = await listConfigVersions(repository, meterRun.id);
  const entry = entries.find((e) => e.version.id === version.id);
  if (!entry) throw new Error(`configuration version ${version.id} vanished after it was written`);
  return { ...entry, recompute: { fromMs, hours: await repository.computedHourCount(meterRun.id, fromMs) } };
}
