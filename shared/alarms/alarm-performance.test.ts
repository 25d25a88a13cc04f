import { alarmPerformance, groupConsequential, GROUP_WINDOW_MS } from './alarm-performance';

/**
 * Expected values are worked by hand from the rules written in alarm-performance.ts (ISA-18.2-2016
 * definitions as remembered: 10-minute periods, flood > 10 per 10 min, chattering ≥ 3 in 1 min,
 * stale > 24 h); none is read back from the code's own output.
 */
const at = (iso: string) => new Date(iso);
const MIN = 60_000;

describe('groupConsequential', () => {
  it('puts alarms of one site and one family raised within two minutes of the first-out under it', () => {
    const g = groupConsequential([
      { id: '3', siteId: '1', condition: 'stale', raisedAt: at('2026-11-05T06:01:00Z') },
      { id: '1', siteId: '1', condition: 'stale', raisedAt: at('2026-11-05T06:00:00Z') },
      { id: '2', siteId: '1', condition: 'bad-quality', raisedAt: at('2026-11-05T06:02:00Z') }, // exactly 2 min: joins
      { id: '4', siteId: '1', condition: 'frozen', raisedAt: at('2026-11-05T06:00:30Z') }, // another family
      { id: '5', siteId: '2', condition: 'stale', raisedAt: at('2026-11-05T06:00:30Z') }, // another site
      { id: '6', siteId: '1', condition: 'stale', raisedAt: at('2026-11-05T06:02:01Z') }, // 2 min 1 s: a new group
    ]);
    expect(g.get('1')).toEqual({ groupId: '1', firstOutId: null, consequentialCount: 2 });
    expect(g.get('3')).toEqual({ groupId: '1', firstOutId: '1', consequentialCount: 0 });
    expect(g.get('2')).toEqual({ groupId: '1', firstOutId: '1', consequentialCount: 0 });
    expect(g.get('4')).toEqual({ groupId: '4', firstOutId: null, consequentialCount: 0 });
    expect(g.get('5')).toEqual({ groupId: '5', firstOutId: null, consequentialCount: 0 });
    expect(g.get('6')).toEqual({ groupId: '6', firstOutId: null, consequentialCount: 0 });
    expect(GROUP_WINDOW_MS).toBe(2 * MIN);
  });

  it('breaks a tie in raise time by the lower id', () => {
    const g = groupConsequential([
      { id: '11', siteId: '1', condition: 'stale', raisedAt: at('2026-11-05T06:00:00Z') },
      { id: '9', siteId: '1', condition: 'stale', raisedAt: at('2026-11-05T06:00:00Z') },
    ]);
    expect(g.get('9')!.firstOutId).toBeNull();
    expect(g.get('11')!.firstOutId).toBe('9');
  });
});

describe('alarmPerformance', () => {
  const fromMs = Date.parse('2026-11-01T00:00:00Z');
  const toMs = Date.parse('2026-11-02T00:00:00Z'); // one day: 144 periods of 10 min
  const base = { fromMs, toMs, operatorPositions: 1, occurrences: [], nowMs: toMs + 1 };

  it('counts rates, floods and chattering over 10-minute periods of the month', () => {
    const annunciations = [
      // point A: 3 within 59 s (chattering), point B: 8 a minute apart (not chattering) — 11 in 00:00–00:10
      ...[0, 30_000, 59_000].map((d) => ({ pointKey: 'A', atMs: fromMs + d })),
      ...[1, 2, 3, 4, 5, 6, 7, 8].map((m) => ({ pointKey: 'B', atMs: fromMs + m * MIN })),
      // point C: 3 spanning exactly 60 s, which is not within one minute; in the 00:10–00:20 period
      ...[10, 10.5, 11].map((m) => ({ pointKey: 'C', atMs: fromMs + m * MIN })),
      { pointKey: 'D', atMs: toMs }, // the end is outside
    ];
    const r = alarmPerformance({ ...base, annunciations });
    expect(r.periods).toBe(144);
    expect(r.annunciations).toBe(14);
    expect(r.averagePer10MinPerOperator).toBeCloseTo(14 / 144, 12);
    expect(r.peakPer10MinPerOperator).toBe(11);
    expect(r.floodPeriods).toBe(1);
    expect(r.floodPercentOfTime).toBeCloseTo(100 / 144, 12);
    expect(r.chattering).toEqual([{ pointKey: 'A', raises: 3, mostInOneMinute: 3 }]);
    expect(r.topTen.map((t) => [t.pointKey, t.raises])).toEqual([
      ['B', 8],
      ['A', 3],
      ['C', 3],
    ]);
    expect(r.topTenSharePercent).toBeCloseTo(100, 12);
  });

  it('divides the rates among operator positions, so 11 alarms for two operators is no flood', () => {
    const annunciations = Array.from({ length: 11 }, (_, i) => ({ pointKey: `P${i}`, atMs: fromMs + i * 30_000 }));
    const r = alarmPerformance({ ...base, operatorPositions: 2, annunciations });
    expect(r.peakPer10MinPerOperator).toBe(5.5);
    expect(r.floodPeriods).toBe(0);
  });

  it('finds alarms active more than 24 hours, measuring an open one to now inside the month', () => {
    const h = 3_600_000;
    const r = alarmPerformance({
      ...base,
      toMs: fromMs + 30 * 24 * h,
      nowMs: fromMs + 26 * h,
      annunciations: [],
      occurrences: [
        { id: '1', pointKey: 'A', raisedMs: fromMs, clearedMs: fromMs + 24 * h }, // exactly 24 h: not stale
        { id: '2', pointKey: 'B', raisedMs: fromMs, clearedMs: fromMs + 25 * h },
        { id: '3', pointKey: 'C', raisedMs: fromMs + h, clearedMs: null }, // open for 25 h by now
        { id: '4', pointKey: 'D', raisedMs: fromMs + 3 * h, clearedMs: null }, // open for 23 h
      ],
    });
    expect(r.stale.map((s) => [s.id, s.activeMs / h])).toEqual([
      ['2', 25],
      ['3', 25],
    ]);
  });

  it('refuses a period that does not end after it starts, or no operator', () => {
    expect(() => alarmPerformance({ ...base, toMs: fromMs, annunciations: [] })).toThrow(/end after/);
    expect(() => alarmPerformance({ ...base, operatorPositions: 0, annunciations: [] })).toThrow(/operatorPositions/);
  });
});
