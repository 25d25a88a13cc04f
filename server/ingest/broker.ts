import net from 'node:net';
import type { AddressInfo } from 'node:net';

/** Decides whether a device may connect with these credentials. */
export type DeviceAuthenticator = (username: string, password: string) => Promise<{ id: string; siteCode: string } | null>;

export interface EmbeddedBroker {
  port: number;
  isUp(): boolean;
  close(): Promise<void>;
  /** The aedes instance, for in-process subscribers (live views) and hooks. */
  aedes: import('aedes').Aedes;
}

/**
 * The embedded MQTT broker (aedes, MQTT 3.1.1) on loopback. Devices sign in with the
 * credentials an administrator issued; anything else is refused with "bad user name or
 * password" before it can publish.
 */
export async function startEmbeddedBroker(options: {
  host: string;
  port: number;
  authenticate: DeviceAuthenticator;
}): Promise<EmbeddedBroker> {
  // aedes 1.x ships as an ES module only; a dynamic import keeps this file loadable from CommonJS.
  const { Aedes } = await import('aedes');
  const aedes = await Aedes.createBroker({ id: 'tallyrun' });

  aedes.authenticate = (client, username, password, done) => {
    const fail = () => {
      const err = Object.assign(new Error('Bad user name or password'), { returnCode: 4 as const });
      done(err, false);
    };
    if (!username || !password) return fail();
    options
      .authenticate(username, password.toString('utf8'))
      .then((device) => {
        if (!device) return fail();
        (client as unknown as { device: unknown }).device = device;
        done(null, true);
      })
      .catch(() => fail());
  };

  const server = net.createServer(aedes.handle);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;

  return {
    port,
    aedes,
    isUp: () => server.listening && !aedes.closed,
    close: () =>
      new Promise<void>((resolve) => {
        aedes.close(() => server.close(() => resolve()));
      }),
  };
}
