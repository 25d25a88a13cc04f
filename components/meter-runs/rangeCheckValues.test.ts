/**
 * The range check form's defaults, its switch between SI and US units, and its prefill from a
 * meter run. Expected numbers come from outside the code:
 * - NIST SP 811 (2008), Appendix B.8: 1 in = 25.4 mm exactly; 1 psi = 6894.757 Pa;
 *   1 inH2O (60 °F) = 248.84 Pa; 1 ft³ = 0.028316846592 m³ exactly; 1 lb = 0.45359237 kg exactly.
 * - ISO 80000-5: T/K = t/°C + 273.15; t/°F = 1.8 t/°C + 32.
 * - The standard atmosphere, 101 325 Pa, is exact by definition.
 */
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import type { Transmitter } from '@/hooks/api/transmitters';
import type { RecordedOperatingPoint } from './recordedOperatingPoint';
import {
  defaultValues,
  gulfCoastGasText,
  prefillFromMeterRun,
  prefillOperatingPoint,
  switchUnits,
  type RangeCheckValues,
} from './rangeCheckValues';

const PSI_PA = 6894.757; // NIST SP 811
const IN_H2O_60F_PA = 248.84; // NIST SP 811
const CUBIC_FOOT_M3 = 0.028316846592; // exact
const POUND_KG = 0.45359237; // exact
const ATMOSPHERE_PA = 101_325; // exact by definition

/** Relative difference of a typed number from the expected value. */
const relative = (text: string, expected: number) => Math.abs(Number(text) / expected - 1);

const usSite: Site = {
  id: '3',
  code: 'HIGH',
  name: 'High plains station',
  timeZone: 'America/Denver',
  contractHour: 9,
  atmosphericPressurePa: 83_400,
  basePressurePa: 14.73 * PSI_PA,
  baseTemperatureK: (60 - 32) / 1.8 + 273.15,
  displayUnits: 'us',
};

function meterRun(change: Partial<MeterRun> = {}): MeterRun {
  return {
    id: '12',
    siteId: '3',
    tag: 'MR-12',
    name: 'Meter run 12',
    holdLimitS: 120,
    maxGapS: 600,
    stackSwitchUpShare: 0.9,
    stackSwitchDownShare: 0.8,
    line: {},
    ...change,
  };
}

function transmitter(change: Partial<Transmitter>): Transmitter {
  return {
    id: '1',
    meterRunId: '12',
    tag: 'DP-1',
    measures: 'differential-pressure',
    unit: 'inH2O-60F',
    pressureReference: 'absolute',
    lowerRange: 0,
    upperRange: 250,
    stackRole: 'single',
    accuracyPercentOfSpan: 0.075,
    calibrationDue: null,
    ...change,
  };
}

describe('defaultValues', () => {
  it('starts from the same 6 in schedule 40 line in both systems: 6.065 in is 154.05 mm (25.4 mm per inch)', () => {
    expect(relative(defaultValues('si').pipeDiameter, Number(defaultValues('us').pipeDiameter) * 25.4)).toBeLessThan(
      1e-5,
    );
  });

  it('starts SI sites at the standard atmosphere with base conditions of 15 °C and 101.325 kPa (ISO 13443)', () => {
    const values = defaultValues('si');
    expect(values.atmosphericPressurePa).toBe(ATMOSPHERE_PA);
    expect(values.basePressurePa).toBe(ATMOSPHERE_PA);
    expect(values.baseTemperatureK).toBeCloseTo(288.15, 10);
  });

  it('starts US sites at base conditions of 60 °F and 14.73 psia', () => {
    const values = defaultValues('us');
    expect(values.basePressurePa / (14.73 * PSI_PA)).toBeCloseTo(1, 6);
    expect(values.baseTemperatureK).toBeCloseTo((60 - 32) / 1.8 + 273.15, 10);
  });

  it('starts from the AGA Report No. 8 Gulf Coast gas, whose mole fractions add up to 1', () => {
    const values = defaultValues('si');
    expect(values.composition).toBe(gulfCoastGasText);
    const sum = gulfCoastGasText.split('\n').reduce((total, line) => total + Number(line.split(' ')[1]), 0);
    expect(sum).toBeCloseTo(1, 6);
  });

  it('shows flows in m³/h on SI sites and Mscf/d on US sites', () => {
    expect(defaultValues('si').flowUnitKey).toBe('m3/h');
    expect(defaultValues('us').flowUnitKey).toBe('Mscf/d');
  });
});

