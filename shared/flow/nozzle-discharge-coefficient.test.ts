import { nozzleDischargeCoefficient } from './nozzle-discharge-coefficient';

describe('nozzleDischargeCoefficient (ISO 5167-3:2003)', () => {
  // TRADE.md §3 N1: ISO 5167-3 Annex A table values via fluids [lib], 4 decimals.
  it.each([
    [2e4, 0.9411],
    [1e5, 0.9588],
    [1e7, 0.9621],
  ])(
    'gives the ISA 1932 nozzle at β = 0.60 and Re_D = %p C = %p (TRADE.md §3 N1, ISO 5167-3 Annex A)',
    (re, expected) => {
      expect(nozzleDischargeCoefficient('isa-1932', 0.6, re)).toBeCloseTo(expected, 4);
    },
  );

  // TRADE.md §3 N2: same source.
  it.each([
    [1e4, 0.9503],
    [1e5, 0.9819],
    [1e7, 0.995],
  ])(
    'gives the long-radius nozzle at β = 0.50 and Re_D = %p C = %p (TRADE.md §3 N2, ISO 5167-3 Annex A)',
    (re, expected) => {
      expect(nozzleDischargeCoefficient('long-radius', 0.5, re)).toBeCloseTo(expected, 4);
    },
  );

  it('rejects an unknown nozzle type, naming element.nozzleType', () => {
    expect(() => nozzleDischargeCoefficient('venturi-nozzle' as never, 0.5, 1e5)).toThrow(/element\.nozzleType/);
  });
});
