import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { badRequest, conflict, notFound } from '../../errors';
import { configDifference, type FieldChange } from '../../../shared/config/config-difference';
import { hourStartOf } from '../../../shared/history/contract-day';
import { refuseDatedChangeInClosedMonth } from '../../history/closed-periods';
import type {
  ConfigVersionAuthor,
  ConfigVersionRecord,
  MeterRunRecord,
  MeterRunRepository,
  MeterRunSettingValues,
} from './repository';
import type { CreateConfigVersionInput, CreateMeterRunInput, MeterRunChanges } from './schema';
import { presentConfigVersion, presentMeterRun } from './presenter';

/**
 * How far ahead a version may be dated: enough for a change planned for tomorrow's contract
 * hour, not so far that a mistyped year lies in wait unnoticed.
 */
const futureLimitMs = 24 * 3_600_000;

export interface MeterRunHooks {
  /**
   * A configuration version (or a meter run setting) took effect at `from`: hours from the one
   * containing it on must be recomputed; `configVersionId` names the version (a settings version
   * as `meter-run-settings:<id>`), so record versions can cite it.
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
  const timeZone = await repository.siteTimeZone(input.siteId);
  if (timeZone === null) throw badRequest(`siteId: no site ${input.siteId}`, 'siteId', 'invalid_field');
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
        // Without an effective date, history starts when the meter run is created: at the start of
        // the site's hour it is created in (an hour either is in a meter run's history or is not).
        // Nothing before it is a record, so no empty days are listed from before it existed.
        const effectiveFrom = input.effectiveFrom
          ? new Date(input.effectiveFrom)
          : new Date(hourStartOf(Date.now(), timeZone));
        const config = await repository.createConfigVersion(
          {
            meterRunId: meterRun.id,
            effectiveFrom,
            element: input.element,
            fluid: input.fluid,
            ...directionOf(input),
            reason: 'first configuration',
            createdBy: actor.id,
          },
          transaction,
        );
        await repository.addSettingVersion(
          meterRun.id,
          {
            holdLimitS: meterRun.holdLimitS,
            maxGapS: meterRun.maxGapS,
            noFlowCutoffShare: input.noFlowCutoffPercentOfSpan / 100,
            stackSwitchUpShare: meterRun.stackSwitchUpShare,
            stackSwitchDownShare: meterRun.stackSwitchDownShare,
            effectiveFrom,
            reason: 'first settings',
            createdBy: actor.id,
          },
          transaction,
        );
        const created = (await repository.lockForUpdate(meterRun.id, transaction)) ?? meterRun;
        await recordAuditEvent(
          {
            actor,
            action: 'meter-run.create',
            entityType: 'meter-run',
            entityId: meterRun.id,
            after: presentMeterRun(created, config),
          },
          transaction,
        );
        return { meterRun: created, config };
      }),
    () => conflict(`A meter run tagged ${input.tag} already exists.`, 'tag', 'duplicate'),
  );
}

/** The meter run's settings as they are, with the dated ones a change asks for. */
function changedSettings(before: MeterRunRecord, changes: MeterRunChanges): MeterRunSettingValues | null {
  const after: MeterRunSettingValues = {
    holdLimitS: changes.holdLimitS ?? before.holdLimitS,
    maxGapS: changes.maxGapS ?? before.maxGapS,
    noFlowCutoffShare:
      changes.noFlowCutoffPercentOfSpan !== undefined
        ? changes.noFlowCutoffPercentOfSpan / 100
        : before.noFlowCutoffShare,
    stackSwitchUpShare: before.stackSwitchUpShare,
    stackSwitchDownShare: before.stackSwitchDownShare,
  };
  const same =
    after.holdLimitS === before.holdLimitS &&
    after.maxGapS === before.maxGapS &&
    after.noFlowCutoffShare === before.noFlowCutoffShare;
  return same ? null : after;
}

/**
 * When a change of dated settings takes effect: `effectiveFrom` when given, else now, under the
 * rule of configuration versions (checkEffectiveFrom). Giving `effectiveFrom` without changing any
 * dated setting is refused, rather than ignored.
 * @throws bad request naming effectiveFrom
 */
export function datedChangeTime(
  effectiveFrom: string | undefined,
  changesDatedSetting: boolean,
  historyStart: Date | null,
  nowMs: number,
): Date {
  if (effectiveFrom !== undefined && !changesDatedSetting)
    throw badRequest(
      'effectiveFrom: only a change of a dated setting takes an effective time (nothing dated changes)',
      'effectiveFrom',
      'invalid_field',
    );
  const at = effectiveFrom !== undefined ? new Date(effectiveFrom) : new Date(nowMs);
  checkEffectiveFrom(at, historyStart, nowMs);
  return at;
}

/**
 * A line marked bi-directional must have reverse constants to compute reverse flow with, and a
 * bi-directional configuration must not sit under a line marked one-way (issue 13 §11): the line
 * follows the latest configuration version, which alone says how the hours are computed.
 * @throws bad request naming `line.bidirectional`
 */
export function refuseLineDirectionAgainstConfig(
  line: NonNullable<MeterRunChanges['line']>,
  latest: { reverseElement: unknown } | null,
) {
  const bidirectional = line.bidirectional === true;
  const configured = latest !== null && latest.reverseElement !== null && latest.reverseElement !== undefined;
  if (bidirectional && !configured)
    throw badRequest(
      "line.bidirectional: the latest configuration version has no reverseElement; add a configuration version with the element's constants in reverse flow first",
      'line.bidirectional',
      'invalid_field',
    );
  if (!bidirectional && configured)
    throw badRequest(
      'line.bidirectional: must stay true while the latest configuration version has a reverseElement; add a one-way configuration version first',
      'line.bidirectional',
      'invalid_field',
    );
}

/**
 * Changes a meter run, with its audit event (old and new values, and the reason). The name and
 * line change in place; the hold limit, largest gap and no-flow cutoff are dated settings: a
 * change appends a version in force from `effectiveFrom` (default now) and recomputes the hours
 * from the one containing it on, and no earlier hour.
 * @throws not found when the meter run does not exist; bad request naming effectiveFrom outside
 *   the meter run's history
 */
export async function updateMeterRun(
  { sequelize, repository, hooks }: MeterRunDeps,
  request: { meterRunId: string; changes: MeterRunChanges; actor: SignedInUser; nowMs?: number },
): Promise<MeterRunWithConfig> {
  const { meterRunId, changes, actor } = request;
  const current = await repository.findById(meterRunId);
  if (!current) throw notFound('Meter run');
  const history = await repository.configVersionHistory(meterRunId);
  if (changes.line !== undefined) refuseLineDirectionAgainstConfig(changes.line, history.at(-1)?.version ?? null);
  const wanted = changedSettings(current, changes);
  const effectiveFrom = datedChangeTime(
    changes.effectiveFrom,
    wanted !== null,
    history[0]?.version.effectiveFrom ?? null,
    request.nowMs ?? Date.now(),
  );
  if (wanted !== null) await refuseDatedChangeInClosedMonth(sequelize, { meterRunId }, effectiveFrom);
  const { meterRun, settingVersionId } = await sequelize.transaction(async (transaction) => {
    const before = await repository.lockForUpdate(meterRunId, transaction);
    if (!before) throw notFound('Meter run');
    let after = await repository.update(before.id, { name: changes.name, line: changes.line }, transaction);
    const settings = changedSettings(before, changes);
    let versionId: string | null = null;
    if (settings) {
      await repository.ensureSettingBaseline(before.id, transaction);
      versionId = await repository.addSettingVersion(
        before.id,
        { ...settings, effectiveFrom, reason: changes.reason ?? '', createdBy: actor.id },
        transaction,
      );
      after = (await repository.lockForUpdate(before.id, transaction)) ?? after;
    }
    await recordAuditEvent(
      {
        actor,
        action: 'meter-run.update',
        entityType: 'meter-run',
        entityId: after.id,
        before: presentMeterRun(before),
        after: settings
          ? { ...presentMeterRun(after), settingsEffectiveFrom: effectiveFrom.toISOString() }
          : presentMeterRun(after),
        reason: changes.reason ?? null,
      },
      transaction,
    );
    return { meterRun: after, settingVersionId: versionId };
  });
  if (settingVersionId !== null) {
    // From the hour that contains the effective time: it is split there into two records.
    const timeZone = await repository.siteTimeZone(meterRun.siteId);
    const fromMs = timeZone ? hourStartOf(effectiveFrom.getTime(), timeZone) : effectiveFrom.getTime();
    await hooks.configChanged(meterRun.id, new Date(fromMs), `meter-run-settings:${settingVersionId}`);
  }
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

/** What a version's change list compares: the reverse constants only where a version has them (one-way lists stay as they were). */
const configOf = (v: ConfigVersionRecord) => ({
  element: v.element,
  fluid: v.fluid,
  ...(v.reverseElement ? { reverseElement: v.reverseElement, directionSource: v.directionSource } : {}),
});

/**
 * A version's reverse element and direction source (issue 13 §11): with a reverse element the
 * meter run is bi-directional from the version on, by the sign of the DP unless told otherwise.
 */
function directionOf(input: {
  reverseElement?: Record<string, unknown>;
  directionSource?: 'dp-sign' | 'direction-input';
}) {
  return input.reverseElement
    ? { reverseElement: input.reverseElement, directionSource: input.directionSource ?? 'dp-sign' }
    : { reverseElement: null, directionSource: null };
}

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
 * silently) and not more than a day ahead. The rule of configuration versions and of every dated
 * setting (meter runs, transmitters, sites).
 */
export function checkEffectiveFrom(effectiveFrom: Date, historyStart: Date | null, nowMs: number) {
  const limitMs = nowMs + futureLimitMs;
  if (effectiveFrom.getTime() > limitMs)
    throw badRequest(
      `effectiveFrom: must be at most one day ahead (no later than ${new Date(limitMs).toISOString()})`,
      'effectiveFrom',
      'invalid_field',
    );
  if (historyStart && effectiveFrom.getTime() < historyStart.getTime())
    throw badRequest(
      `effectiveFrom: must not be before the meter run's history starts (its first configuration version, ${historyStart.toISOString()})`,
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
  checkEffectiveFrom(effectiveFrom, before[0]?.version.effectiveFrom ?? null, request.nowMs ?? Date.now());
  await refuseDatedChangeInClosedMonth(sequelize, { meterRunId: meterRun.id }, effectiveFrom);
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
            ...directionOf(input),
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

/** One dated setting version as the history lists it: what it is about, its values, who, why and what changed. */
export interface SettingVersionEntry {
  kind: 'meter-run' | 'transmitter' | 'site';
  id: string;
  /** The meter run, transmitter or site the version belongs to, with its tag or code where it has one. */
  subject: { id: string; tag: string | null };
  effectiveFrom: Date;
  reason: string;
  createdAt: Date;
  createdBy: ConfigVersionAuthor | null;
  values: Record<string, number>;
  /** Field by field, against the version of the same subject in force just before it (by effective time). */
  changes: FieldChange[];
  first: boolean;
}

/**
 * The dated settings of a meter run (issue 9 §5): its own settings (hold limit, largest gap,
 * no-flow cutoff in percent of span, stacked-pair shares), its transmitters' ranges and
 * accuracies, and its site's contract hour, base conditions and atmospheric pressure, each with
 * who, why and the difference from the version before, all by effective time.
 * @throws not found when the meter run does not exist
 */
export async function listSettingVersions(
  repository: MeterRunRepository,
  meterRunId: string,
): Promise<SettingVersionEntry[]> {
  const meterRun = await repository.findById(meterRunId);
  if (!meterRun) throw notFound('Meter run');
  const entries: SettingVersionEntry[] = [];
  const add = (
    kind: SettingVersionEntry['kind'],
    subject: SettingVersionEntry['subject'],
    versions: {
      id: string;
      effectiveFrom: Date;
      reason: string;
      createdAt: Date;
      createdBy: ConfigVersionAuthor | null;
    }[],
    valuesOf: (i: number) => Record<string, number>,
  ) =>
    versions.forEach((v, i) =>
      entries.push({
        kind,
        id: v.id,
        subject,
        effectiveFrom: v.effectiveFrom,
        reason: v.reason,
        createdAt: v.createdAt,
        createdBy: v.createdBy,
        values: valuesOf(i),
        changes: i === 0 ? [] : configDifference(valuesOf(i - 1), valuesOf(i)),
        first: i === 0,
      }),
    );
  const own = await repository.settingVersionHistory(meterRun.id);
  add('meter-run', { id: meterRun.id, tag: meterRun.tag }, own, (i) => ({
    holdLimitS: own[i].holdLimitS,
    maxGapS: own[i].maxGapS,
    noFlowCutoffPercentOfSpan: Number((own[i].noFlowCutoffShare * 100).toPrecision(12)),
    stackSwitchUpShare: own[i].stackSwitchUpShare,
    stackSwitchDownShare: own[i].stackSwitchDownShare,
  }));
  const ranges = await repository.transmitterRangeHistory(meterRun.id);
  for (const transmitterId of [...new Set(ranges.map((r) => r.transmitterId))]) {
    const own = ranges.filter((r) => r.transmitterId === transmitterId);
    add('transmitter', { id: transmitterId, tag: own[0].tag }, own, (i) => ({
      lowerRange: own[i].lowerRange,
      upperRange: own[i].upperRange,
      accuracyPercentOfSpan: own[i].accuracyPercentOfSpan,
    }));
  }
  const site = await repository.siteSettingHistory(meterRun.siteId);
  add('site', { id: meterRun.siteId, tag: null }, site, (i) => ({
    contractHour: site[i].contractHour,
    basePressurePa: site[i].basePressurePa,
    baseTemperatureK: site[i].baseTemperatureK,
    atmosphericPressurePa: site[i].atmosphericPressurePa,
  }));
  // By effective time, then as written (a stable order for versions at one instant).
  return entries.sort(
    (a, b) => a.effectiveFrom.getTime() - b.effectiveFrom.getTime() || a.createdAt.getTime() - b.createdAt.getTime(),
  );
}
