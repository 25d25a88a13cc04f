/**
 * Expected values come from outside the code:
 * - NIST SP 811 (2008), Appendix B.8: 1 inH2O (60 °F) = 248.84 Pa; 1 psi = 6894.757 Pa;
 *   1 in = 0.0254 m exactly; 1 lb = 0.45359237 kg exactly; 1 ft³ = 0.028316846592 m³ exactly;
 *   1 barrel (42 US gal) = 0.158987294928 m³ exactly; 1 bar = 100 kPa exactly.
 * - SP 811 B.9 and ISO 80000-5: T/K = t/°C + 273.15; t/°F = 1.8 t/°C + 32.
 * - The standard atmosphere, 101 325 Pa, is exact by definition (10th CGPM, 1954).
 * - An hour is 3600 s and a day 86 400 s by definition.
 */
import {
  convertFlowRate,
  defaultFlowRateUnit,
  differentialPressureForDisplay,
  differentialPressureFromDisplay,
  displayUnitFor,
  flowRateForDisplay,
  flowRateUnit,
  formatNumber,
  formatPlain,
  formatQuantity,
  massFlowFromDisplay,
  readingForDisplay,
  staticPressureForDisplay,
  staticPressureFromDisplay,
  temperatureForDisplay,
  temperatureFromDisplay,
  unitLabel,
  unitsFor,
} from './units-display';

const IN_H2O_60F_PA = 248.84; // NIST SP 811, five figures
const PSI_PA = 6894.757; // NIST SP 811, seven figures
const CUBIC_FOOT_M3 = 0.028316846592; // exact, (0.3048 m)³
const BARREL_M3 = 0.158987294928; // exact, 42 × 231 in³
const POUND_KG = 0.45359237; // exact
const ATMOSPHERE_PA = 101_325; // exact by definition

/** Relative difference, for values the sources give to a limited number of figures. */
const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

const si = unitsFor('si');
const us = unitsFor('us');

describe('the display unit sets', () => {
  it('shows US customary sites DP in inH2O at 60 °F, static pressure as psig and temperature in °F', () => {
    expect(us.differentialPressure).toEqual({ unit: 'inH2O-60F', label: 'inH2O (60 °F)' });
    expect(us.staticPressure).toEqual({ unit: 'psi', label: 'psig', gauge: true });
    expect(us.temperature.label).toBe('°F');
    expect(us.length.label).toBe('in');
  });

  it('shows SI sites DP in kPa, static pressure in kPa absolute and temperature in °C', () => {
    expect(si.differentialPressure).toEqual({ unit: 'kPa', label: 'kPa' });
    expect(si.staticPressure).toEqual({ unit: 'kPa', label: 'kPa abs', gauge: false });
    expect(si.temperature.label).toBe('°C');
    expect(si.length.label).toBe('mm');
  });

  it('measures pipe diameters in exact inches on US sites and in millimetres on SI sites', () => {
    expect(us.length.metresPerUnit).toBe(0.0254); // NIST SP 811: 1 in = 0.0254 m exactly
    expect(si.length.metresPerUnit).toBe(0.001); // SI prefix milli
  });
});

describe('unitLabel', () => {
  it('writes inches of water with their reference temperature and degrees with the degree sign', () => {
    expect(unitLabel('inH2O-4C')).toBe('inH2O (4 °C)');
    expect(unitLabel('inH2O-60F')).toBe('inH2O (60 °F)');
    expect(unitLabel('inH2O-68F')).toBe('inH2O (68 °F)');
    expect(unitLabel('degC')).toBe('°C');
    expect(unitLabel('degF')).toBe('°F');
    expect(unitLabel('m3')).toBe('m³');
  });

  it('writes a unit it has no words for as its code, never dropping it', () => {
    expect(unitLabel('MPa')).toBe('MPa');
    expect(unitLabel('furlong')).toBe('furlong');
  });
});

describe('differential pressure on screen', () => {
  it('turns 100 inH2O (60 °F) into 24 884 Pa (NIST SP 811: 1 inH2O at 60 °F = 248.84 Pa)', () => {
    expect(relative(differentialPressureFromDisplay(100, us), 100 * IN_H2O_60F_PA)).toBeLessThan(5e-5);
  });

  it('shows 50 kPa as about 200.9 inH2O (60 °F) (50 000 Pa / 248.84 Pa, NIST SP 811)', () => {
    expect(relative(differentialPressureForDisplay(50_000, us), 50_000 / IN_H2O_60F_PA)).toBeLessThan(5e-5);
  });

  it('shows pascals as kilopascals on SI sites (SI prefix kilo)', () => {
    expect(differentialPressureForDisplay(24_884, si)).toBeCloseTo(24.884, 12);
    expect(differentialPressureFromDisplay(25, si)).toBeCloseTo(25_000, 9);
  });
});

