import { orificeDischargeCoefficient } from './orifice-discharge-coefficient';

/** Re_D = 4 qm/(π μ D), ISO 5167-1 §3.3.2.1. */
const reynolds = (qm: number, mu: number, d: number) => (4 * qm) / (Math.PI * mu * d);

describe('orificeDischargeCoefficient (Reader-Harris/Gallagher, ISO 5167-2:2003 eq. 4)', () => {
  // TRADE.md §3 O3 [lib: fluids (CalebBell) tests]: D = 0.07391, d = 0.0222, ρ = 1.1645909036,
  // μ = 1.85861753095e-5, qm = 0.124431876.
  const D = 0.07391;
  const beta = 0.0222 / D;
  const re = reynolds(0.124431876, 1.85861753095e-5, D);

  it('gives C = 0.6000085121444034 for corner taps at the O3 point (TRADE.md §3 O3, fluids tests)', () => {
    expect(orificeDischargeCoefficient(beta, re, D, 'corner')).toBeCloseTo(0.6000085121444034, 13);
  });

  it('gives C = 0.5988219225153976 for D-D/2 taps at the O3 point (TRADE.md §3 O3, fluids tests)', () => {
    expect(orificeDischargeCoefficient(beta, re, D, 'D-D/2')).toBeCloseTo(0.5988219225153976, 13);
  });

  it('gives C = 0.5990042535666878 for flange taps at the O3 point (TRADE.md §3 O3, fluids tests)', () => {
    expect(orificeDischargeCoefficient(beta, re, D, 'flange')).toBeCloseTo(0.5990042535666878, 13);
  });

  it('adds the small-pipe term below D = 71.12 mm (Debian python3-fluids 1.0.22 C_Reader_Harris_Gallagher, D = 0.05, Do = 0.025)', () => {
    // Expected values printed by /usr/bin/python3 fluids.flow_meter.C_Reader_Harris_Gallagher(0.05, 0.025, 1000, 1e-3, m, taps)
    // with m = Re·π·μ·D/4.
    expect(orificeDischargeCoefficient(0.5, 5e4, 0.05, 'corner')).toBeCloseTo(0.6111232275546158, 13);
    expect(orificeDischargeCoefficient(0.5, 5e4, 0.05, 'flange')).toBeCloseTo(0.6100985051041069, 13);
    expect(orificeDischargeCoefficient(0.5, 1e6, 0.05, 'corner')).toBeCloseTo(0.6060637032334686, 13);
    expect(orificeDischargeCoefficient(0.5, 1e6, 0.05, 'flange')).toBeCloseTo(0.6051095732403468, 13);
  });

  it('rejects a Reynolds number that is not positive, naming the field', () => {
    expect(() => orificeDischargeCoefficient(0.5, 0, 0.1, 'corner')).toThrow(/reynoldsNumber/);
  });

  it('rejects unknown taps, naming element.taps', () => {
    expect(() => orificeDischargeCoefficient(0.5, 1e5, 0.1, 'pipe' as never)).toThrow(/element\.taps/);
  });
});
