import { coneExpansibility, isentropicExpansibility, orificeExpansibility } from './expansibility';

describe('orificeExpansibility (ISO 5167-2:2003 eq. 5)', () => {
  it('gives ε = 0.9974739057343425 for D = 0.0739, d = 0.0222, p1 = 1e5, p2 = 9.9e4, κ = 1.4 (TRADE.md §3 O4, fluids "against a value in the standard")', () => {
    expect(orificeExpansibility(0.0222 / 0.0739, 1e3, 1e5, 1.4)).toBeCloseTo(0.9974739057343425, 14);
  });

  it('gives ε = 0.9711026967 on the O1 inputs (TRADE.md §3 O1, fluids and pvtlib)', () => {
    expect(orificeExpansibility(0.05 / 0.07366, 17000, 200000, 1.33)).toBeCloseTo(0.9711026967, 10);
  });

  it('gives ε = 0.9958616 for β = 1/3, Δp = 28 kPa, p1 = 2 MPa, κ = 1.2 (TRADE.md §3 O2, pvtlib)', () => {
    expect(orificeExpansibility(0.1 / 0.3, 28000, 2e6, 1.2)).toBeCloseTo(0.9958616, 7);
  });

  it('is 1 at zero differential pressure', () => {
    expect(orificeExpansibility(0.5, 0, 1e6, 1.3)).toBe(1);
  });

  it('rejects a differential pressure at or above the static pressure, naming the field', () => {
    expect(() => orificeExpansibility(0.5, 1e6, 1e6, 1.3)).toThrow(/differentialPressurePa/);
  });
});

describe('isentropicExpansibility (venturi and nozzles, ISO 5167-4:2003 §5.6, ISO 5167-3:2003)', () => {
  it('gives ε = 0.994236 for β = 0.6, p1 = 6 MPa, p2 = 5.95 MPa, κ = 1.3 (TRADE.md §3 V1, fluids citing ISO 5167-4:2003 §5.6)', () => {
    expect(isentropicExpansibility(0.6, 50000, 6e6, 1.3)).toBeCloseTo(0.994236, 6);
  });

  it('gives ε = 0.9353633365 on the O1 inputs (TRADE.md §3 V2, fluids)', () => {
    expect(isentropicExpansibility(0.05 / 0.07366, 17000, 200000, 1.33)).toBeCloseTo(0.9353633365, 10);
  });

  it('stays finite at κ = 1 and agrees with the limit python3-fluids 1.0.22 gives (nozzle_expansibility D=0.1, Do=0.06, P1=1e6, P2=9e5, k=1 → 0.911010859346062)', () => {
    expect(isentropicExpansibility(0.6, 1e5, 1e6, 1)).toBeCloseTo(0.911010859346062, 12);
  });

  it('is 1 at zero differential pressure', () => {
    expect(isentropicExpansibility(0.6, 0, 1e6, 1.3)).toBe(1);
  });
});

describe('coneExpansibility (ISO 5167-5:2016)', () => {
  const coneBeta = (D: number, dc: number) => Math.sqrt(1 - (dc * dc) / (D * D));

  it('gives ε = 0.9157343 for D = 1, dc = 0.9, p1 = 1 MPa, p2 = 0.85 MPa, κ = 1.2 (TRADE.md §3 C7, fluids)', () => {
    expect(coneExpansibility(coneBeta(1, 0.9), 150000, 1e6, 1.2)).toBeCloseTo(0.9157343, 7);
  });

  it('gives ε = 0.945588 on the C6 inputs (TRADE.md §3 C6, fluids tests)', () => {
    expect(coneExpansibility(coneBeta(0.07366, 0.05), 17000, 200000, 1.33)).toBeCloseTo(0.945588, 6);
  });

  // TRADE.md §3 C-A: the κ = 1.2 table reproduced in fluids tests (very likely ISO 5167-5 Annex A), 4 decimals.
  it.each([
    [0.45, 0.75, 0.8588],
    [0.7, 0.9, 0.932],
  ])('gives ε to 4 decimals at β = %p, p2/p1 = %p, κ = 1.2 → %p (TRADE.md §3 C-A)', (beta, tau, expected) => {
    expect(coneExpansibility(beta, (1 - tau) * 1e6, 1e6, 1.2)).toBeCloseTo(expected, 4);
  });
});
