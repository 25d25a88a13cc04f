import net from 'node:net';
import type { AddressInfo } from 'node:net';
import type { Aedes } from 'aedes';

/** Decides whether a device may connect with these credentials. */
export type DeviceAuthenticator = (
  username: string,
  password: string,
) => Promise<{ id: string; siteCode: string } | null>;

/** Stores a message's readings; resolves once they are committed (then the broker sends PUBACK). */
export type PublishHandler = (
  device: { id: string; siteCode: string },
  topic: string,
  payload: Buffer,
) => Promise<unknown>;

export interface EmbeddedBroker {
  port: number;
  isUp(): boolean;
  close(): Promise<void>;
  /** Closes every connection signed in as this device username. */
  disconnect(username: string): void;
  /** The aedes instance, for in-process subscribers (live views) and hooks. */
  aedes: Aedes;
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
  onPublish: PublishHandler;
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
        (client as unknown as { device: unknown }).device = { ...device, username };
        done(null, true);
      })
      .catch(() => fail());
  };

  // Storing happens before aedes acknowledges: its PUBACK for QoS 1 goes out only after this
  // callback, so an acknowledged reading is a committed reading. A database failure is passed
  // back as an error, which drops the connection unacknowledged and the device sends it again.
  aedes.authorizePublish = (client, packet, callback) => {
    const device = client
      ? ((client as unknown as { device?: { id: string; siteCode: string } }).device ?? null)
      : null;
    if (!device) return callback(null); // the server's own publishes (live views)
    options.onPublish(device, packet.topic, packet.payload as Buffer).then(
      () => callback(null),
      (err: Error) => callback(err),
    );
  };
  // Devices publish; they do not read other sites' data.
  aedes.authorizeSubscribe = (client, subscription, callback) => {
    const device = (client as unknown as { device?: { siteCode: string } }).device;
    if (device && subscription.topic.startsWith(`tallyrun/${device.siteCode}/`)) return callback(null, subscription);
    callback(new Error('subscriptions are not allowed'), null);
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
    disconnect(username: string) {
      const clients = (
        aedes as unknown as { clients: Record<string, { close(): void; device?: { username?: string } }> }
      ).clients;
      for (const client of Object.values(clients)) if (client.device?.username === username) client.close();
    },
    isUp: () => server.listening && !aedes.closed,
    close: () =>
      new Promise<void>((resolve) => {
        aedes.close(() => server.close(() => resolve()));
      }),
  };
}
