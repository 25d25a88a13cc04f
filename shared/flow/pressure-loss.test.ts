import { pressureLossPa } from './pressure-loss';

describe('pressureLossPa', () => {
  it('gives 6271.801399376883 Pa for an orifice β = 0.6, C = 0.61, Δp = 10 kPa (Debian python3-fluids 1.0.22 dP_orifice(0.1, 0.06, 1e6, 9.9e5, 0.61), ISO 5167-2 eq. 7)', () => {
    expect(pressureLossPa('orifice', 0.6, 0.61, 1e4)).toBeCloseTo(6271.801399376883, 9);
  });

  it('gives 25470.093437973323 Pa for a cone D = 1, dc = 0.7, Δp = 50 kPa (fluids docs dP_cone_meter(1, .7, 1E6, 9.5E5))', () => {
    expect(pressureLossPa('cone', Math.sqrt(1 - 0.49), 0.82, 5e4)).toBeCloseTo(25470.093437973323, 8);
  });

  it('is close to (1 − β^1.9) Δp for an orifice, as ISO 5167-2 §5.4.2 approximates it (TRADE.md §2, within 2 % of Δp)', () => {
    const loss = pressureLossPa('orifice', 0.5, 0.605, 1e4) as number;
    expect(Math.abs(loss - (1 - Math.pow(0.5, 1.9)) * 1e4)).toBeLessThan(200);
  });

  it('gives null for a venturi, for which ISO 5167-4 gives no equation', () => {
    expect(pressureLossPa('venturi', 0.5, 0.984, 1e4)).toBeNull();
  });
});
