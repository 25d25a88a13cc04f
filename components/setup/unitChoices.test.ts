/**
 * Expected values: NIST SP 811 (2008), Appendix B.8 (1 in = 0.0254 m exactly; 1 psi =
 * 6894.757 Pa; 1 bar = 100 kPa exactly) and ISO 80000-5 (T/K = t/°C + 273.15).
 */
import {
  absolutePressureUnits,
  convertShown,
  lengthFromMetres,
  lengthToMetres,
  optionalToSI,
  roundedText,
  siFromShown,
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

describe('roundedText, convertShown and siFromShown', () => {
  // 1 atm = 101325 Pa = 14.6959488 psi (NIST SP 811 Appendix B.8: 1 psi = 6894.757293168 Pa, 1 atm = 101325 Pa).
  it('shows 101.325 kPa as 14.696 psia and sends back exactly 101325 Pa while the text is left alone', () => {
    const { text, shown } = convertShown('101.325', 'kPa', 'psi');
    expect(text).toBe('14.696');
    expect(siFromShown(text, 'psi', shown)).toBe(101325);
  });

  it('turns 101.325 kPa to psia and back into the same 101.325 kPa text', () => {
    const inPsi = convertShown('101.325', 'kPa', 'psi');
    const back = convertShown(inPsi.text, 'psi', 'kPa', inPsi.shown);
    expect(back.text).toBe('101.325');
    expect(back.shown?.si).toBe(101325);
  });

  // ISO 80000-5: T/K = t/°C + 273.15; t/°F = 1.8 t/°C + 32 (NIST SP 811 Appendix B.8).
  it('shows 15 °C as 59 °F and 60 °F as 15.56 °C, each standing for the exact kelvin', () => {
    const fahrenheit = convertShown('15', 'degC', 'degF');
    expect(fahrenheit.text).toBe('59');
    expect(fahrenheit.shown?.si).toBeCloseTo(288.15, 12);
    const celsius = convertShown('60', 'degF', 'degC');
    expect(celsius.text).toBe('15.56');
    expect(siFromShown(celsius.text, 'degC', celsius.shown)).toBeCloseTo(288.705556, 6);
  });

  it('reads a retyped value as typed, a blank as undefined and words as NaN', () => {
    const { shown } = convertShown('101.325', 'kPa', 'psi');
    expect(siFromShown('14.73', 'psi', shown)).toBeCloseTo(101559.77, 1);
    expect(siFromShown('', 'psi', shown)).toBeUndefined();
    expect(siFromShown('abc', 'psi')).toBeNaN();
    expect(convertShown('abc', 'kPa', 'psi')).toEqual({ text: 'abc' });
  });

  it('rounds a bar value to five decimals and drops trailing zeros', () => {
    expect(roundedText(1.01325, 'bar')).toBe('1.01325');
    expect(roundedText(14.7, 'psi')).toBe('14.7');
  });
});
