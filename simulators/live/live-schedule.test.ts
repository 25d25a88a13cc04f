import { DEMO_TRANSMITTERS, scenarioTimeline } from '../scenario';
import { LiveSchedule, type LiveReading } from './live-schedule';

const timeline = scenarioTimeline('2026-11');
const all = DEMO_TRANSMITTERS.map((t) => ({ siteCode: t.site.code, tag: t.transmitter.tag }));
const at = (iso: string) => Date.parse(iso);

describe('LiveSchedule', () => {
  it('sends one reading per transmitter per tick, as { t, v, q } with an ISO 8601 Z time, on tallyrun/<site>/<tag>', () => {
    const messages = new LiveSchedule(timeline, all).tick(at('2026-12-02T10:10:05Z'));
    expect(messages).toHaveLength(22);
    const dp = messages.find((m) => m.topic === 'tallyrun/KFG/KFG-101-DPH')!;
    expect(dp.payload).toEqual({ t: '2026-12-02T10:10:05.000Z', v: expect.any(Number), q: 'good' });
    expect(messages.filter((m) => m.topic.startsWith('tallyrun/BPM/BPM-'))).toHaveLength(9);
  });

  it('holds KFG-103 from minute 40 to 45 and sends the block at minute 48, newest first, after newer readings went out', () => {
    const schedule = new LiveSchedule(timeline, all);
    const sentTimes: string[] = [];
    let lateBlock: LiveReading[] | null = null;
    for (let t = at('2026-12-02T10:39:00Z'); t <= at('2026-12-02T10:49:00Z'); t += 5000) {
      for (const m of schedule.tick(t)) {
        if (m.topic !== 'tallyrun/KFG/KFG-103-DP') continue;
        if (m.late) lateBlock = m.payload as LiveReading[];
        else sentTimes.push((m.payload as LiveReading).t);
        if (m.late) expect(t).toBe(at('2026-12-02T10:48:00Z'));
      }
    }
    expect(sentTimes.some((t) => t >= '2026-12-02T10:40' && t < '2026-12-02T10:45')).toBe(false);
    expect(sentTimes).toContain('2026-12-02T10:47:55.000Z'); // newer readings went out before the block
    expect(lateBlock).toHaveLength(60); // 5 minutes at 5 s
    expect(lateBlock![0].t).toBe('2026-12-02T10:44:55.000Z');
    expect(lateBlock![59].t).toBe('2026-12-02T10:40:00.000Z');
  });

  it('releases everything held at once when asked to (a stop)', () => {
    const schedule = new LiveSchedule(timeline, all);
    schedule.tick(at('2026-12-02T10:41:00Z'));
    expect(schedule.heldCount()).toBe(3);
    const released = schedule.release(Infinity);
    expect(released.map((m) => m.topic).sort()).toEqual([
      'tallyrun/KFG/KFG-103-DP',
      'tallyrun/KFG/KFG-103-PT',
      'tallyrun/KFG/KFG-103-TT',
    ]);
    expect(schedule.heldCount()).toBe(0);
  });

  it("sends nothing for KFG-103 during the demo month's dropout", () => {
    const messages = new LiveSchedule(timeline, all).tick(timeline.dropout.fromMs + 60_000);
    expect(messages.filter((m) => m.topic.includes('KFG-103'))).toHaveLength(0);
    expect(messages).toHaveLength(19);
  });
});
