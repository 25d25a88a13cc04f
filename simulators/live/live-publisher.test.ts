import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import readline from 'node:readline';
import { DEMO_SITES, DEMO_TRANSMITTERS, scenarioTimeline } from '../scenario';
import { startLivePublisher } from './live-publisher';

const demoPassword = 'tallyrun-demo';
const root = path.resolve(__dirname, '..', '..');
const siteCodes = DEMO_SITES.map((s) => s.code);
/** Every demo transmitter's topic: the catalog's 22 transmitters, one topic each. */
const allTopics = new Set(DEMO_TRANSMITTERS.map((t) => `tallyrun/${t.site.code}/${t.transmitter.tag}`));

/**
 * Deadlines below are ceilings, not sleeps: every wait ends as soon as its condition holds. They
 * are generous because the broker is a tsx child process, slow to start on a loaded 2-core machine.
 */
const CHILD_START_MS = 60_000;
const CONDITION_MS = 30_000;

interface Published {
  siteCode: string;
  topic: string;
  payload: any;
}
/** What the broker printed, in its order: sign-in attempts and published messages. */
type BrokerEvent = { signIn: string; accepted: boolean } | Published;
const events: BrokerEvent[] = [];
const isPublished = (e: BrokerEvent): e is Published => 'topic' in e;
/** The messages published since the given index of `events`. */
const publishedSince = (from: number) => events.slice(from).filter(isPublished);

/** Starts the embedded broker in a child process (see test-support/broker-process.ts); resolves with its port. */
function startBroker(port = 0): Promise<{ port: number; child: ChildProcess }> {
  const child = spawn(
    path.join(root, 'node_modules', '.bin', 'tsx'),
    [path.join(__dirname, 'test-support', 'broker-process.ts'), String(port), demoPassword],
    { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] },
  );
  return new Promise((resolve, reject) => {
    const deadline = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`the broker process did not report its port within ${CHILD_START_MS} ms`));
    }, CHILD_START_MS);
    child.once('exit', (code) => {
      clearTimeout(deadline);
      reject(new Error(`broker exited with ${code}`));
    });
    readline.createInterface({ input: child.stdout! }).on('line', (line) => {
      let event: BrokerEvent | { port: number };
      try {
        event = JSON.parse(line);
      } catch {
        return; // not JSON: not one of the helper's lines (e.g. a warning from tsx)
      }
      if ('port' in event) {
        clearTimeout(deadline);
        resolve({ port: event.port, child });
      } else if ('topic' in event || 'signIn' in event) events.push(event); // not a log line of the server code
    });
  });
}
const stopBroker = (child: ChildProcess) =>
  new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.removeAllListeners('exit');
    child.once('exit', () => resolve());
    child.kill('SIGTERM');
  });

/** Polls `condition` until it holds; fails naming `what` after `timeoutMs`. */
const waitFor = async (what: string, condition: () => boolean, timeoutMs = CONDITION_MS) => {
  const until = Date.now() + timeoutMs;
  while (!condition()) {
    if (Date.now() > until) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
};
/** Resolves as `promise` does; fails naming `what` after `timeoutMs`. */
const within = async <T>(what: string, promise: Promise<T>, timeoutMs = CONDITION_MS): Promise<T> => {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`timed out after ${timeoutMs} ms waiting for ${what}`)), timeoutMs);
  });
  try {
    return await Promise.race([promise, late]);
  } finally {
    clearTimeout(timer);
  }
};

/**
 * The publisher's clock: now, moved back to the start of the current hour (whole seconds, so ticks
 * keep their 250 ms grid). The scenario holds KFG-103's readings back from minute 40 to 45 of
 * every hour (LATE_DATA; live-schedule.test.ts covers that); a run that happened to fall there
 * would see 19 topics, not 22, for up to eight minutes. This test takes well under 40 minutes.
 */
function clockAtHourStart(): () => number {
  const hourMs = 3_600_000;
  const shiftMs = Math.floor((Date.now() % hourMs) / 1000) * 1000;
  return () => Date.now() - shiftMs;
}

