import { expandedAccuracyPercent, readingUncertaintyPercent } from './transmitter-uncertainty';

describe('readingUncertaintyPercent (TRADE.md §6 [calc])', () => {
  it('turns 0.075 % of span at 10 % of span into 0.75 % of reading (0.375 % on flow)', () => {
    expect(readingUncertaintyPercent(0.075, 250, 25)).toBeCloseTo(0.75, 12);
    expect(readingUncertaintyPercent(0.075, 250, 25) / 2).toBeCloseTo(0.375, 12);
  });

  it('turns 0.075 % of span at 1 % of span into 7.5 % of reading (3.75 % on flow)', () => {
    expect(readingUncertaintyPercent(0.075, 250, 2.5)).toBeCloseTo(7.5, 12);
  });

  it('is Infinity at a zero reading and rejects a zero span', () => {
    expect(readingUncertaintyPercent(0.075, 250, 0)).toBe(Infinity);
    expect(() => readingUncertaintyPercent(0.075, 0, 1)).toThrow(/spanInUnit/);
  });
});

describe('expandedAccuracyPercent', () => {
  it('keeps a k = 2 figure and turns a rectangular ± 0.1 % limit into U = 2 × 0.1/√3 = 0.115470 % (GUM §4.3.7, §6.2)', () => {
    expect(expandedAccuracyPercent(0.1, 'expanded-k2')).toBe(0.1);
    expect(expandedAccuracyPercent(0.1, 'rectangular-limit')).toBeCloseTo(0.1154700538, 9);
  });
  it('refuses an unknown kind, naming the field', () => {
    expect(() => expandedAccuracyPercent(0.1, 'typical' as never)).toThrow(/accuracyKind/);
  });
});
