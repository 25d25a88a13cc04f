import { fromSI, toSI } from '../../shared/units';
import { scenarioTimeline } from '../scenario';
import { massFlowAtKgPerS, processStateAt } from './process-state';
import { transmitterValueAt } from './transmitter-value';
import { meterRunByTag } from '../scenario';

const timeline = scenarioTimeline('2026-11');
const MINUTE = 60_000;
const DAY = 86_400_000;
const kfgStart = timeline.historyStartMs.KFG; // 2026-11-01 09:00 MST

/** Readings of a transmitter each minute in [fromMs, toMs). */
function readings(tag: string, fromMs: number, toMs: number, stepMs = MINUTE) {
  const out: { timeMs: number; value: number | null }[] = [];
  for (let t = fromMs; t < toMs; t += stepMs) out.push({ timeMs: t, value: transmitterValueAt(tag, t, timeline) });
  return out;
}
const values = (rows: { value: number | null }[]) => rows.map((r) => r.value).filter((v): v is number => v !== null);
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
const variance = (xs: number[]) => mean(xs.map((x) => (x - mean(xs)) ** 2));
/** Contract day n (1-based) of the demo month at KFG. */
const kfgDay = (n: number) => [kfgStart + (n - 1) * DAY, kfgStart + n * DAY] as const;

