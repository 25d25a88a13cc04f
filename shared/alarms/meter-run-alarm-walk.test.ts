import { effectiveAlarmLimits } from './alarm-limits';
import type { AlarmCondition } from './alarm-codes';
import {
  initialAlarmWalkState,
  walkMeterRunAlarms,
  type AlarmWalkInput,
  type WalkReading,
  type WalkTransmitter,
} from './meter-run-alarm-walk';

/**
 * Readings constructed by hand, one a minute; the expected raise and clear times follow from
 * the limits (DP low in range below 10 % of span with a 300 s on-delay and 60 s off-delay and a
 * 2 % deadband; the other defaults of alarm-limits.ts) and are worked out beside each check.
 */
const MIN = 60_000;
const T0 = Date.parse('2026-10-01T00:00:00Z');
const dp: WalkTransmitter = {
  id: 'dp',
  tag: 'FT-DP',
  measures: 'differential-pressure',
  stackRole: 'single',
  lowerRangeSI: 0,
  upperRangeSI: 50_000,
  accuracyPercentOfSpan: 0.075,
};
const pt: WalkTransmitter = {
  id: 'pt',
  tag: 'FT-PT',
  measures: 'static-pressure',
  stackRole: 'single',
  lowerRangeSI: 0,
  upperRangeSI: 4e6,
  accuracyPercentOfSpan: 0.075,
};

/** DP as a share of span for each minute from T0, with a little noise on P so P is never frozen. */
function minutes(
  shares: number[],
  options: { quality?: (i: number) => WalkReading['quality']; skip?: (i: number) => boolean } = {},
): WalkReading[] {
  const out: WalkReading[] = [];
  shares.forEach((share, i) => {
    if (options.skip?.(i)) return;
    const t = T0 + i * MIN;
    out.push({
      transmitterId: 'dp',
      timeMs: t,
      value: share * 50_000 + (i % 2) * 3,
      quality: options.quality?.(i) ?? 'good',
    });
    out.push({ transmitterId: 'pt', timeMs: t, value: 2e6 + (i % 3) * 100, quality: 'good' });
  });
  return out;
}

function walk(
  readings: WalkReading[],
  over: Partial<AlarmWalkInput> = {},
  overrides: Partial<Record<AlarmCondition, object>> = {},
) {
  return walkMeterRunAlarms({
    state: initialAlarmWalkState(),
    meterRunTag: 'MR-1',
    transmitters: [dp, pt],
    readings,
    hours: [],
    horizonMs: readings.length ? readings[readings.length - 1].timeMs : T0,
    limits: (c) => effectiveAlarmLimits(c, overrides[c]),
    meterRun: { maxGapS: 300, stackSwitchUpShare: 0.9, stackSwitchDownShare: 0.8 },
    ...over,
  });
}

const of = (signals: ReturnType<typeof walk>['signals'], condition: AlarmCondition) =>
  signals.filter((s) => s.condition === condition);
const repeat = (n: number, share: number) => new Array<number>(n).fill(share);

describe('walkMeterRunAlarms: DP low in range', () => {
  it('raises exactly one alarm for DP held at 5 % of span for 20 min, at onset + 300 s, and clears 60 s after DP rises', () => {
    // 10 min at 40 %, 20 min at 5 % (from 00:10), then 40 % from 00:30.
    const { signals } = walk(minutes([...repeat(10, 0.4), ...repeat(20, 0.05), ...repeat(10, 0.4)]));
    const low = of(signals, 'dp-low-in-range');
    expect(low.map((s) => [s.kind, new Date(s.timeMs).toISOString(), new Date(s.onsetMs).toISOString()])).toEqual([
      ['raise', '2026-10-01T00:15:00.000Z', '2026-10-01T00:10:00.000Z'],
      ['clear', '2026-10-01T00:31:00.000Z', '2026-10-01T00:30:00.000Z'],
    ]);
    expect(low[0].message).toMatch(/FT-DP reads 5\.0 % of its span, below 10 %/);
    expect(low[0].transmitterId).toBe('dp');
  });

  it('raises nothing new while DP chatters between 9 % and 11.5 % (inside the 10–12 % deadband) after the raise', () => {
    const chatter = Array.from({ length: 60 }, (_, i) => (i % 2 ? 0.115 : 0.09));
    const { signals } = walk(minutes([...repeat(10, 0.05), ...chatter, ...repeat(5, 0.4)]));
    expect(of(signals, 'dp-low-in-range').map((s) => s.kind)).toEqual(['raise', 'clear']);
  });

  it('raises nothing when DP crosses the limit back and forth faster than the on-delay (8 % / 15 % each minute)', () => {
    const chatter = Array.from({ length: 60 }, (_, i) => (i % 2 ? 0.15 : 0.08));
    expect(of(walk(minutes(chatter)).signals, 'dp-low-in-range')).toEqual([]);
  });

  it('raises nothing without flow (DP at zero)', () => {
    expect(of(walk(minutes(repeat(30, 0))).signals, 'dp-low-in-range')).toEqual([]);
  });

  it('uses the limits set: 20 % threshold, no on-delay', () => {
    const { signals } = walk(
      minutes([...repeat(5, 0.4), ...repeat(5, 0.15)]),
      {},
      { 'dp-low-in-range': { thresholdShareOfSpan: 0.2, onDelayS: 0 } },
    );
    expect(of(signals, 'dp-low-in-range').map((s) => new Date(s.timeMs).toISOString())).toEqual([
      '2026-10-01T00:05:00.000Z',
    ]);
  });

  it('judges each reading once: two walks over halves give what one walk gives, and a repeat walk gives nothing', () => {
    const readings = minutes([...repeat(10, 0.4), ...repeat(20, 0.05), ...repeat(10, 0.4)]);
    const whole = walk(readings);
    const cut = T0 + 17 * MIN + 30_000;
    const first = walk(readings, { horizonMs: cut });
    const second = walk(readings, { state: first.state });
    expect([...first.signals, ...second.signals]).toEqual(whole.signals);
    expect(walk(readings, { state: whole.state }).signals).toEqual([]);
  });
});

