import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, notFound } from '../../errors';
import type { ConfigVersionRecord, MeterRunRecord, MeterRunRepository } from './repository';
import type { CreateConfigVersionInput, CreateMeterRunInput, MeterRunChanges } from './schema';
import { presentConfigVersion, presentMeterRun } from './presenter';

/** Before this, a meter run created without an effective date has no history to compute. */
const beginningOfHistory = new Date('2000-01-01T00:00:00Z');

export interface MeterRunHooks {
  /** A configuration version took effect at `from`: hours from then on must be recomputed. */
  configChanged(meterRunId: string, from: Date): Promise<void>;
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

/** @throws not found when the meter run does not exist */
export async function listConfigVersions(repository: MeterRunRepository, meterRunId: string) {
  if (!(await repository.findById(meterRunId))) throw notFound('Meter run');
  return repository.configVersions(meterRunId);
}

/**
 * Adds a configuration version, with its audit event, and queues the hours from its effective
 * time for recomputation (a back-dated version changes history already computed).
 * @throws not found when the meter run does not exist; conflict naming effectiveFrom for a taken instant
 */
export async function addConfigVersion(
  { sequelize, repository, hooks }: MeterRunDeps,
  request: { meterRunId: string; input: CreateConfigVersionInput; actor: SignedInUser },
): Promise<ConfigVersionRecord> {
  const { input, actor } = request;
  const meterRun = await repository.findById(request.meterRunId);
  if (!meterRun) throw notFound('Meter run');
  const effectiveFrom = new Date(input.effectiveFrom);
  return refusingDuplicates(
    async () => {
      const version = await sequelize.transaction(async (transaction) => {
        const created = await repository.createConfigVersion(
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
            after: presentConfigVersion(created),
          },
          transaction,
        );
        return created;
      });
      await hooks.configChanged(meterRun.id, effectiveFrom);
      return version;
    },
    () => conflict('A configuration version with this effective time already exists.', 'effectiveFrom', 'duplicate'),
  );
}
