import { absolutePressurePa } from './pressure-units';

describe('absolutePressurePa', () => {
  it('adds the given atmospheric pressure to a gauge reading: 100 psig at 101.325 kPa = 790.8007 kPa abs (1 psi = 6894.757293168361 Pa, pint)', () => {
    expect(absolutePressurePa(100, 'psi', 'gauge', 101325)).toBeCloseTo(689475.7293168361 + 101325, 6);
  });

  it('leaves an absolute reading as it is', () => {
    expect(absolutePressurePa(60, 'bar', 'absolute')).toBe(6e6);
  });

  it('requires the atmospheric pressure for a gauge reading, naming it', () => {
    expect(() => absolutePressurePa(1, 'bar', 'gauge')).toThrow(/atmosphericPressurePa/);
  });

  it('names an unknown unit', () => {
    expect(() => absolutePressurePa(1, 'torr' as never, 'absolute')).toThrow(/unknown pressure unit 'torr'/);
  });
});
