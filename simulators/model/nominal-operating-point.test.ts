import { fromSI } from '../../shared/units';
import { DEMO_METER_RUNS, meterRunByTag } from '../scenario';
import { nominalMassFlowKgPerS, nominalOperatingPoint } from './nominal-operating-point';

describe('nominal operating points of the demo meter runs', () => {
  // Expected DPs: fluids 1.0.22 flow_meter_discharge (ISO 5167-1 eq. 1) solved for Δp with scipy's
  // brentq, density from iapws 1.5.2 IAPWS97 at the same p and T, diameters taken to the flowing
  // temperature with the same α (carbon steel 1.116e-5, stainless 1.665e-5 per K, TRADE.md §1);
  // the steam venturi's ε from fluids' nozzle_expansibility (ISO 5167-4) with κ = w²ρ/p from iapws.
  // [lib] run with /usr/bin/python3.
  it.each([
    ['BPM-CW1', 750 / 3600, 29634.271993975723], // cone β 0.65, C 0.803, water 25 °C, 451.325 kPa abs
    ['BPM-EF1', 250 / 3600, 11166.504261458129], // cone β 0.70, C 0.808, water 30 °C, 251.325 kPa abs
  ])('sizes %s for its nominal %f m³/s with the DP the fluids library gives', (tag, volumeM3PerS, expectedDpPa) => {
    const point = nominalOperatingPoint(meterRunByTag(tag));
    expect(point.massFlowKgPerS / point.densityKgPerM3).toBeCloseTo(volumeM3PerS, 12);
    expect(point.differentialPressurePa / expectedDpPa - 1).toBeCloseTo(0, 6);
  });

  it('sizes the steam header (6 t/h, 11.013 bar abs, 200 °C, machined venturi β 0.60) with the DP the fluids library gives', () => {
    const point = nominalOperatingPoint(meterRunByTag('BPM-ST1'));
    expect(point.massFlowKgPerS * 3.6).toBeCloseTo(6, 12);
    expect(point.differentialPressurePa / 5003.021429719592 - 1).toBeCloseTo(0, 5);
  });

  it("gives the sales meter the three wellheads' mass less 1.5 % fuel and losses (SCENARIO.md balance)", () => {
    const inlets = ['KFG-101', 'KFG-102', 'KFG-103'].map((t) => nominalMassFlowKgPerS(meterRunByTag(t)));
    expect(nominalMassFlowKgPerS(meterRunByTag('KFG-201'))).toBeCloseTo(0.985 * inlets.reduce((a, b) => a + b), 12);
  });

  it('puts every single DP transmitter between 25 % and 75 % of its span at the nominal flow', () => {
    for (const run of DEMO_METER_RUNS) {
      for (const t of run.transmitters.filter(
        (x) => x.measures === 'differential-pressure' && x.stackRole === 'single',
      )) {
        const share = fromSI(nominalOperatingPoint(run).differentialPressurePa, t.unit) / t.upperRange;
        expect({ tag: t.tag, inSpan: share > 0.25 && share < 0.75 }).toEqual({ tag: t.tag, inSpan: true });
      }
    }
  });

  it("puts KFG-101's nominal DP at the bottom of the high-range span (below 10 %) and inside the low range, as SCENARIO.md describes", () => {
    const run = meterRunByTag('KFG-101');
    const dp = fromSI(nominalOperatingPoint(run).differentialPressurePa, 'inH2O-60F');
    expect(dp / 250).toBeLessThan(0.1);
    expect(dp / 25).toBeGreaterThan(0.8);
    expect(dp / 25).toBeLessThan(1);
  });
});
