/**
 * Test helper: the server's embedded broker in a process of its own (aedes is an ES module that
 * jest's CommonJS runtime cannot load). Signs in the demo devices with `${demoPassword}-device`
 * and prints one JSON line per event on stdout: { port } once listening, then
 * { signIn: username, accepted } per sign-in attempt and { siteCode, topic, payload } per
 * published message. The sign-in lines let a test wait for a refused client's retry instead of
 * sleeping for a guessed time.
 * Usage: tsx broker-process.ts <port> <demoPassword>
 */
import { startEmbeddedBroker } from '../../../server/ingest/broker';
import { DEMO_SITES, demoDevicePassword } from '../../scenario';

const [portArg, demoPassword] = process.argv.slice(2);
const emit = (event: object) => process.stdout.write(`${JSON.stringify(event)}\n`);
startEmbeddedBroker({
  host: '127.0.0.1',
  port: Number(portArg ?? 0),
  authenticate: async (username, password) => {
    const site = DEMO_SITES.find((s) => s.device.username === username);
    const accepted = Boolean(site) && password === demoDevicePassword(demoPassword);
    emit({ signIn: username, accepted });
    return site && accepted ? { id: username, siteCode: site.code } : null;
  },
  onPublish: async (device, topic, payload) => {
    emit({ siteCode: device.siteCode, topic, payload: JSON.parse(payload.toString('utf8')) });
  },
}).then(
  (broker) => {
    emit({ port: broker.port });
    process.on('SIGTERM', () => void broker.close().then(() => process.exit(0)));
  },
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
