/**
 * Live mode: publishes every demo transmitter's current reading over MQTT every few seconds,
 * signed in as the site's demo device (one connection per site; MQTT 3.1.1, QoS 1, topic
 * tallyrun/<site code>/<tag>, payload { t, v, q } or an array of them). What to send comes from
 * LiveSchedule (including the scenario's late block).
 *
 * While the broker is away the messages wait in a bounded backlog and go out, in order, when
 * the client has reconnected (mqtt.js reconnects by itself).
 */
import mqtt, { type MqttClient } from 'mqtt';
import {
  DEMO_SITES,
  DEMO_TRANSMITTERS,
  demoDevicePassword,
  type ScenarioSite,
  type ScenarioTimeline,
} from '../scenario';
import { LiveSchedule, type LiveMessage } from './live-schedule';

export interface LivePublisherOptions {
  mqttUrl: string;
  demoPassword: string;
  timeline: ScenarioTimeline;
  /** Time between readings of a transmitter, ms (default 5000). */
  intervalMs?: number;
  /** Clock (default Date.now). */
  now?: () => number;
  log?: (line: string) => void;
  /** Most messages a site keeps while the broker is away (default: an hour of readings). */
  backlogLimit?: number;
  /** Sites to publish (default both demo sites). */
  siteCodes?: string[];
}

export interface LiveStats {
  ticks: number;
  messages: number;
  readings: number;
  lateReadings: number;
  dropped: number;
  connects: number;
}

export interface LivePublisher {
  stats(): LiveStats;
  /** Resolves once every site's client has connected the first time. */
  connected: Promise<void>;
  /** Sends what is held back, then disconnects. */
  stop(): Promise<void>;
}

interface SiteChannel {
  site: ScenarioSite;
  client: MqttClient;
  pending: LiveMessage[];
  lastError: string | null;
}

/** A stall of the event loop is caught up to at most this many ticks. */
const MAX_CATCH_UP_TICKS = 720;

/**
 * @param options broker URL, demo password (the devices' password derives from it), timeline
 * @returns the running publisher
 */
export function startLivePublisher(options: LivePublisherOptions): LivePublisher {
  const intervalMs = options.intervalMs ?? 5000;
  const now = options.now ?? Date.now;
  const log = options.log ?? ((line: string) => console.log(`[simulators] ${line}`));
  const sites = DEMO_SITES.filter((s) => !options.siteCodes || options.siteCodes.includes(s.code));
  const transmitters = DEMO_TRANSMITTERS.filter((t) => sites.includes(t.site)).map((t) => ({
    siteCode: t.site.code,
    tag: t.transmitter.tag,
  }));
  const backlogLimit = options.backlogLimit ?? Math.ceil(3_600_000 / intervalMs) * transmitters.length;
  const stats: LiveStats = { ticks: 0, messages: 0, readings: 0, lateReadings: 0, dropped: 0, connects: 0 };
  const schedule = new LiveSchedule(options.timeline, transmitters);
  const password = demoDevicePassword(options.demoPassword);

  const channels = new Map<string, SiteChannel>();
  for (const site of sites) {
    const client = mqtt.connect(options.mqttUrl, {
      protocolVersion: 4,
      username: site.device.username,
      password,
      clientId: `${site.device.username}-${process.pid}-${Math.random().toString(16).slice(2, 8)}`,
      clean: true,
      reconnectPeriod: 2000,
      connectTimeout: 10_000,
    });
    const channel: SiteChannel = { site, client, pending: [], lastError: null };
    client.on('connect', () => {
      stats.connects++;
      channel.lastError = null;
      log(`live: ${site.code} connected to ${options.mqttUrl} as ${site.device.username}`);
      flush(channel);
    });
    client.on('error', (err) => {
      // Say it once per kind: a broker outage repeats the same error on every reconnect attempt.
      const refused = /bad user ?name or password|not authorized/i.test(err.message);
      const hint = refused ? ` (is the demo scenario seeded, and is TALLYRUN_DEMO_PASSWORD the server's?)` : '';
      if (channel.lastError !== err.message) log(`live: ${site.code} ${err.message}${hint}`);
      channel.lastError = err.message;
    });
    client.on('offline', () => log(`live: ${site.code} broker unreachable, keeping readings until it is back`));
    channels.set(site.code, channel);
  }
  const connected = Promise.all(
    [...channels.values()].map((c) => new Promise<void>((resolve) => c.client.once('connect', () => resolve()))),
  ).then(() => undefined);

  function enqueue(messages: LiveMessage[]) {
    for (const m of messages) {
      const channel = channels.get(m.siteCode)!;
      channel.pending.push(m);
      while (channel.pending.length > backlogLimit) stats.dropped += channel.pending.shift()!.readings;
    }
  }

  function flush(channel: SiteChannel) {
    if (!channel.client.connected) return;
    const messages = channel.pending;
    channel.pending = [];
    for (const m of messages) {
      channel.client.publish(m.topic, JSON.stringify(m.payload), { qos: 1 }, (err) => {
        if (err && channel.lastError !== err.message) {
          channel.lastError = err.message;
          log(`live: ${channel.site.code} publish failed: ${err.message}`);
        }
      });
      stats.messages++;
      stats.readings += m.readings;
      if (m.late) stats.lateReadings += m.readings;
    }
  }

  let lastTickMs = Math.floor(now() / intervalMs) * intervalMs - intervalMs;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let stopped = false;
  const next = () => {
    if (stopped) return;
    // Ticks land on whole multiples of the interval (e.g. :00, :05, ...), a little after them.
    timer = setTimeout(
      () => {
        const dueMs = Math.floor(now() / intervalMs) * intervalMs;
        const firstMs = Math.max(lastTickMs + intervalMs, dueMs - (MAX_CATCH_UP_TICKS - 1) * intervalMs);
        for (let t = firstMs; t <= dueMs; t += intervalMs) {
          stats.ticks++;
          enqueue(schedule.tick(t));
        }
        if (dueMs > lastTickMs) lastTickMs = dueMs;
        for (const channel of channels.values()) flush(channel);
        next();
      },
      intervalMs - (now() % intervalMs) + 20,
    );
  };
  next();

  return {
    stats: () => ({ ...stats }),
    connected,
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      enqueue(schedule.release(Infinity));
      for (const channel of channels.values()) {
        flush(channel);
        const unsent = channel.pending.reduce((n, m) => n + m.readings, 0);
        if (unsent) log(`live: ${channel.site.code} stopping with ${unsent} readings unsent (not connected)`);
      }
      await Promise.all(
        [...channels.values()].map(
          (c) =>
            new Promise<void>((resolve) => {
              // Wait for the QoS 1 acknowledgements of what was just sent, but not for ever.
              const force = setTimeout(() => c.client.end(true, () => resolve()), 3000);
              c.client.end(false, () => {
                clearTimeout(force);
                resolve();
              });
            }),
        ),
      );
    },
  };
}
