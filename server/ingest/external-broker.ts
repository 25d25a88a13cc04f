import os from 'node:os';
import mqtt from 'mqtt';
import type { IngestOutcome } from './mqtt-ingest';

/**
 * Ingest from an external MQTT broker (MQTT_URL) instead of the embedded one: Tallyrun
 * subscribes to `tallyrun/#` at QoS 1 and acknowledges each message only after its readings are
 * committed (mqtt.js sends PUBACK when `handleMessage` calls back), so the broker redelivers
 * anything not stored. The external
 * broker authenticates the devices; here the site is taken from the topic. With
 * MQTT_SHARED_GROUP set (an MQTT 5 broker such as Mosquitto 2), several Tallyrun processes
 * split the load through `$share/<group>/tallyrun/#`.
 */
export async function startExternalBrokerIngest(options: {
  url: string;
  sharedGroup?: string;
  ingest: (device: null, topic: string, payload: Buffer) => Promise<IngestOutcome>;
}) {
  const shared = Boolean(options.sharedGroup);
  const client = mqtt.connect(options.url, {
    protocolVersion: shared ? 5 : 4,
    clean: false, // a persistent session keeps QoS 1 messages while Tallyrun restarts
    // Stable across restarts so the broker keeps this session's queued messages for it.
    clientId: `tallyrun-ingest-${os.hostname()}`,
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