describe('walkMeterRunAlarms: stacked pair', () => {
  const lo: WalkTransmitter = { ...dp, id: 'lo', tag: 'FT-DPL', stackRole: 'low', upperRangeSI: 5_000 };
  const hi: WalkTransmitter = { ...dp, id: 'hi', tag: 'FT-DPH', stackRole: 'high', upperRangeSI: 50_000 };
  const pair = (lowPa: number[], highPa: number[]): WalkReading[] =>
    lowPa.flatMap((v, i) => [
      { transmitterId: 'lo', timeMs: T0 + i * MIN, value: v, quality: 'good' as const },
      { transmitterId: 'hi', timeMs: T0 + i * MIN, value: highPa[i], quality: 'good' as const },
    ]);

  it('alarms the low-range transmitter when it is in use below 10 % of its own span, not the high one', () => {
    // 300 Pa = 6 % of the 5 kPa low span (0.6 % of the high span, which is not in use).
    const { signals } = walk(pair(repeat(20, 300), repeat(20, 310)), { transmitters: [lo, hi] });
    expect(of(signals, 'dp-low-in-range').map((s) => [s.kind, s.transmitterId])).toEqual([['raise', 'lo']]);
  });

  it('finds the pair disagreeing in their overlap beyond 2 % of the low span (200 Pa apart on a 5 kPa span = 4 %)', () => {
    const { signals } = walk(pair(repeat(20, 3000), repeat(20, 3200)), { transmitters: [lo, hi] });
    const d = of(signals, 'stack-disagreement');
    expect(d.map((s) => [s.kind, new Date(s.timeMs).toISOString()])).toEqual([['raise', '2026-10-01T00:05:00.000Z']]);
    expect(d[0].detail.differenceShareOfLowSpan).toBeCloseTo(0.04, 12);
  });

  it('finds no disagreement within tolerance (50 Pa = 1 % of the low span)', () => {
    expect(
      of(walk(pair(repeat(20, 3000), repeat(20, 3050)), { transmitters: [lo, hi] }).signals, 'stack-disagreement'),
    ).toEqual([]);
  });
});