describe('the scenario model', () => {
  it('gives the same reading for the same transmitter and time, whatever was asked before', () => {
    const t = Date.parse('2026-11-14T12:34:56Z');
    const first = transmitterValueAt('KFG-102-DP', t, timeline);
    readings('KFG-102-DP', t - 10 * MINUTE, t + 10 * MINUTE);
    expect(transmitterValueAt('KFG-102-DP', t, timeline)).toBe(first);
    expect(transmitterValueAt('KFG-102-DP', t, scenarioTimeline('2026-11'))).toBe(first);
  });

  it("freezes KFG-102's DP for the hour from 10:00 MST on day 3: zero variance inside, live before and after", () => {
    const { fromMs, toMs } = timeline.frozen;
    const inside = values(readings('KFG-102-DP', fromMs, toMs, 5000));
    expect(inside).toHaveLength(720);
    expect(new Set(inside).size).toBe(1); // one value repeated: zero variance, exactly
    expect(variance(values(readings('KFG-102-DP', fromMs - 3_600_000, fromMs)))).toBeGreaterThan(0);
    expect(variance(values(readings('KFG-102-DP', toMs, toMs + 3_600_000)))).toBeGreaterThan(0);
    // Its static pressure and temperature transmitters keep moving: only the DP transmitter is stuck.
    expect(variance(values(readings('KFG-102-PT', fromMs, toMs)))).toBeGreaterThan(0);
  });

  it('drops every KFG-103 reading for 40 minutes, and only those', () => {
    const { fromMs, toMs } = timeline.dropout;
    for (const tag of ['KFG-103-DP', 'KFG-103-PT', 'KFG-103-TT']) {
      expect(values(readings(tag, fromMs, toMs, 5000))).toHaveLength(0);
      expect(transmitterValueAt(tag, fromMs - 5000, timeline)).not.toBeNull();
      expect(transmitterValueAt(tag, toMs, timeline)).not.toBeNull();
    }
    expect(values(readings('KFG-102-DP', fromMs, toMs))).toHaveLength(40);
  });

  it("keeps KFG-101's DP below 10 % of the 250 inH2O high range late in the month, before the element change", () => {
    const late = values(readings('KFG-101-DPH', ...kfgDay(19)));
    expect(mean(late) / 250).toBeLessThan(0.1);
  });

  it('lets the declining well cross the stacked pair over to the low-range transmitter (below 80 % of 25 inH2O) late in the month but not on day 1', () => {
    const switchDown = 0.8 * 25; // the meter run's stackSwitchDownShare × the low range
    expect(values(readings('KFG-101-DPH', ...kfgDay(1))).filter((v) => v < switchDown)).toHaveLength(0);
    expect(values(readings('KFG-101-DPH', ...kfgDay(19))).filter((v) => v < switchDown).length).toBeGreaterThan(60);
  });

  it('declines the wells by about 3 % a month: day 29 carries about 2.7 % less gas than day 1', () => {
    const run = meterRunByTag('KFG-102');
    const dayMass = (n: number) => {
      const [a, b] = kfgDay(n);
      let sum = 0;
      for (let t = a; t < b; t += MINUTE) sum += massFlowAtKgPerS(run, t, timeline);
      return sum;
    };
    // 0.97^(28 days / 30.436875 days) = 0.97238 (the decline compounds monthly).
    expect(dayMass(29) / dayMass(1)).toBeCloseTo(Math.pow(0.97, 28 / 30.436875), 3);
  });

  it('saturates the low-range transmitter at 103.125 % of span (NAMUR NE 43: 20.5 mA [mem]) while the DP is above its range', () => {
    const after = timeline.elementChangeMs['KFG-101'] + DAY;
    expect(transmitterValueAt('KFG-101-DPL', after, timeline)).toBeCloseTo(25 * 1.03125, 3); // reported to 4 decimals
  });

  it("raises KFG-101's DP by about 2.39 times at 14:00 MST on day 20 when the β 0.45 cone replaces the β 0.55 one, at the same flow", () => {
    const changeMs = timeline.elementChangeMs['KFG-101'];
    const before = mean(values(readings('KFG-101-DPH', changeMs - 10 * MINUTE, changeMs)));
    const after = mean(values(readings('KFG-101-DPH', changeMs, changeMs + 10 * MINUTE)));
    // ISO 5167-1 eq. (1) at equal qm and ρ: Δp ∝ (1 − β⁴)/(C² ε² β⁴). With C from the two invented
    // calibration curves at Re_D ≈ 5.9e5 (0.8071 and 0.8024) and ε ≈ 0.9989 / 0.9976 (ISO 5167-5
    // eq. for κ ≈ 1.3): (0.55/0.45)^4 × (1 − 0.45⁴)/(1 − 0.55⁴) × (0.8071/0.8024)² × (0.9989/0.9976)²
    // = 2.2314 × 1.05558 × 1.01173 × 1.0026 = 2.389 [hand calculation].
    expect(after / before).toBeGreaterThan(2.39 * 0.98);
    expect(after / before).toBeLessThan(2.39 * 1.02);
    const run = meterRunByTag('KFG-101');
    expect(massFlowAtKgPerS(run, changeMs, timeline) / massFlowAtKgPerS(run, changeMs - 1000, timeline)).toBeCloseTo(
      1,
      2,
    );
  });

  it("reports static pressure in the transmitter's unit and reference: KFG-101-PT near 430 psig, BPM-ST1-PT near 10 bar(g)", () => {
    const t = Date.parse('2026-11-10T12:00:00Z');
    expect(Math.abs(transmitterValueAt('KFG-101-PT', t, timeline)! - 430)).toBeLessThan(10);
    expect(Math.abs(transmitterValueAt('BPM-ST1-PT', t, timeline)! - 10)).toBeLessThan(0.3);
    const state = processStateAt(meterRunByTag('KFG-101'), t, timeline);
    // gauge = absolute − the site's 84 kPa, in psi (1 psi = 6894.757 Pa)
    expect(transmitterValueAt('KFG-101-PT', t, timeline)).toBeCloseTo(
      fromSI(state.staticPressurePa - 84_000, 'psi'),
      0,
    );
  });

  it('keeps the steam at about 200 °C and 10 bar(g), superheated: Tsat(1.101325 MPa) = 184.12 °C (IAPWS-IF97, python iapws 1.5.2 [lib])', () => {
    const t = Date.parse('2026-11-10T12:00:00Z');
    const temperatureC = transmitterValueAt('BPM-ST1-TT', t, timeline)!;
    expect(Math.abs(temperatureC - 200)).toBeLessThan(3);
    expect(toSI(temperatureC, 'degC')).toBeGreaterThan(toSI(184.12, 'degC') + 10);
  });

  it("keeps the sales meter at 98.5 % of the wellheads' mass at every instant (SCENARIO.md balance)", () => {
    for (const t of [kfgStart + 3 * MINUTE, Date.parse('2026-11-12T09:30:00Z'), Date.parse('2026-11-25T01:02:03Z')]) {
      const inlets = ['KFG-101', 'KFG-102', 'KFG-103'].reduce(
        (s, tag) => s + massFlowAtKgPerS(meterRunByTag(tag), t, timeline),
        0,
      );
      expect(massFlowAtKgPerS(meterRunByTag('KFG-201'), t, timeline)).toBeCloseTo(0.985 * inlets, 10);
    }
  });
});
