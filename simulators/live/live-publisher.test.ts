import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import readline from 'node:readline';
import { scenarioTimeline } from '../scenario';
import { startLivePublisher } from './live-publisher';

const demoPassword = 'tallyrun-demo';
const root = path.resolve(__dirname, '..', '..');
const received: { siteCode: string; topic: string; payload: any }[] = [];

/** Starts the embedded broker in a child process (see test-support/broker-process.ts); resolves with its port. */
function startBroker(port = 0): Promise<{ port: number; child: ChildProcess }> {
  const child = spawn(
    path.join(root, 'node_modules', '.bin', 'tsx'),
    [path.join(__dirname, 'test-support', 'broker-process.ts'), String(port), demoPassword],
    { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] },
  );
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`broker exited with ${code}`)));
    readline.createInterface({ input: child.stdout! }).on('line', (line) => {
      const event = JSON.parse(line);
      if (event.port !== undefined) resolve({ port: event.port, child });
      else received.push(event);
    });
  });
}
const stopBroker = (child: ChildProcess) =>
  new Promise<void>((resolve) => {
    if (child.exitCode !== null) return resolve();
    child.removeAllListeners('exit');
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });

const waitFor = async (condition: () => boolean, timeoutMs: number) => {
  const until = Date.now() + timeoutMs;
  while (!condition()) {
    if (Date.now() > until) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 50));
  }
};

describe('startLivePublisher', () => {
  let broker: { port: number; child: ChildProcess } | null = null;
  afterAll(async () => {
    if (broker) await stopBroker(broker.child);
  });

  it("signs in as each site's demo device, publishes every transmitter under its own site, and carries on after a broker restart", async () => {
    broker = await startBroker();
    const logs: string[] = [];
    const publisher = startLivePublisher({
      mqttUrl: `mqtt://127.0.0.1:${broker.port}`,
      demoPassword,
      timeline: scenarioTimeline('2026-11'),
      intervalMs: 250,
      log: (l) => logs.push(l),
    });
    try {
      await publisher.connected;
      await waitFor(() => new Set(received.map((r) => r.topic)).size === 22, 10_000);
      for (const r of received) {
        expect(r.topic.startsWith(`tallyrun/${r.siteCode}/${r.siteCode}-`)).toBe(true);
        for (const reading of Array.isArray(r.payload) ? r.payload : [r.payload]) {
          expect(reading).toEqual({
            t: expect.stringMatching(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/),
            v: expect.any(Number),
            q: 'good',
          });
          expect(Date.parse(reading.t) % 250).toBe(0);
        }
      }

      // The broker goes away and comes back on the same port: the readings of the gap arrive after the reconnect.
      await stopBroker(broker.child);
      const downAt = Date.now();
      await new Promise((r) => setTimeout(r, 1000));
      received.length = 0;
      const restartingAt = Date.now();
      broker = await startBroker(broker.port);
      await waitFor(
        () => received.some((r) => !Array.isArray(r.payload) && Date.parse(r.payload.t) > downAt + 1500),
        15_000,
      );
      const backlogTimes = () =>
        received
          .filter((r) => r.topic === 'tallyrun/BPM/BPM-ST1-DP')
          .flatMap((r) =>
            (Array.isArray(r.payload) ? r.payload : [r.payload]).map((p: { t: string }) => Date.parse(p.t)),
          )
          .filter((t) => t > downAt - 250 && t < restartingAt);
      // Readings stamped while the broker was down arrive from the backlog, possibly after newer live ones.
      await waitFor(() => backlogTimes().length > 0, 15_000);
      expect(backlogTimes().length).toBeGreaterThan(0);
      expect(logs.some((l) => /broker unreachable/.test(l))).toBe(true);
    } finally {
      await publisher.stop();
    }
    expect(publisher.stats().connects).toBeGreaterThanOrEqual(4);
  }, 40_000);

  it('is refused with a wrong demo password, sends nothing, and says so once per site', async () => {
    broker = broker ?? (await startBroker());
    received.length = 0;
    const lines: string[] = [];
    const publisher = startLivePublisher({
      mqttUrl: `mqtt://127.0.0.1:${broker.port}`,
      demoPassword: 'not-the-demo-password',
      timeline: scenarioTimeline('2026-11'),
      intervalMs: 250,
      log: (l) => lines.push(l),
    });
    await new Promise((r) => setTimeout(r, 3000));
    await publisher.stop();
    expect(received).toHaveLength(0);
    expect(lines.filter((l) => /^live: KFG .*(not authorized|bad user ?name)/i.test(l))).toHaveLength(1);
  }, 15_000);
});