describe('walkMeterRunAlarms: saturated is not frozen (NAMUR NE 43 levels)', () => {
  // NE 43 [mem]: measurement up to 20.5 mA, failure at 21.0 mA; on 4–20 mA = 0–span, 20.5 mA is
  // span × (1 + 0.5/16) = 103.125 % of span, 21 mA is 106.25 %. A 0–25 inH2O transmitter saturates at
  // 25 × 1.03125 = 25.78125 inH2O (the demo's 25.7813), worked by hand, not by the code.
  const lo: WalkTransmitter = { ...dp, id: 'lo', tag: 'FT-DPL', stackRole: 'low', upperRangeSI: 6_227.1 };
  const hi: WalkTransmitter = { ...dp, id: 'hi', tag: 'FT-DPH', stackRole: 'high', upperRangeSI: 62_271 };
  const hour = (loValue: (i: number) => number, hiValue: (i: number) => number): WalkReading[] =>
    Array.from({ length: 61 }, (_, i) => [
      { transmitterId: 'lo', timeMs: T0 + i * MIN, value: loValue(i), quality: 'good' as const },
      { transmitterId: 'hi', timeMs: T0 + i * MIN, value: hiValue(i), quality: 'good' as const },
    ]).flat();

  it('raises no alarm for a stacked pair held at high flow for an hour with the low-range transmitter flat at 103.1 % of span', () => {
    // High-range one in use at 60 % of its span with a little noise; low-range one flat at its saturation limit.
    const saturated = 6_227.1 * 1.03125;
    const { signals } = walk(
      hour(
        () => saturated,
        (i) => 0.6 * 62_271 + (i % 3) * 20,
      ),
      { transmitters: [lo, hi] },
    );
    expect(signals).toEqual([]);
  });

  it('clears a frozen alarm standing on the low-range transmitter once it reads at its saturation limit', () => {
    const inSpanFlat = 0.5 * 6_227.1;
    const saturated = 6_227.1 * 1.03125;
    const readings = hour(
      (i) => (i < 40 ? inSpanFlat : saturated),
      (i) => 0.3 * 62_271 + (i % 3) * 20,
    );
    // Flat at mid-span from 00:00: frozen once a whole 30-min window is covered (00:31); saturated from
    // 00:40, which clears it at once (frozen has no off-delay by default, alarm-limits.ts).
    const frozen = of(walk(readings, { transmitters: [lo, hi] }).signals, 'frozen');
    expect(frozen.map((s) => [s.kind, s.transmitterId, new Date(s.timeMs).toISOString()])).toEqual([
      ['raise', 'lo', '2026-10-01T00:31:00.000Z'],
      ['clear', 'lo', '2026-10-01T00:40:00.000Z'],
    ]);
  });

  it('still raises frozen for a transmitter flat at mid-span', () => {
    const frozen = of(
      walk(minutes(repeat(40, 0.5)).map((r) => ({ ...r, value: r.transmitterId === 'dp' ? 25_000 : r.value }))).signals,
      'frozen',
    );
    expect(frozen.map((s) => [s.kind, s.transmitterId])).toEqual([['raise', 'dp']]);
  });

  it('finds the transmitter in use over range, not frozen, when it is flat at its saturation limit', () => {
    const { signals } = walk(
      minutes(repeat(40, 1.03125)).map((r) => ({ ...r, value: r.transmitterId === 'dp' ? 51_562.5 : r.value })),
    );
    expect(of(signals, 'frozen')).toEqual([]);
    expect(of(signals, 'dp-over-range').map((s) => [s.kind, s.transmitterId])).toEqual([['raise', 'dp']]);
  });

  it('raises bad quality for a reading at a failure level (beyond 21 mA = 106.25 % of span)', () => {
    const { signals } = walk(minutes(repeat(10, 1.07)));
    expect(of(signals, 'bad-quality').map((s) => [s.kind, s.transmitterId])).toEqual([['raise', 'dp']]);
    expect(of(signals, 'frozen')).toEqual([]);
  });
});

describe('walkMeterRunAlarms: frozen, stale, bad quality', () => {
  it('finds a transmitter frozen once a full 30-min window shows the same value: at 00:41 for a value stuck from 00:10', () => {
    const readings = minutes(repeat(60, 0.4)).map((r) => {
      const i = (r.timeMs - T0) / MIN;
      // Before 00:10 the DP varies; from 00:10 it repeats one value to the last digit.
      return r.transmitterId === 'dp' ? { ...r, value: i < 10 ? 20_000 + (i % 3) * 50 : 20_100 } : r;
    });
    const frozen = of(walk(readings).signals, 'frozen');
    // At 00:40 the window [00:10, 00:40] still starts with the 00:09 reading in force (20 000 Pa, live);
    // at 00:41 the reading in force at 00:11 is the stuck one of 00:10, so every value is 20 100 Pa.
    expect(frozen.map((s) => [s.kind, s.transmitterId, new Date(s.timeMs).toISOString()])).toEqual([
      ['raise', 'dp', '2026-10-01T00:41:00.000Z'],
    ]);
    // 31 readings in [00:11, 00:41] plus the one in force at 00:11 (00:10): 32.
    expect(frozen[0].detail).toMatchObject({ count: 32, stdDevShareOfSpan: 0 });
  });

  it('finds a 20-min gap stale from last reading + 10 min to the next reading', () => {
    const readings = minutes(repeat(40, 0.4), { skip: (i) => i > 10 && i < 31 });
    const stale = of(walk(readings).signals, 'stale').filter((s) => s.transmitterId === 'dp');
    expect(stale.map((s) => [s.kind, new Date(s.timeMs).toISOString()])).toEqual([
      ['raise', '2026-10-01T00:20:00.000Z'],
      ['clear', '2026-10-01T00:31:00.000Z'],
    ]);
  });

  it('finds a transmitter stale by the clock when it has gone silent', () => {
    const readings = minutes(repeat(10, 0.4));
    const { signals } = walk(readings, { clockMs: T0 + 60 * MIN });
    expect(of(signals, 'stale').map((s) => [s.transmitterId, new Date(s.timeMs).toISOString()])).toEqual([
      ['dp', '2026-10-01T00:19:00.000Z'],
      ['pt', '2026-10-01T00:19:00.000Z'],
    ]);
  });

  it('raises bad quality 30 s after bad readings start and clears 60 s after good ones return', () => {
    const readings = minutes(repeat(20, 0.4), { quality: (i) => (i >= 5 && i < 10 ? 'bad' : 'good') });
    expect(of(walk(readings).signals, 'bad-quality').map((s) => [s.kind, new Date(s.timeMs).toISOString()])).toEqual([
      ['raise', '2026-10-01T00:05:30.000Z'],
      ['clear', '2026-10-01T00:11:00.000Z'],
    ]);
  });

  it('raises outside-standard-limits from the hourly records and clears on the next flowing hour without the flag', () => {
    const H = 3_600_000;
    const hours = [
      { startMs: T0, endMs: T0 + H, flowTimeS: 3600, flags: [] },
      { startMs: T0 + H, endMs: T0 + 2 * H, flowTimeS: 3600, flags: ['outside-standard-limits'] },
      { startMs: T0 + 2 * H, endMs: T0 + 3 * H, flowTimeS: 0, flags: [] },
      { startMs: T0 + 3 * H, endMs: T0 + 4 * H, flowTimeS: 3600, flags: [] },
    ];
    const { signals, state } = walk([], { hours, horizonMs: T0 + 4 * H });
    expect(of(signals, 'outside-standard-limits').map((s) => [s.kind, (s.timeMs - T0) / H])).toEqual([
      ['raise', 1],
      ['clear', 3],
    ]);
    expect(state.recordsToMs).toBe(T0 + 4 * H);
  });

  it('raises nothing for a condition that is disabled', () => {
    const { signals } = walk(minutes([...repeat(20, 0.05)]), {}, { 'dp-low-in-range': { enabled: false } });
    expect(of(signals, 'dp-low-in-range')).toEqual([]);
  });
});