describe('static pressure on screen', () => {
  it('adds the site atmosphere to a US gauge value: 100 psig at 101.325 kPa is 790 800.7 Pa absolute (SP 811 psi)', () => {
    const expectedPa = 100 * PSI_PA + ATMOSPHERE_PA;
    expect(relative(staticPressureFromDisplay(100, us, ATMOSPHERE_PA), expectedPa)).toBeLessThan(1e-6);
  });

  it('takes the site atmosphere off for a US gauge display: 790 800.7 Pa abs shows as 100 psig', () => {
    expect(staticPressureForDisplay(100 * PSI_PA + ATMOSPHERE_PA, us, ATMOSPHERE_PA)).toBeCloseTo(100, 4);
  });

  it('uses the site atmosphere it is given, so a high site reads more psig for the same absolute pressure', () => {
    // A site at altitude with 83.4 kPa of atmosphere: the same 500 kPa abs is more gauge pressure there.
    const atSeaLevel = staticPressureForDisplay(500_000, us, ATMOSPHERE_PA);
    const atAltitude = staticPressureForDisplay(500_000, us, 83_400);
    expect(atAltitude - atSeaLevel).toBeCloseTo((ATMOSPHERE_PA - 83_400) / PSI_PA, 4);
  });

  it('shows SI static pressure as absolute kilopascals, whatever the atmosphere', () => {
    expect(staticPressureFromDisplay(4000, si, 90_000)).toBeCloseTo(4_000_000, 6);
    expect(staticPressureForDisplay(4_000_000, si, 90_000)).toBeCloseTo(4000, 9);
  });
});

describe('temperature on screen', () => {
  it('turns 15 °C into 288.15 K and 60 °F into 288.7056 K (ISO 80000-5; t/°F = 1.8 t/°C + 32)', () => {
    expect(temperatureFromDisplay(15, si)).toBeCloseTo(288.15, 10);
    expect(temperatureFromDisplay(60, us)).toBeCloseTo((60 - 32) / 1.8 + 273.15, 10);
  });

  it('shows the ice point 273.15 K as 0 °C and 32 °F, and the steam point 373.15 K as 100 °C and 212 °F', () => {
    expect(temperatureForDisplay(273.15, si)).toBeCloseTo(0, 10);
    expect(temperatureForDisplay(273.15, us)).toBeCloseTo(32, 10);
    expect(temperatureForDisplay(373.15, si)).toBeCloseTo(100, 10);
    expect(temperatureForDisplay(373.15, us)).toBeCloseTo(212, 10);
  });

  it('shows −40 °C as −40 °F, where the two scales meet', () => {
    expect(temperatureForDisplay(temperatureFromDisplay(-40, si), us)).toBeCloseTo(-40, 10);
  });
});

describe('readingForDisplay', () => {
  it('shows a gauge transmitter reading 100 kPa as 14.504 psig on a US site (100 000 Pa / 6894.757 Pa)', () => {
    const source = { measures: 'static-pressure', unit: 'kPa', pressureReference: 'gauge' } as const;
    expect(readingForDisplay(100, source, us, ATMOSPHERE_PA)).toBeCloseTo(100_000 / PSI_PA, 4);
  });

  it('shows an absolute transmitter reading 10 bar as psig on a US site, less the site atmosphere (1 bar = 100 kPa)', () => {
    const source = { measures: 'static-pressure', unit: 'bar', pressureReference: 'absolute' } as const;
    expect(readingForDisplay(10, source, us, ATMOSPHERE_PA)).toBeCloseTo((10 * 100_000 - ATMOSPHERE_PA) / PSI_PA, 3);
  });

  it('treats a static pressure transmitter with no reference as absolute', () => {
    const source = { measures: 'static-pressure', unit: 'kPa' } as const;
    expect(readingForDisplay(500, source, si, ATMOSPHERE_PA)).toBeCloseTo(500, 9);
  });

  it('shows a DP transmitter ranged in inH2O (60 °F) in kPa on an SI site: 100 inH2O is 24.884 kPa', () => {
    const source = { measures: 'differential-pressure', unit: 'inH2O-60F' } as const;
    expect(relative(readingForDisplay(100, source, si, ATMOSPHERE_PA), 24.884)).toBeLessThan(5e-5);
  });

  it('shows a temperature transmitter reading 300 K as 80.33 °F on a US site (1.8 × 300 − 459.67)', () => {
    const source = { measures: 'temperature', unit: 'K' } as const;
    expect(readingForDisplay(300, source, us, ATMOSPHERE_PA)).toBeCloseTo(1.8 * 300 - 459.67, 10);
  });
});

