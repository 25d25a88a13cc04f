/**
 * Expected values: NIST SP 811 (2008), Appendix B.8 (1 in = 0.0254 m exactly; 1 psi =
 * 6894.757 Pa; 1 bar = 100 kPa exactly) and ISO 80000-5 (T/K = t/°C + 273.15).
 */
import {
  absolutePressureUnits,
  lengthFromMetres,
  lengthToMetres,
  optionalToSI,
  temperatureUnits,
  toSI,
} from './unitChoices';

describe('lengthToMetres and lengthFromMetres', () => {
  it('turns 4.026 in into 0.1022604 m and 102.3 mm into 0.1023 m', () => {
    expect(lengthToMetres(4.026, 'in')).toBeCloseTo(0.1022604, 12);
    expect(lengthToMetres(102.3, 'mm')).toBeCloseTo(0.1023, 12);
  });

  it('turns 0.0254 m back into 1 in and 25.4 mm', () => {
    expect(lengthFromMetres(0.0254, 'in')).toBeCloseTo(1, 12);
    expect(lengthFromMetres(0.0254, 'mm')).toBeCloseTo(25.4, 12);
  });

  it('lets an empty field and a bad number through for the schema to name', () => {
    expect(lengthToMetres(undefined, 'mm')).toBeUndefined();
    expect(lengthToMetres(Number.NaN, 'in')).toBeNaN();
  });
});

describe('optionalToSI', () => {
  it('converts a typed value and lets an empty field through', () => {
    expect(optionalToSI(15, 'degC')).toBeCloseTo(288.15, 10);
    expect(optionalToSI(undefined, 'degC')).toBeUndefined();
  });
});

describe('the unit choices', () => {
  it('offers absolute pressure in kPa, psia and bar, each converting as NIST SP 811 gives', () => {
    expect(absolutePressureUnits.map((unit) => unit.label)).toEqual(['kPa abs', 'psia', 'bar abs']);
    expect(toSI(1, 'psi')).toBeCloseTo(6894.757, 3);
    expect(toSI(1, 'bar')).toBe(100_000);
    expect(toSI(1, 'kPa')).toBe(1000);
  });

  it('offers temperatures in °C, °F and K', () => {
    expect(temperatureUnits.map((unit) => unit.label)).toEqual(['°C', '°F', 'K']);
  });
});