describe('switchUnits', () => {
  const us = switchUnits(defaultValues('si'), 'us');

  it('converts diameters from mm to inches (25.4 mm per inch)', () => {
    expect(relative(us.pipeDiameter, 154.05 / 25.4)).toBeLessThan(1e-5);
    expect(relative(us.boreDiameter, 77.03 / 25.4)).toBeLessThan(1e-5);
  });

  it('converts 4000 kPa abs to psig above the standard atmosphere', () => {
    expect(relative(us.staticPressure, (4_000_000 - ATMOSPHERE_PA) / PSI_PA)).toBeLessThan(1e-5);
  });

  it('converts a liquid’s density from kg/m³ to lb/ft³ and its expansion from per K to per °F', () => {
    const si = { ...defaultValues('si'), liquidDensity: '1000', liquidExpansion: '0.00018' };
    const us = switchUnits(si, 'us');
    // 1000 kg/m³ = 1000 × 0.028316846592 / 0.45359237 lb/ft³ = 62.4280 (NIST SP 811 exact factors).
    expect(relative(us.liquidDensity, (1000 * CUBIC_FOOT_M3) / POUND_KG)).toBeLessThan(1e-6);
    expect(us.liquidExpansion).toBe('0.0001'); // 0.00018 / 1.8 (ISO 80000-5)
    const back = switchUnits(us, 'si');
    expect(relative(back.liquidDensity, 1000)).toBeLessThan(1e-6);
    expect(back.liquidExpansion).toBe('0.00018');
  });

  it('starts a US form’s liquid at 62.32 lb/ft³, water’s 998.2 kg/m³ at 20 °C', () => {
    expect(relative(defaultValues('us').liquidDensity, (998.2 * CUBIC_FOOT_M3) / POUND_KG)).toBeLessThan(1e-6);
    expect(defaultValues('si').liquidDensity).toBe('998.2');
  });

  it('converts 15 °C to 59 °F and a 20 °C liquid reference temperature to 68 °F', () => {
    expect(us.temperature).toBe('59');
    expect(us.liquidReferenceTemperature).toBe('68');
  });

  it('converts a 50 kPa span to inH2O (60 °F): about 200.9 (50 000 Pa / 248.84 Pa)', () => {
    expect(relative(us.transmitters[0].span, 50_000 / IN_H2O_60F_PA)).toBeLessThan(5e-5);
    expect(us.transmitters[0].accuracy).toBe('0.075');
  });

  it('converts volume flows from m³/h to Mscf/d (24 h per day; 28.316 846 592 m³ per Mscf)', () => {
    expect(us.flowUnitKey).toBe('Mscf/d');
    expect(relative(us.minimumFlow, (2000 * 24) / (1000 * CUBIC_FOOT_M3))).toBeLessThan(1e-5);
    expect(relative(us.maximumFlow, (20_000 * 24) / (1000 * CUBIC_FOOT_M3))).toBeLessThan(1e-5);
  });

  it('takes the other system’s default base conditions when no meter run is picked', () => {
    expect(us.basePressurePa / (14.73 * PSI_PA)).toBeCloseTo(1, 6);
    expect(us.baseTemperatureK).toBeCloseTo((60 - 32) / 1.8 + 273.15, 10);
  });

  it('keeps a meter run’s own site conditions', () => {
    const picked = { ...defaultValues('si'), meterRunId: '12', atmosphericPressurePa: 83_400, basePressurePa: 100_000 };
    const switched = switchUnits(picked, 'us');
    expect(switched.atmosphericPressurePa).toBe(83_400);
    expect(switched.basePressurePa).toBe(100_000);
  });

  it('comes back to the same case when switched there and back', () => {
    const back = switchUnits(us, 'si');
    const start = defaultValues('si');
    for (const field of ['pipeDiameter', 'boreDiameter', 'staticPressure', 'temperature', 'minimumFlow'] as const)
      expect(relative(back[field], Number(start[field]))).toBeLessThan(1e-5);
    expect(relative(back.transmitters[0].span, 50)).toBeLessThan(1e-5);
  });

  it('leaves text that is not a number as it was typed', () => {
    const values = { ...defaultValues('si'), pipeDiameter: 'six inch', boreDiameter: '', temperature: ' ' };
    const switched = switchUnits(values, 'us');
    expect(switched.pipeDiameter).toBe('six inch');
    expect(switched.boreDiameter).toBe('');
    expect(switched.temperature).toBe(' ');
  });

  it('returns the values untouched when they are already in that system', () => {
    const values = defaultValues('us');
    expect(switchUnits(values, 'us')).toBe(values);
  });

  it('converts a steam mass flow from t/h to lb/h (1000 kg per tonne, 0.453 592 37 kg per lb)', () => {
    const steam: RangeCheckValues = {
      ...defaultValues('si'),
      fluidKind: 'steam',
      flowUnitKey: 't/h',
      minimumFlow: '10',
    };
    const switched = switchUnits(steam, 'us');
    expect(switched.flowUnitKey).toBe('lb/h');
    expect(relative(switched.minimumFlow, 10_000 / POUND_KG)).toBeLessThan(1e-5);
  });

  it('keeps a mass flow unit as it is when the other system would show a volume', () => {
    const gasInMass: RangeCheckValues = { ...defaultValues('si'), flowUnitKey: 'kg/h', minimumFlow: '3600' };
    const switched = switchUnits(gasInMass, 'us');
    expect(switched.flowUnitKey).toBe('kg/h');
    expect(switched.minimumFlow).toBe('3600');
  });
});

