import os from 'node:os';
import mqtt from 'mqtt';
import type { IngestOutcome } from './mqtt-ingest';

/**
 * Ingest from an external MQTT broker (MQTT_URL) instead of the embedded one: Tallyrun
 * subscribes to `tallyrun/#` at QoS 1 and acknowledges each message only after its readings are
 * committed (mqtt.js sends PUBACK when `handleMessage` calls back), so the broker redelivers
 * anything not stored. The external broker authenticates the devices and keeps each to its own
 * site's topics (its ACLs); here the site is taken from the topic. With MQTT_SHARED_GROUP set (an
 * MQTT 5 broker such as Mosquitto 2), several Tallyrun processes split the load through
 * `$share/<group>/tallyrun/#`.
 *
 * The session is persistent (clean start off, a session expiry) under a client id that is stable
 * across restarts and unique per process: a message handed to a process that dies before its
 * PUBACK stays in that process's session at the broker and is delivered again when the same
 * client id comes back (Mosquitto 2.0 does not hand it to another member of the group). A
 * redelivered message whose readings were already committed is a silent duplicate for the writer.
 */
export async function startExternalBrokerIngest(options: {
  url: string;
  sharedGroup?: string;
  /** Stable across restarts, different for every process of the group (MQTT_CLIENT_ID). */
  clientId?: string;
  /** How long the broker keeps the session while this process is away, s (MQTT 5 only). */
  sessionExpiryS?: number;
  ingest: (device: null, topic: string, payload: Buffer) => Promise<IngestOutcome>;
}) {
  const shared = Boolean(options.sharedGroup);
  const client = mqtt.connect(options.url, {
    protocolVersion: shared ? 5 : 4,
    clean: false, // a persistent session keeps QoS 1 messages while Tallyrun restarts
    // MQTT 5 ends a session when the connection closes unless it is given an expiry.
    ...(shared ? { properties: { sessionExpiryInterval: options.sessionExpiryS ?? 86_400 } } : {}),
    clientId: options.clientId ?? `tallyrun-ingest-${os.hostname()}`,
    reconnectPeriod: 2000,
  });
  client.handleMessage = (packet, done) => {
    if (packet.cmd !== 'publish') return done();
    options.ingest(null, packet.topic, packet.payload as Buffer).then(
      () => done(),
      (err: Error) => done(err), // not acknowledged: the broker sends it again
    );
  };
  const topic = shared ? `$share/${options.sharedGroup}/tallyrun/#` : 'tallyrun/#';
  await new Promise<void>((resolve, reject) => {
    client.once('connect', () => client.subscribe(topic, { qos: 1 }, (err) => (err ? reject(err) : resolve())));
    client.once('error', reject);
  });
  return {
    isUp: () => client.connected,
    close: () => new Promise<void>((resolve) => client.end(false, {}, () => resolve())),
  };
}