describe('walkMeterRunAlarms: reverse flow on a one-way meter run, judged live', () => {
  /** Ranged −50…+50 kPa: reads both ways; a reverse share is |Δp| / 50 kPa (bidir-design.md). */
  const both: WalkTransmitter = { ...dp, lowerRangeSI: -50_000 };
  const oneWay = { oneWayAt: () => true, noFlowCutoffShareAt: () => 0.005 };
  const live = (shares: number[], reverseFlow: AlarmWalkInput['reverseFlow'] = oneWay) =>
    walk(minutes(shares), { transmitters: [both, pt], reverseFlow });

  it('raises at the first reverse reading and clears at the first forward one, without waiting for the hour', () => {
    // 10 min at +40 %, 10 min at −40 % (−20 kPa), 10 min at +40 %; on- and off-delay 0 (alarm-limits.ts).
    const { signals } = live([...repeat(10, 0.4), ...repeat(10, -0.4), ...repeat(10, 0.4)]);
    const reverse = of(signals, 'reverse-flow');
    expect(reverse.map((s) => [s.kind, s.timeMs])).toEqual([
      ['raise', T0 + 10 * MIN],
      ['clear', T0 + 20 * MIN],
    ]);
    // Minute 10 is even: no noise, −20 000 Pa of a 50 000 Pa reverse side = 40 %.
    expect(reverse[0].detail).toEqual({ sinceMs: T0 + 10 * MIN, shareOfSpan: 0.4 });
    expect(reverse[0].message).toBe(
      'MR-1 is a one-way meter run and reads reverse flow since 2026-10-01T00:10:00Z (DP 40.0 % of its span below zero): it is not counted as flow.',
    );
  });

  it('raises nothing for reverse DP inside the no-flow cutoff (−0.3 % of the reverse side, cutoff 0.5 %)', () => {
    expect(of(live([...repeat(5, 0.4), ...repeat(10, -0.003)]).signals, 'reverse-flow')).toEqual([]);
  });

  it('raises nothing on a bi-directional meter run, where reverse flow is counted', () => {
    const bidirectional = { ...oneWay, oneWayAt: () => false };
    expect(of(live([...repeat(5, 0.4), ...repeat(10, -0.4)], bidirectional).signals, 'reverse-flow')).toEqual([]);
  });

  it('leaves the hourly flag to a meter run judged from its hourly records, and ignores it when judged live', () => {
    const hour = { startMs: T0, endMs: T0 + 60 * MIN, flowTimeS: 0, flags: ['reverse-flow'] };
    const readings = minutes(repeat(61, 0.4));
    const fromHours = walk(readings, { transmitters: [both, pt], hours: [hour] });
    expect(of(fromHours.signals, 'reverse-flow').map((s) => s.kind)).toEqual(['raise']);
    const judgedLive = walk(readings, { transmitters: [both, pt], hours: [hour], reverseFlow: oneWay });
    expect(of(judgedLive.signals, 'reverse-flow')).toEqual([]);
  });
});