describe('prefillFromMeterRun', () => {
  const run = meterRun({
    element: {
      kind: 'orifice',
      taps: 'corner',
      pipeDiameterM: 4.026 * 0.0254,
      boreDiameterM: 2 * 0.0254,
      pipeMaterial: 'carbon-steel',
    },
    fluid: { kind: 'natural-gas', composition: { methane: 0.9, ethane: 0.1 }, viscosityPaS: 1.1e-5 },
  });

  it('takes the site’s units and conditions and remembers the meter run', () => {
    const next = prefillFromMeterRun(defaultValues('si'), run, usSite, []);
    expect(next.displayUnits).toBe('us');
    expect(next.meterRunId).toBe('12');
    expect(next.atmosphericPressurePa).toBe(83_400);
    expect(next.basePressurePa).toBe(usSite.basePressurePa);
    expect(next.baseTemperatureK).toBe(usSite.baseTemperatureK);
  });

  it('shows the element’s diameters in the site’s length unit and keeps the fields the form does not edit', () => {
    const next = prefillFromMeterRun(defaultValues('si'), run, usSite, []);
    expect(next.elementKind).toBe('orifice');
    expect(next.taps).toBe('corner');
    expect(relative(next.pipeDiameter, 4.026)).toBeLessThan(1e-9);
    expect(relative(next.boreDiameter, 2)).toBeLessThan(1e-9);
    expect(next.coneDiameter).toBe('');
    expect(next.dischargeCoefficient).toBe('');
    expect(next.elementExtras).toEqual({ pipeMaterial: 'carbon-steel' });
  });

  it('writes the composition one component per line and the viscosity in mPa·s', () => {
    const next = prefillFromMeterRun(defaultValues('si'), run, usSite, []);
    expect(next.fluidKind).toBe('natural-gas');
    expect(next.composition).toBe('methane 0.9\nethane 0.1');
    expect(next.viscosity).toBe('0.011'); // 1.1e-5 Pa·s = 0.011 mPa·s (SI prefix milli)
    expect(next.isentropicExponent).toBe('');
  });

  it('takes the DP transmitters high range first, with their spans in the site’s DP unit', () => {
    const transmitters = [
      transmitter({ id: '1', stackRole: 'low', upperRange: 50, accuracyPercentOfSpan: 0.1 }),
      transmitter({ id: '2', measures: 'static-pressure', unit: 'psi', upperRange: 1500 }),
      transmitter({ id: '3', stackRole: 'high', upperRange: 250 }),
    ];
    const next = prefillFromMeterRun(defaultValues('si'), run, usSite, transmitters);
    expect(next.transmitters).toEqual([
      { span: '250', accuracy: '0.075' },
      { span: '50', accuracy: '0.1' },
    ]);
  });

  it('converts a DP transmitter ranged in kPa to inH2O (60 °F) on a US site', () => {
    const next = prefillFromMeterRun(defaultValues('si'), run, usSite, [
      transmitter({ unit: 'kPa', upperRange: 62.2 }),
    ]);
    expect(relative(next.transmitters[0].span, 62_200 / IN_H2O_60F_PA)).toBeLessThan(5e-5);
  });

  it('keeps the typed transmitters when the meter run has no DP transmitter', () => {
    const start = defaultValues('si');
    const next = prefillFromMeterRun(start, run, { ...usSite, displayUnits: 'si' }, []);
    expect(next.transmitters).toEqual(start.transmitters);
  });

  it('writes an ideal gas’s molar mass in g/mol and a liquid’s reference temperature in the site’s unit', () => {
    const gas = prefillFromMeterRun(
      defaultValues('si'),
      meterRun({ fluid: { kind: 'ideal-gas', molarMassKgPerMol: 0.028, compressibility: 0.99 } }),
      usSite,
      [],
    );
    expect(gas.molarMass).toBe('28');
    expect(gas.compressibility).toBe('0.99');
    const liquid = prefillFromMeterRun(
      defaultValues('si'),
      meterRun({
        fluid: { kind: 'liquid', densityKgPerM3: 850, referenceTemperatureK: 288.15, expansionPerK: 0.0009 },
      }),
      usSite,
      [],
    );
    // 850 kg/m³ in lb/ft³: 850 × 0.028316846592 / 0.45359237 = 53.0637 (NIST SP 811 exact factors).
    expect(relative(liquid.liquidDensity, (850 * CUBIC_FOOT_M3) / POUND_KG)).toBeLessThan(1e-6);
    expect(liquid.liquidReferenceTemperature).toBe('59'); // 15 °C = 59 °F
    // 0.0009 per K is 0.0005 per °F (a kelvin is 1.8 °F, ISO 80000-5).
    expect(liquid.liquidExpansion).toBe('0.0005');
  });

  it('takes an orifice meter run’s method and static tap, and ISO 5167-2 when it names none', () => {
    const api = prefillFromMeterRun(
      defaultValues('si'),
      meterRun({
        element: {
          kind: 'orifice',
          taps: 'flange',
          method: 'api-14.3',
          expansionReference: 'downstream',
          pipeDiameterM: 0.1023,
          boreDiameterM: 0.05,
        },
      }),
      usSite,
      [],
    );
    expect(api.orificeMethod).toBe('api-14.3');
    expect(api.expansionReference).toBe('downstream');
    expect(api.elementExtras).toEqual({});
    const iso = prefillFromMeterRun(api, run, usSite, []);
    expect(iso.orificeMethod).toBe('iso-5167-2');
    expect(iso.expansionReference).toBe('upstream');
  });

  it('moves a steam meter run to a mass flow unit', () => {
    const next = prefillFromMeterRun(defaultValues('si'), meterRun({ fluid: { kind: 'steam' } }), usSite, []);
    expect(next.flowUnitKey).toBe('lb/h');
  });
});