describe('displayUnitFor', () => {
  it('names the display unit of what the transmitter measures', () => {
    expect(displayUnitFor({ measures: 'differential-pressure' }, us)).toBe('inH2O (60 °F)');
    expect(displayUnitFor({ measures: 'static-pressure' }, us)).toBe('psig');
    expect(displayUnitFor({ measures: 'static-pressure' }, si)).toBe('kPa abs');
    expect(displayUnitFor({ measures: 'temperature' }, si)).toBe('°C');
  });
});

describe('flow rate units', () => {
  it('finds a flow rate unit by its key', () => {
    expect(flowRateUnit('Mscf/d')).toMatchObject({ basis: 'standard-volume', unit: 'Mscf', secondsPerPeriod: 86_400 });
    expect(flowRateUnit('t/h')).toMatchObject({ basis: 'mass', unit: 't', secondsPerPeriod: 3600 });
  });

  it('refuses an unknown flow rate unit, naming it', () => {
    expect(() => flowRateUnit('MMscf/d')).toThrow('flowRateUnit: unknown flow rate unit "MMscf/d"');
  });

  it('shows gas as volume at base conditions, steam as mass and liquids as volume, in each unit system', () => {
    expect(defaultFlowRateUnit('us', 'natural-gas').key).toBe('Mscf/d');
    expect(defaultFlowRateUnit('si', 'natural-gas').key).toBe('m3/h');
    expect(defaultFlowRateUnit('us', 'ideal-gas').key).toBe('Mscf/d');
    expect(defaultFlowRateUnit('us', 'steam').key).toBe('lb/h');
    expect(defaultFlowRateUnit('si', 'steam').key).toBe('t/h');
    expect(defaultFlowRateUnit('us', 'water').key).toBe('bbl/d');
    expect(defaultFlowRateUnit('us', 'liquid').key).toBe('bbl/d');
    expect(defaultFlowRateUnit('si', 'liquid').key).toBe('m3/h');
    expect(defaultFlowRateUnit('us', undefined).key).toBe('Mscf/d');
  });
});

describe('flowRateForDisplay', () => {
  it('shows 1 m³/s at base conditions as 3051.19 Mscf/d (86 400 s ÷ 28.316 846 592 m³)', () => {
    const shown = flowRateForDisplay({ massKgPerS: 0.8, standardVolumeM3PerS: 1 }, flowRateUnit('Mscf/d'));
    expect(shown).toBeCloseTo(86_400 / (1000 * CUBIC_FOOT_M3), 6);
  });

  it('shows 1 kg/s as 7936.64 lb/h (3600 s ÷ 0.453 592 37 kg)', () => {
    const shown = flowRateForDisplay({ massKgPerS: 1, standardVolumeM3PerS: null }, flowRateUnit('lb/h'));
    expect(shown).toBeCloseTo(3600 / POUND_KG, 6);
  });

  it('shows 1 kg/s as 3.6 t/h (a tonne is 1000 kg)', () => {
    const shown = flowRateForDisplay({ massKgPerS: 1, standardVolumeM3PerS: null }, flowRateUnit('t/h'));
    expect(shown).toBeCloseTo(3.6, 12);
  });

  it('shows no volume when the volume at base conditions is not known', () => {
    expect(flowRateForDisplay({ massKgPerS: 1, standardVolumeM3PerS: null }, flowRateUnit('m3/h'))).toBeNull();
  });
});

