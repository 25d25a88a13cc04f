/**
 * Test helper: a plain MQTT broker (aedes, any credentials, nothing stored) in a process of its
 * own — aedes is an ES module that jest's CommonJS runtime cannot load. It stands in for an
 * external broker. Prints `{ "port": n }` once listening; stops on SIGTERM.
 */
import { startEmbeddedBroker } from '../ingest/broker';

startEmbeddedBroker({
  host: '127.0.0.1',
  port: 0,
  authenticate: async (username) => ({ id: username, siteCode: '*' }),
  onPublish: async () => undefined,
}).then(
  (broker) => {
    // Any device may subscribe to anything on this stand-in.
    broker.aedes.authorizeSubscribe = (_client, subscription, callback) => callback(null, subscription);
    // ... and publish anywhere: the site rules are the embedded broker's, not an external one's.
    broker.aedes.authorizePublish = (_client, _packet, callback) => callback(null);
    process.stdout.write(`${JSON.stringify({ port: broker.port })}\n`);
    process.on('SIGTERM', () => void broker.close().then(() => process.exit(0)));
  },
  (err) => {
    // Not the logger: it writes to stdout, where the parent reads the port line.
    process.stderr.write(
      `the plain broker could not start: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}\n`,
    );
    process.exit(1);
  },
);
