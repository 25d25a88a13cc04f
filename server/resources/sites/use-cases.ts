import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { conflict, notFound } from '../../errors';
import type { SiteRecord, SiteRepository, SiteSettingValues } from './repository';
import { datedChangeTime } from '../meter-runs/use-cases';
import { hourStartOf } from '../../../shared/history/contract-day';
import { refuseDatedChangeInClosedMonth } from '../../history/closed-periods';
import type { SiteChanges, SiteInput } from './schema';
import { presentSite } from './presenter';

export interface SiteHooks {
  /**
   * Dated site settings took effect at `from`: the site's meter runs must recompute their hours
   * from the one containing it on; `reference` names the version (`site-settings:<id>`).
   */
  settingsChanged(meterRunIds: string[], from: Date, reference: string): Promise<void>;
}

export interface SiteDeps {
  sequelize: Sequelize;
  repository: SiteRepository;
  hooks: SiteHooks;
}

export const listSites = (repository: SiteRepository) => repository.list();

/** @throws not found when the site does not exist */
export async function getSite(repository: SiteRepository, siteId: string): Promise<SiteRecord> {
  const site = await repository.findById(siteId);
  if (!site) throw notFound('Site');
  return site;
}

/**
 * Creates a site with its audit event.
 * @throws conflict naming code when another site has the code (it is part of MQTT topics)
 */
export async function createSite({ sequelize, repository }: SiteDeps, input: SiteInput, actor: SignedInUser) {
  try {
    return await sequelize.transaction(async (transaction) => {
      const site = await repository.create({ ...input, createdBy: actor.id }, transaction);
      await recordAuditEvent(
        { actor, action: 'site.create', entityType: 'site', entityId: site.id, after: presentSite(site) },
        transaction,
      );
      return site;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw conflict(`A site with code ${input.code} already exists.`, 'code', 'duplicate');
    throw err;
  }
}

/**
 * A value the form sends back after a unit round trip (101.325 kPa → 101325.00000000001 Pa) is
 * the stored one: only a real change makes a dated version and a recompute.
 */
const sameValue = (a: number, b: number) => a === b || Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));

/** The dated settings a change asks for, or null when they stay as they are. */
function settingsOf(before: SiteRecord, changes: SiteChanges): SiteSettingValues | null {
  const keys = ['contractHour', 'basePressurePa', 'baseTemperatureK', 'atmosphericPressurePa'] as const;
  const after = { ...before } as SiteSettingValues;
  let changed = false;
  for (const key of keys) {
    const wanted = changes[key];
    if (wanted !== undefined && !sameValue(wanted, before[key])) {
      after[key] = wanted;
      changed = true;
    }
  }
  return changed
    ? {
        contractHour: after.contractHour,
        basePressurePa: after.basePressurePa,
        baseTemperatureK: after.baseTemperatureK,
        atmosphericPressurePa: after.atmosphericPressurePa,
      }
    : null;
}

/**
 * Changes a site with its audit event (before and after, and the reason). The code, name, zone
 * and display units change in place; the contract hour, base conditions and atmospheric pressure
 * are dated: a change appends a version in force from `effectiveFrom` (default now, under the rule
 * of configuration versions, against the earliest history of the site's meter runs) and
 * recomputes the site's meter runs from the hour containing it on, and no earlier hour. A new
 * contract hour takes effect at the next contract-day start (shared/history/contract-calendar.ts).
 * @throws not found when the site does not exist; bad request naming effectiveFrom outside the history
 */
export async function updateSite(
  { sequelize, repository, hooks }: SiteDeps,
  request: { siteId: string; changes: SiteChanges; actor: SignedInUser; nowMs?: number },
): Promise<SiteRecord> {
  const { changes, actor } = request;
  const current = await repository.findById(request.siteId);
  if (!current) throw notFound('Site');
  const effectiveFrom = datedChangeTime(
    changes.effectiveFrom,
    settingsOf(current, changes) !== null,
    await repository.historyStart(current.id),
    request.nowMs ?? Date.now(),
  );
  if (settingsOf(current, changes) !== null)
    await refuseDatedChangeInClosedMonth(sequelize, { siteId: current.id }, effectiveFrom);
  const { site, versionId } = await sequelize.transaction(async (transaction) => {
    const before = await repository.lockForUpdate(request.siteId, transaction);
    if (!before) throw notFound('Site');
    const { code, name, timeZone, displayUnits } = changes;
    let after = await repository.update(before.id, { code, name, timeZone, displayUnits }, transaction);
    const settings = settingsOf(before, changes);
    let id: string | null = null;
    if (settings) {
      await repository.ensureSettingBaseline(before.id, transaction);
      id = await repository.addSettingVersion(
        before.id,
        { ...settings, effectiveFrom, reason: changes.reason ?? '', createdBy: actor.id },
        transaction,
      );
      after = (await repository.lockForUpdate(before.id, transaction)) ?? after;
    }
    await recordAuditEvent(
      {
        actor,
        action: 'site.update',
        entityType: 'site',
        entityId: after.id,
        before: presentSite(before),
        after: settings
          ? { ...presentSite(after), settingsEffectiveFrom: effectiveFrom.toISOString() }
          : presentSite(after),
        reason: changes.reason ?? null,
      },
      transaction,
    );
    return { site: after, versionId: id };
  });
  if (versionId !== null) {
    // From the hour that contains the effective time: it is split there into two records.
    const from = new Date(hourStartOf(effectiveFrom.getTime(), site.timeZone));
    await hooks.settingsChanged(await repository.meterRunIds(site.id), from, `site-settings:${versionId}`);
  }
  return site;
}
