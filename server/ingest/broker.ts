import net from 'node:net';
import type { AddressInfo } from 'node:net';
import type { Aedes, Client as AedesClient } from 'aedes';
import { ConnectionLane, Slots } from './publish-pipeline';

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

/** Where refused publishes are re-addressed: a `$` topic, which no wildcard matches, never delivered. */
const refusedTopic = '$tallyrun/refused';
/** Where aedes sends a pipelined publish once handed to the writer: heard by nobody (see below). */
const pipelinedTopic = '$tallyrun/refused/pipelined';

/** A PUBACK (MQTT 3.1.1 §3.4): fixed header 0x40, remaining length 2, the packet identifier. */
const pubackOf = (messageId: number) => Buffer.from([0x40, 0x02, messageId >> 8, messageId & 0xff]);

type SignedIn = { id: string; siteCode: string; username: string };
const deviceOf = (client: object): SignedIn | null => (client as { device?: SignedIn }).device ?? null;

/** Whether a topic lies under `tallyrun/<site code>/`. */
export function withinSite(siteCode: string, topic: string): boolean {
  return topic.startsWith(`tallyrun/${siteCode}/`) && topic.length > `tallyrun/${siteCode}/`.length;
}

/**
 * A subscription filter narrowed to one site: the filter itself when every topic it matches is
 * the site's, `tallyrun/<site>/…` when it is a wildcard over sites that includes this one, or
 * null when it reaches nothing of the site (refused).
 */
export function narrowToSite(siteCode: string, filter: string): string | null {
  const levels = filter.split('/');
  if (levels[0] === '#') return `tallyrun/${siteCode}/#`;
  if (levels[0] !== 'tallyrun' && levels[0] !== '+') return null;
  if (levels.length < 2) return null;
  if (levels[1] === '#') return `tallyrun/${siteCode}/#`;
  if (levels[1] !== siteCode && levels[1] !== '+') return null;
  if (levels.length < 3) return null;
  return ['tallyrun', siteCode, ...levels.slice(2)].join('/');
}

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
 * password" before it can publish. Each device stays inside its own site's topics (issue 12 §2):
 * publish, subscribe, last will and client id are all judged by the device's site.
 */