describe('massFlowFromDisplay', () => {
  it('reads 36 t/h as 10 kg/s', () => {
    expect(massFlowFromDisplay(36, flowRateUnit('t/h'), null)).toBeCloseTo(10, 12);
  });

  it('reads 1000 Mscf/d of a gas of base density 0.7 kg/m³ as 1000 × 28.316 846 592 m³ × 0.7 / 86 400 s', () => {
    expect(massFlowFromDisplay(1000, flowRateUnit('Mscf/d'), 0.7)).toBeCloseTo(
      (1000 * 1000 * CUBIC_FOOT_M3 * 0.7) / 86_400,
      10,
    );
  });

  it('refuses a volume without the base density, naming the unit', () => {
    expect(() => massFlowFromDisplay(10, flowRateUnit('Mscf/d'), null)).toThrow(
      "massFlowFromDisplay: a flow in Mscf/d needs the fluid's density at base conditions",
    );
    expect(() => massFlowFromDisplay(10, flowRateUnit('m3/h'), 0)).toThrow(/m³\/h \(base\)/);
  });
});

describe('convertFlowRate', () => {
  it('turns 1 Mscf/d into 1.179 869 m³/h (28.316 846 592 m³ per 24 h)', () => {
    expect(convertFlowRate(1, flowRateUnit('Mscf/d'), flowRateUnit('m3/h'), null)).toBeCloseTo(
      (1000 * CUBIC_FOOT_M3) / 24,
      10,
    );
  });

  it('turns 24 bbl/d into 0.158 987 m³/h (one 42 US gal barrel per hour)', () => {
    expect(convertFlowRate(24, flowRateUnit('bbl/d'), flowRateUnit('m3/h'), null)).toBeCloseTo(BARREL_M3, 10);
  });

  it('turns 1000 lb/h into 0.453 592 37 t/h', () => {
    expect(convertFlowRate(1000, flowRateUnit('lb/h'), flowRateUnit('t/h'), null)).toBeCloseTo(POUND_KG, 12);
  });

  it('goes between mass and volume through the base density: 100 kg/h at 0.8 kg/m³ is 125 m³/h', () => {
    expect(convertFlowRate(100, flowRateUnit('kg/h'), flowRateUnit('m3/h'), 0.8)).toBeCloseTo(125, 10);
  });

  it('gives no answer between mass and volume when the base density is unknown or not positive', () => {
    expect(convertFlowRate(100, flowRateUnit('kg/h'), flowRateUnit('m3/h'), null)).toBeNull();
    expect(convertFlowRate(100, flowRateUnit('Mscf/d'), flowRateUnit('lb/h'), -1)).toBeNull();
  });
});

describe('formatNumber', () => {
  it('shows four significant figures with grouped thousands', () => {
    expect(formatNumber(1_234_567.8)).toBe('1,234,568');
    expect(formatNumber(1234.5678)).toBe('1,235');
    expect(formatNumber(98.7654)).toBe('98.77');
    expect(formatNumber(-98.7654)).toBe('-98.77');
    expect(formatNumber(0.00123456)).toBe('0.001235');
  });

  it('keeps trailing zeros that are significant', () => {
    expect(formatNumber(2)).toBe('2.000');
    expect(formatNumber(12.5, 3)).toBe('12.5');
  });

  it('shows zero as "0" and a missing or non-finite value as a dash', () => {
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(null)).toBe('—');
    expect(formatNumber(undefined)).toBe('—');
    expect(formatNumber(Number.NaN)).toBe('—');
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe('—');
  });
});

describe('formatPlain', () => {
  it('shows a set value as meant, without trailing zeros and with grouped thousands', () => {
    expect(formatPlain(200)).toBe('200');
    expect(formatPlain(0.075)).toBe('0.075');
    expect(formatPlain(1000)).toBe('1,000');
    expect(formatPlain(250_000)).toBe('250,000');
  });

  it('rounds float noise to six significant figures', () => {
    expect(formatPlain(0.1 + 0.2)).toBe('0.3');
    expect(formatPlain(1 / 3)).toBe('0.333333');
  });

  it('shows a missing value as a dash', () => {
    expect(formatPlain(null)).toBe('—');
    expect(formatPlain(Number.NaN)).toBe('—');
  });
});

describe('formatQuantity', () => {
  it('writes the number and its unit', () => {
    expect(formatQuantity(12.3456, 'inH2O (60 °F)')).toBe('12.35 inH2O (60 °F)');
    expect(formatQuantity(4000, 'kPa abs', 3)).toBe('4,000 kPa abs');
  });

  it('writes only a dash, without the unit, when there is no number', () => {
    expect(formatQuantity(null, 'psig')).toBe('—');
  });
});
