import { Device, Site } from '../models';
import { checkPassword } from '../auth/passwords';

export interface SignedInDevice {
  id: string;
  siteCode: string;
}

/**
 * Checks device credentials. A successful check is remembered (by username and a hash of the
 * password) so reconnect storms do not cost a bcrypt each; `forget()` drops the memory when an
 * admin disables a device.
 */
export class DeviceAuthenticator {
  private remembered = new Map<string, { password: string; device: SignedInDevice }>();

  forget() {
    this.remembered.clear();
  }

  async authenticate(username: string, password: string): Promise<SignedInDevice | null> {
    const hit = this.remembered.get(username);
    if (hit && hit.password === password) return hit.device;
    const device = await Device.findOne({ where: { username } });
    if (!device || device.disabled) return null;
    if (!(await checkPassword(password, device.passwordHash))) return null;
    const site = await Site.findByPk(device.siteId);
    if (!site) return null;
    const signedIn = { id: String(device.id), siteCode: site.code };
    this.remembered.set(username, { password, device: signedIn });
    return signedIn;
  }
}
