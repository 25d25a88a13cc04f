import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { recordAuditEvent } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { conflict, notFound } from '../../errors';
import type { SiteRecord, SiteRepository } from './repository';
import type { SiteChanges, SiteInput } from './schema';
import { presentSite } from './presenter';

export interface SiteDeps {
  sequelize: Sequelize;
  repository: SiteRepository;
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
      const site = await repository.create(input, transaction);
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
 * Changes a site with its audit event (before and after).
 * @throws not found when the site does not exist
 */
export async function updateSite(
  { sequelize, repository }: SiteDeps,
  request: { siteId: string; changes: SiteChanges; actor: SignedInUser },
): Promise<SiteRecord> {
  return sequelize.transaction(async (transaction) => {
    const before = await repository.lockForUpdate(request.siteId, transaction);
    if (!before) throw notFound('Site');
    const after = await repository.update(before.id, request.changes, transaction);
    await recordAuditEvent(
      {
        actor: request.actor,
        action: 'site.update',
        entityType: 'site',
        entityId: after.id,
        before: presentSite(before),
        after: presentSite(after),
      },
      transaction,
    );
    return after;
  });
}
