import crypto from 'node:crypto';
import { badRequest, notFound } from '../../errors';
import { recordAuditEvent } from '../../audit';
import { hashPassword } from '../../auth/passwords';
import type { SignedInUser } from '../../auth/passport';
import type { DevicesRepository } from './repository';
import { presentDevice } from './presenter';

/** Every device with its site's code. */
export function listDevices(repository: DevicesRepository) {
  return repository.list();
}

/**
 * Why a device's readings were refused: the latest refusals and the counts by kind.
 * @throws not found when there is no such device
 */
export async function deviceRejections(repository: DevicesRepository, id: string) {
  if (!(await repository.exists(id))) throw notFound('Device');
  return repository.rejections(id);
}

/**
 * Issues MQTT credentials for a field device of a site: a username from the site's code and a
 * random password, stored only as a hash. Audited (the audit keeps the device as the API shows it).
 * @returns the device, its site's code and the password, which is shown this once
 * @throws 400 naming siteId when there is no such site
 */
export async function createDevice(
  repository: DevicesRepository,
  input: { siteId: string; name: string },
  actor: SignedInUser,
) {
  const site = await repository.site(input.siteId);
  if (!site) throw badRequest(`siteId: no site ${input.siteId}`, 'siteId', 'invalid_field');
  const username = `${site.code.toLowerCase()}-${crypto.randomBytes(4).toString('hex')}`;
  const password = crypto.randomBytes(18).toString('base64url');
  const passwordHash = await hashPassword(password);
  const device = await repository.transaction(async (transaction) => {
    const created = await repository.create({ siteId: site.id, name: input.name, username, passwordHash }, transaction);
    await recordAuditEvent(
      {
        actor,
        action: 'device.create',
        entityType: 'device',
        entityId: created.id,
        after: presentDevice(created, site.code),
      },
      transaction,
    );
    return created;
  });
  return { device, siteCode: site.code, password };
}

/**
 * Enables or disables a device, audited.
 * @param credentialsChanged told the device's username when it is disabled (to cut it off now),
 *   or '' when it is enabled (so the broker's credential cache is refreshed)
 * @throws not found
 */
export async function setDeviceDisabled(
  repository: DevicesRepository,
  id: string,
  disabled: boolean,
  actor: SignedInUser,
  credentialsChanged: (username: string) => void,
) {
  const changed = await repository.transaction(async (transaction) => {
    const result = await repository.setDisabled(id, disabled, transaction);
    if (!result) throw notFound('Device');
    await recordAuditEvent(
      {
        actor,
        action: 'device.update',
        entityType: 'device',
        entityId: result.after.id,
        before: presentDevice(result.before),
        after: presentDevice(result.after),
      },
      transaction,
    );
    return result.after;
  });
  credentialsChanged(disabled ? changed.username : '');
  return changed;
}