describe('prefillOperatingPoint', () => {
  const point: RecordedOperatingPoint = {
    hours: 24,
    minimumKgPerS: 0.5,
    normalKgPerS: 1,
    maximumKgPerS: 2,
    pressurePa: 4_000_000,
    temperatureK: 288.15,
    baseDensityKgPerM3: 0.8,
  };

  it('fills the conditions and the flows in the form’s units: 0.5 kg/s at 0.8 kg/m³ is 2250 m³/h', () => {
    const next = prefillOperatingPoint(defaultValues('si'), point);
    expect(next.staticPressure).toBe('4000');
    expect(next.temperature).toBe('15');
    expect(next.minimumFlow).toBe('2250');
    expect(next.normalFlow).toBe('4500');
    expect(next.maximumFlow).toBe('9000');
  });

  it('shows pressure as psig and temperature in °F on a US form', () => {
    const next = prefillOperatingPoint(defaultValues('us'), point);
    expect(relative(next.staticPressure, (4_000_000 - ATMOSPHERE_PA) / PSI_PA)).toBeLessThan(1e-5);
    expect(next.temperature).toBe('59');
  });

  it('keeps what was typed where the records say nothing', () => {
    const start = defaultValues('si');
    const next = prefillOperatingPoint(start, {
      ...point,
      pressurePa: null,
      temperatureK: null,
      baseDensityKgPerM3: null,
    });
    expect(next.staticPressure).toBe(start.staticPressure);
    expect(next.temperature).toBe(start.temperature);
    // Without a base density no volume can be shown, so the typed flows stay.
    expect(next.minimumFlow).toBe(start.minimumFlow);
  });

  it('shows mass flows without a base density: 1 kg/s is 3.6 t/h', () => {
    const next = prefillOperatingPoint(
      { ...defaultValues('si'), flowUnitKey: 't/h' },
      { ...point, baseDensityKgPerM3: null },
    );
    expect(next.normalFlow).toBe('3.6');
  });
});
