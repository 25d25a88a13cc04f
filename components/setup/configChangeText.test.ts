import { describeFieldChange, formatFieldValue, unitOfField } from './configChangeText';

describe('unitOfField', () => {
  it.each([
    ['element.boreDiameterM', 'm'],
    ['element.referenceTemperatureK', 'K'],
    ['element.pipeExpansionPerK', '1/K'],
    ['fluid.viscosityPaS', 'Pa·s'],
    ['fluid.molarMassKgPerMol', 'kg/mol'],
    ['fluid.densityKgPerM3', 'kg/m³'],
    ['fluid.compressibility', ''],
    ['element.kind', ''],
    ['element.taps', ''],
    ['fluid.composition.2', ''],
  ])('reads the unit of %s as "%s" from the end of its name', (path, unit) => {
    expect(unitOfField(path)).toBe(unit);
  });
});

describe('describeFieldChange', () => {
  it('shows a re-measured bore in metres, before → after', () => {
    expect(describeFieldChange({ path: 'element.boreDiameterM', before: 0.05, after: 0.0481 })).toEqual({
      path: 'element.boreDiameterM',
      text: '0.05 m → 0.0481 m',
    });
  });

  it('shows 12 significant digits: 90.2 mm converted to metres reads 0.0902 m, a change in the 7th digit still shows', () => {
    expect(formatFieldValue(90.2 / 1000, 'm')).toBe('0.0902 m');
    expect(formatFieldValue(0.0500001, 'm')).toBe('0.0500001 m');
    expect(formatFieldValue(101325, 'Pa')).toBe('101325 Pa');
  });

  it('says "not set" for the side where a field is missing', () => {
    expect(describeFieldChange({ path: 'element.dischargeCoefficient', before: null, after: 0.82 }).text).toBe(
      'not set → 0.82',
    );
  });

  it('shows words as they are and a whole object as JSON', () => {
    expect(describeFieldChange({ path: 'element.taps', before: 'flange', after: 'corner' }).text).toBe(
      'flange → corner',
    );
    expect(formatFieldValue({ a: 1 }, '')).toBe('{"a":1}');
    expect(formatFieldValue(true, '')).toBe('yes');
  });
});
