/**
 * What the live publisher sends at each tick: every transmitter's reading for that instant,
 * except the scenario's late block, which is held and sent later, newest first (late and out of
 * order). Pure apart from the held readings it keeps between ticks; no clock, no network.
 */
import type { ScenarioTimeline } from '../scenario';
import { lateReleaseMs } from '../model/late-delivery';
import { transmitterValueAt } from '../model/transmitter-value';

export interface LiveReading {
  t: string;
  v: number;
  q: 'good';
}

export interface LiveMessage {
  siteCode: string;
  topic: string;
  /** One reading as an object, a late block as an array. */
  payload: LiveReading | LiveReading[];
  readings: number;
  late: boolean;
}

interface Held {
  siteCode: string;
  tag: string;
  releaseMs: number;
  timeMs: number;
  reading: LiveReading;
}

export class LiveSchedule {
  private held: Held[] = [];

  /**
   * @param timeline the scenario's instants
   * @param transmitters the transmitters to publish, with their site codes
   */
  constructor(
    private readonly timeline: ScenarioTimeline,
    private readonly transmitters: readonly { siteCode: string; tag: string }[],
  ) {}

  /**
   * @param tickMs the instant of this round of readings, epoch ms
   * @returns the messages to send now, in order
   */
  tick(tickMs: number): LiveMessage[] {
    const messages: LiveMessage[] = [];
    for (const { siteCode, tag } of this.transmitters) {
      const value = transmitterValueAt(tag, tickMs, this.timeline);
      if (value === null) continue;
      const reading: LiveReading = { t: new Date(tickMs).toISOString(), v: value, q: 'good' };
      const releaseMs = lateReleaseMs(tag, tickMs);
      if (releaseMs !== null && releaseMs > tickMs)
        this.held.push({ siteCode, tag, releaseMs, timeMs: tickMs, reading });
      else
        messages.push({ siteCode, topic: `tallyrun/${siteCode}/${tag}`, payload: reading, readings: 1, late: false });
    }
    return [...messages, ...this.release(tickMs)];
  }

  /**
   * The held readings due by an instant (all of them for Infinity, e.g. on stop), one array per
   * transmitter, newest first.
   * @param atMs epoch ms
   * @returns messages
   */
  release(atMs: number): LiveMessage[] {
    const due = this.held.filter((h) => h.releaseMs <= atMs);
    if (!due.length) return [];
    this.held = this.held.filter((h) => h.releaseMs > atMs);
    const messages: LiveMessage[] = [];
    for (const tag of new Set(due.map((h) => h.tag))) {
      const block = due.filter((h) => h.tag === tag).sort((a, b) => b.timeMs - a.timeMs);
      messages.push({
        siteCode: block[0].siteCode,
        topic: `tallyrun/${block[0].siteCode}/${tag}`,
        payload: block.map((h) => h.reading),
        readings: block.length,
        late: true,
      });
    }
    return messages;
  }

  /** Readings held back now. */
  heldCount(): number {
    return this.held.length;
  }
}