describe('startLivePublisher', () => {
  let broker: { port: number; child: ChildProcess } | null = null;
  afterAll(async () => {
    if (broker) await stopBroker(broker.child);
  });

  it("signs in as each site's demo device, publishes every transmitter under its own site, and carries on after a broker restart", async () => {
    broker = await startBroker();
    const clock = clockAtHourStart();
    const logs: string[] = [];
    const publisher = startLivePublisher({
      mqttUrl: `mqtt://127.0.0.1:${broker.port}`,
      demoPassword,
      timeline: scenarioTimeline('2026-11'),
      intervalMs: 250,
      now: clock,
      log: (l) => logs.push(l),
    });
    try {
      await within('both sites to connect', publisher.connected);
      const topicsSeen = () => new Set(publishedSince(0).map((r) => r.topic));
      await waitFor('a message on every transmitter topic', () => [...allTopics].every((t) => topicsSeen().has(t)));
      // Exactly the catalog's topics: nothing else was published.
      expect(topicsSeen()).toEqual(allTopics);
      for (const r of publishedSince(0)) {
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
      const logsBeforeStop = logs.length;
      await stopBroker(broker.child);
      const downAt = clock();
      await waitFor('both sites to notice the broker has gone', () =>
        siteCodes.every((code) =>
          logs.slice(logsBeforeStop).some((l) => l.startsWith(`live: ${code} broker unreachable`)),
        ),
      );
      // Both clients are offline now, so what the next ticks stamp waits in the backlog.
      const ticksWhileDown = publisher.stats().ticks;
      await waitFor('two ticks while the broker is away', () => publisher.stats().ticks >= ticksWhileDown + 2);
      const fromEvent = events.length;
      const restartingAt = clock();
      broker = await startBroker(broker.port);
      await waitFor('a live reading stamped after the restart', () =>
        publishedSince(fromEvent).some((r) => !Array.isArray(r.payload) && Date.parse(r.payload.t) > restartingAt),
      );
      const backlogTimes = () =>
        publishedSince(fromEvent)
          .filter((r) => r.topic === 'tallyrun/BPM/BPM-ST1-DP')
          .flatMap((r) =>
            (Array.isArray(r.payload) ? r.payload : [r.payload]).map((p: { t: string }) => Date.parse(p.t)),
          )
          .filter((t) => t > downAt - 250 && t < restartingAt);
      // Readings stamped while the broker was down arrive from the backlog, possibly after newer live ones.
      await waitFor('readings stamped during the outage', () => backlogTimes().length > 0);
      expect(backlogTimes().length).toBeGreaterThan(0);
    } finally {
      await publisher.stop();
    }
    // Each site connected, then reconnected after the restart.
    expect(publisher.stats().connects).toBeGreaterThanOrEqual(2 * siteCodes.length);
  }, 240_000);

  it('is refused with a wrong demo password, sends nothing, and says so once per site', async () => {
    broker = broker ?? (await startBroker());
    const fromEvent = events.length;
    const lines: string[] = [];
    const publisher = startLivePublisher({
      mqttUrl: `mqtt://127.0.0.1:${broker.port}`,
      demoPassword: 'not-the-demo-password',
      timeline: scenarioTimeline('2026-11'),
      intervalMs: 250,
      log: (l) => lines.push(l),
    });
    const refusal = (code: string) =>
      lines.filter((l) => new RegExp(`^live: ${code} .*(not authorized|bad user ?name)`, 'i').test(l));
    const site = (code: string) => DEMO_SITES.find((s) => s.code === code)!;
    const refusedSignIns = (code: string) =>
      events.slice(fromEvent).filter((e) => 'signIn' in e && e.signIn === site(code).device.username && !e.accepted)
        .length;
    try {
      await waitFor('each site to be refused by the broker', () =>
        siteCodes.every((code) => refusedSignIns(code) >= 1),
      );
      await waitFor('the refusal to be logged for each site', () =>
        siteCodes.every((code) => refusal(code).length > 0),
      );
      await waitFor('readings to send', () => publisher.stats().ticks >= 2);
      // The one fixed wait of this file proves an absence: a second refusal logged again. mqtt.js 5
      // does not retry a refused sign-in at all, so there is no later event to wait for; were it
      // to retry, it would do so after its reconnect period (2 s, live-publisher.ts), inside this.
      await new Promise((r) => setTimeout(r, 3000));
    } finally {
      await publisher.stop();
    }
    // Nothing got in: no accepted sign-in and no message since this publisher started.
    const firstAttempt = events.findIndex((e, i) => i >= fromEvent && 'signIn' in e);
    expect(events.slice(firstAttempt).filter((e) => 'signIn' in e && e.accepted)).toHaveLength(0);
    expect(publishedSince(firstAttempt)).toHaveLength(0);
    for (const code of siteCodes) expect(refusal(code)).toHaveLength(1);
  }, 180_000);
});
