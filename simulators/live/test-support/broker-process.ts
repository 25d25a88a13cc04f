/**
 * Test helper: the server's embedded broker in a process of its own (aedes is an ES module that
 * jest's CommonJS runtime cannot load). Signs in the demo devices with `${demoPassword}-device`
 * and prints one JSON line per event on stdout: { port } once listening, then
 * { siteCode, topic, payload } per published message.
 * Usage: tsx broker-process.ts <port> <demoPassword>
 */
import { startEmbeddedBroker } from '../../../server/ingest/broker';
import { DEMO_SITES, demoDevicePassword } from '../../scenario';

const [portArg, demoPassword] = process.argv.slice(2);
startEmbeddedBroker({
  host: '127.0.0.1',
  port: Number(portArg ?? 0),
  authenticate: async (username, password) => {
    const site = DEMO_SITES.find((s) => s.device.username === username);
    return site && password === demoDevicePassword(demoPassword) ? { id: username, siteCode: site.code } : null;
  },
  onPublish: async (device, topic, payload) => {
    process.stdout.write(
      `${JSON.stringify({ siteCode: device.siteCode, topic, payload: JSON.parse(payload.toString('utf8')) })}\n`,
    );
  },
}).then(
  (broker) => {
    process.stdout.write(`${JSON.stringify({ port: broker.port })}\n`);
    process.on('SIGTERM', () => void broker.close().then(() => process.exit(0)));
  },
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