export async function startEmbeddedBroker(options: {
  host: string;
  port: number;
  authenticate: DeviceAuthenticator;
  onPublish: PublishHandler;
  /** Messages between arrival and acknowledgement: per connection and overall (back-pressure). */
  window?: { perConnection: number; overall: number };
}): Promise<EmbeddedBroker> {
  // aedes 1.x ships as an ES module only; a dynamic import keeps this file loadable from CommonJS.
  const { Aedes } = await import('aedes');
  const aedes = await Aedes.createBroker({ id: 'tallyrun' });

  // Client ids are bound to the device that uses them (issue 12 §2): a client id belongs to the
  // first device that connects with it, for as long as the broker runs (its sessions live in the
  // broker's memory just as long). Another device presenting it is refused with "identifier
  // rejected" (return code 2) instead of taking over, so it can neither disconnect the owner nor
  // pick up its session. A clean session that ends gives its id back 10 s later, when no connection
  // holds it (persistent sessions keep theirs: the map grows by one entry per such client id).
  const clientIdOwners = new Map<string, string>();
  const liveClients = () => (aedes as unknown as { clients: Record<string, object> }).clients;
  aedes.on('clientDisconnect', (client) => {
    if (!client.clean) return;
    // Later, and only if no connection holds the id by then: a device that reconnects with its
    // own id closes its old connection first, and the id must not be free in between.
    const id = client.id;
    setTimeout(() => {
      if (!liveClients()[id]) clientIdOwners.delete(id);
    }, 10_000).unref();
  });

  aedes.authenticate = (client, username, password, done) => {
    const refuse = (returnCode: 2 | 4 | 5, message: string) => {
      const err = Object.assign(new Error(message), { returnCode });
      done(err, false);
    };
    const fail = () => refuse(4, 'Bad user name or password');
    if (!username || !password) return fail();
    options
      .authenticate(username, password.toString('utf8'))
      .then((device) => {
        if (!device) return fail();
        const holder = liveClients()[client.id];
        const owner = clientIdOwners.get(client.id) ?? (holder ? deviceOf(holder)?.username : undefined);
        if (owner !== undefined && owner !== username) return refuse(2, 'client id belongs to another device');
        // A last will is a publish made later on the device's behalf: it must stay inside the
        // device's own site like any other, and is never retained.
        const will = (client as unknown as { _will?: { topic: string; retain?: boolean } | null })._will;
        if (will && !withinSite(device.siteCode, will.topic)) return refuse(5, 'will topic outside the device site');
        if (will) will.retain = false;
        clientIdOwners.set(client.id, username);
        (client as unknown as { device: unknown }).device = { ...device, username };
        done(null, true);
      })
      // The check could not be made (the database is unreachable): "server unavailable" (3), not
      // "bad user name or password", so the device keeps its credentials and tries again.
      .catch(() => done(Object.assign(new Error('Server unavailable'), { returnCode: 3 as const }), false));
  };

  // Storing happens before the device is acknowledged: an acknowledged reading is a committed
  // reading. QoS 0 and 1 publishes of devices go through the ordered pipeline of
  // publish-pipeline.ts (the argument is there): several of one connection's messages are in
  // flight to the writer at once, each PUBACK is written only after its own commit and in arrival
  // order, and a full window holds the packet flow (back-pressure). QoS 2 keeps aedes' own flow,
  // answered after the commit. A database failure acknowledges nothing: the connection closes and
  // the device sends the message again.
  //
  // A publish outside the device's own site (issue 12 §2) is refused by being dropped, not by an
  // error: MQTT 3.1.1 has no negative PUBACK, and an error makes aedes close the connection, so a
  // QoS 1 device would resend the same message after every reconnect and never get past it. The
  // message is counted as a rejection for the device (the ingest path records why), acknowledged,
  // and never forwarded (re-addressed to a topic nobody can subscribe to and that authorizeForward
  // never delivers). Retained messages are not kept: the retain flag is cleared on every publish.
  const overall = new Slots(options.window?.overall ?? 4096);
  const perConnection = options.window?.perConnection ?? 256;
  const lanes = new WeakMap<object, ConnectionLane>();
  const laneOf = (client: AedesClient) => {
    let lane = lanes.get(client);
    if (!lane) {
      const made = new ConnectionLane(perConnection, overall, () => client.close());
      client.conn.once('close', () => made.closing());
      lanes.set(client, made);
      lane = made;
    }
    return lane;
  };
  aedes.authorizePublish = (client, packet, callback) => {
    packet.retain = false;
    const device = client ? deviceOf(client) : null;
    if (!client || !device) return callback(null); // the server's own publishes (live views)
    const inside = withinSite(device.siteCode, packet.topic);
    if (packet.qos === 2) {
      options.onPublish(device, packet.topic, packet.payload as Buffer).then(
        () => {
          if (!inside) packet.topic = refusedTopic;
          callback(null);
        },
        (err: Error) => callback(err),
      );
      return;
    }
    const { topic, payload, qos, messageId } = packet;
    laneOf(client).admit(
      () => {
        const stored = options.onPublish(device, topic, payload as Buffer);
        // aedes goes on at once: no PUBACK from it, nothing forwarded (both come in the message's turn).
        packet.qos = 0;
        packet.topic = pipelinedTopic;
        callback(null);
        return stored;
      },
      () => {
        if (qos === 1 && messageId !== undefined && client.conn.writable) client.conn.write(pubackOf(messageId));
        if (inside) aedes.publish({ cmd: 'publish', topic, payload, qos, retain: false, dup: false }, () => undefined);
      },
      () => callback(new Error('connection closed')),
    );
  };
  aedes.authorizeForward = (_client, packet) => (packet.topic.startsWith(refusedTopic) ? null : packet);

  // Devices read only their own site: a subscription outside it is refused (SUBACK 0x80), and a
  // wildcard that would reach other sites (`#`, `+/…`, `tallyrun/#`, `tallyrun/+/…`) is narrowed
  // to the device's own site when it covers it, refused otherwise.
  aedes.authorizeSubscribe = (client, subscription, callback) => {
    const device = client ? deviceOf(client) : null;
    if (!device) return callback(new Error('subscriptions are not allowed'), null);
    const topic = narrowToSite(device.siteCode, subscription.topic);
    callback(null, topic ? { ...subscription, topic } : null);
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
