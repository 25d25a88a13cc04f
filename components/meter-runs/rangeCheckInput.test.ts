/**
 * The range check form as typed: which field a problem lands on and what it says, and the SI
 * case the form becomes. Expected numbers come from outside the code:
 * - NIST SP 811 (2008), Appendix B.8: 1 in = 0.0254 m exactly; 1 psi = 6894.757 Pa;
 *   1 inH2O (60 °F) = 248.84 Pa; 1 ft³ = 0.028316846592 m³ exactly.
 * - ISO 80000-5: T/K = t/°C + 273.15; t/°F = 1.8 t/°C + 32.
 * - ISO 2533 (standard atmosphere): air of molar mass 28.96442 g/mol has a density of
 *   1.225 kg/m³ at 288.15 K and 101 325 Pa.
 * - An hour is 3600 s and a day 86 400 s by definition.
 */
import { runRangeCheck, type RangeCheckRun } from './rangeCheckInput';
import { defaultValues, type RangeCheckValues } from './rangeCheckValues';

const PSI_PA = 6894.757; // NIST SP 811
const IN_H2O_60F_PA = 248.84; // NIST SP 811
const CUBIC_FOOT_M3 = 0.028316846592; // exact
const POUND_KG = 0.45359237; // exact
const ATMOSPHERE_PA = 101_325; // exact by definition

const relative = (actual: number, expected: number) => Math.abs(actual / expected - 1);

/** The SI default case with some fields changed. */
function si(change: Partial<RangeCheckValues> = {}): RangeCheckValues {
  return { ...defaultValues('si'), ...change };
}

/** Runs a case the test expects to run, failing with its problems otherwise. */
function runOf(values: RangeCheckValues): RangeCheckRun {
  const { problems, run } = runRangeCheck(values);
  expect(problems).toEqual({});
  if (!run) throw new Error('expected a run');
  return run;
}

describe('runRangeCheck on the default cases', () => {
  it('runs the SI default case: 154.05 mm and 77.03 mm in metres, 4000 kPa abs in Pa, 15 °C in K', () => {
    const { input } = runOf(si());
    expect(input.element).toMatchObject({ kind: 'orifice', taps: 'flange' });
    expect(input.element.pipeDiameterM).toBeCloseTo(0.15405, 12);
    expect(input.element.boreDiameterM).toBeCloseTo(0.07703, 12);
    expect(input.conditions.staticPressurePa).toBeCloseTo(4_000_000, 6);
    expect(input.conditions.temperatureK).toBeCloseTo(288.15, 10);
    expect(input.transmitters).toEqual([{ spanPa: 50_000, accuracyPercentOfSpan: 0.075, unit: 'kPa' }]);
    expect(input.uncertaintyLimitPercent).toBe(1);
  });

  it('turns the SI flows in m³/h at base conditions into kg/s with the fluid’s base density', () => {
    const run = runOf(si());
    const density = run.baseDensityKgPerM3 as number;
    expect(run.flowUnit.key).toBe('m3/h');
    expect((run.input.flowRange.minimumKgPerS / density) * 3600).toBeCloseTo(2000, 6);
    expect((run.input.flowRange.normalKgPerS / density) * 3600).toBeCloseTo(10_000, 6);
    expect((run.input.flowRange.maximumKgPerS / density) * 3600).toBeCloseTo(20_000, 6);
  });

  it('runs the US default case: inches, psig above the atmosphere, °F and inH2O (60 °F) into SI', () => {
    const { input } = runOf(defaultValues('us'));
    expect(input.element.pipeDiameterM).toBeCloseTo(6.065 * 0.0254, 12);
    expect(input.element.boreDiameterM).toBeCloseTo(3.0325 * 0.0254, 12);
    expect(relative(input.conditions.staticPressurePa, 565 * PSI_PA + ATMOSPHERE_PA)).toBeLessThan(1e-6);
    expect(input.conditions.temperatureK).toBeCloseTo((60 - 32) / 1.8 + 273.15, 10);
    expect(relative(input.transmitters[0].spanPa, 200 * IN_H2O_60F_PA)).toBeLessThan(5e-5);
    expect(input.transmitters[0].unit).toBe('inH2O-60F');
  });

  it('reads US flows in Mscf/d (1000 ft³ per 86 400 s)', () => {
    const run = runOf(defaultValues('us'));
    const density = run.baseDensityKgPerM3 as number;
    expect(run.flowUnit.key).toBe('Mscf/d');
    const mscfPerDay = (run.input.flowRange.minimumKgPerS / density / (1000 * CUBIC_FOOT_M3)) * 86_400;
    expect(mscfPerDay).toBeCloseTo(1500, 6);
  });

  it('gives air as an ideal gas the ISO 2533 sea-level density of 1.225 kg/m³ at 15 °C and 101.325 kPa', () => {
    const run = runOf(si({ fluidKind: 'ideal-gas', molarMass: '28.96442', compressibility: '' }));
    expect(run.input.fluid).toEqual({ kind: 'ideal-gas', molarMassKgPerMol: 0.02896442 });
    // ISO 2533 gives ρ0 = 1.225 kg/m³ to four figures.
    expect(relative(run.baseDensityKgPerM3 as number, 1.225)).toBeLessThan(5e-4);
  });

  it('reads a mass flow unit without any density: 3600 kg/h is 1 kg/s', () => {
    const run = runOf(si({ flowUnitKey: 'kg/h', minimumFlow: '3600', normalFlow: '7200', maximumFlow: '36000' }));
    expect(run.input.flowRange).toEqual({ minimumKgPerS: 1, normalKgPerS: 2, maximumKgPerS: 10 });
  });
});

describe('runRangeCheck reading numbers as typed', () => {
  it('says "Enter a number." for a blank field that needs one', () => {
    const { problems, run } = runRangeCheck(si({ pipeDiameter: '  ' }));
    expect(problems).toEqual({ pipeDiameter: 'Enter a number.' });
    expect(run).toBeNull();
  });

  it('quotes what was typed when it is not a number', () => {
    expect(runRangeCheck(si({ temperature: 'warm' })).problems).toEqual({ temperature: '“warm” is not a number.' });
    expect(runRangeCheck(si({ boreDiameter: '77.03 mm' })).problems).toEqual({
      boreDiameter: '“77.03 mm” is not a number.',
    });
  });

  it('ignores blanks around a number', () => {
    expect(runOf(si({ pipeDiameter: ' 154.05 ' })).input.element.pipeDiameterM).toBeCloseTo(0.15405, 12);
  });

  it('reads a comma as a thousands separator, so "4,000" kPa is 4 000 000 Pa', () => {
    expect(runOf(si({ staticPressure: '4,000' })).input.conditions.staticPressurePa).toBeCloseTo(4_000_000, 6);
  });

  it('refuses a decimal comma instead of reading "4,5" kPa as 45 kPa', () => {
    expect(runRangeCheck(si({ staticPressure: '4,5' })).problems).toEqual({
      staticPressure: '“4,5” is not a number.',
    });
    expect(runRangeCheck(si({ pipeDiameter: '154,05' })).problems).toEqual({
      pipeDiameter: '“154,05” is not a number.',
    });
  });

  it('reads exponents, so "4e3" kPa is 4 000 000 Pa', () => {
    expect(runOf(si({ staticPressure: '4e3' })).input.conditions.staticPressurePa).toBeCloseTo(4_000_000, 6);
  });

  it('names every field at fault at once', () => {
    const { problems } = runRangeCheck(si({ pipeDiameter: '', temperature: 'x', minimumFlow: '' }));
    expect(problems).toEqual({
      pipeDiameter: 'Enter a number.',
      temperature: '“x” is not a number.',
      minimumFlow: 'Enter a number.',
    });
  });
});

describe('runRangeCheck on the element', () => {
  it('says a bore as large as the pipe must be smaller, in the form’s own unit', () => {
    expect(runRangeCheck(si({ boreDiameter: '160' })).problems).toEqual({
      boreDiameter: 'Must be smaller than the pipe diameter D (154.05 mm).',
    });
    expect(runRangeCheck({ ...defaultValues('us'), boreDiameter: '7' }).problems).toEqual({
      boreDiameter: 'Must be smaller than the pipe diameter D (6.065 in).',
    });
  });

  it('takes a blank discharge coefficient as the standard’s and a typed one as fixed', () => {
    expect(runOf(si()).input.element.dischargeCoefficient).toBeUndefined();
    expect(runOf(si({ dischargeCoefficient: '0.605' })).input.element.dischargeCoefficient).toBe(0.605);
  });

  it('asks a cone for its cone diameter and not for a bore', () => {
    const { problems } = runRangeCheck(si({ elementKind: 'cone', boreDiameter: 'ignored', coneDiameter: '' }));
    expect(problems).toEqual({ coneDiameter: 'Enter a number.' });
  });

  it('sends a cone’s diameter in metres and no bore', () => {
    const { element } = runOf(si({ elementKind: 'cone', coneDiameter: '110' })).input;
    expect(element.coneDiameterM).toBeCloseTo(0.11, 12);
    expect(element.boreDiameterM).toBeUndefined();
    expect(element.taps).toBeUndefined();
  });
});

describe('runRangeCheck on the fluid', () => {
  it('reads one component per line, with a space, a colon or an equals sign, in any case', () => {
    const run = runOf(si({ composition: 'Methane: 0.9\n\n  carbon dioxide = 0.1  ' }));
    expect(run.input.fluid).toEqual({ kind: 'natural-gas', composition: { methane: 0.9, 'carbon-dioxide': 0.1 } });
  });

  it('also reads components separated by semicolons', () => {
    const run = runOf(si({ composition: 'methane 0.95; ethane 0.05' }));
    expect(run.input.fluid).toEqual({ kind: 'natural-gas', composition: { methane: 0.95, ethane: 0.05 } });
  });

  it('shows how to write a component when a line is not a name and a number', () => {
    expect(runRangeCheck(si({ composition: 'methane 0.95\nethane lots' })).problems).toEqual({
      composition: 'Write one component per line, e.g. "methane 0.965222" (not "ethane lots").',
    });
  });

  it('says mole fractions must add up to 1', () => {
    expect(runRangeCheck(si({ composition: 'methane 0.5\nethane 0.1' })).problems).toEqual({
      composition: 'mole fractions must add up to 1 (within 0.01)',
    });
  });

  it('reads gas components in every spelling the fluids module accepts and gives the same range as kebab-case names', () => {
    const kebab = runOf(si({ composition: 'methane 0.95\ncarbon-dioxide 0.02\nnitrogen 0.03' }));
    for (const text of [
      'Methane 0.95\ncarbon dioxide 0.02\nN2 0.03',
      'methane 0.95\nCO2 0.02\nnitrogen 0.03',
      'methane 0.95\nCarbon Dioxide 0.02\nnitrogen 0.03',
    ]) {
      const run = runOf(si({ composition: text }));
      expect(run.input.fluid).toEqual(kebab.input.fluid);
    }
  });

  it('refuses one component given twice under two spellings', () => {
    const { problems } = runRangeCheck(si({ composition: 'methane 0.96\nCO2 0.02\ncarbon dioxide 0.02' }));
    expect(problems.composition).toMatch(/carbon-dioxide is given twice/);
  });

  it('names the composition when the engine does not know a component', () => {
    const { problems } = runRangeCheck(si({ composition: 'methane 0.5\nunobtainium 0.5' }));
    expect(Object.keys(problems)).toEqual(['composition']);
    expect(problems.composition).toMatch(/unknown component "unobtainium"/);
  });

  it('reads viscosity in mPa·s, so 0.011 is 1.1e-5 Pa·s (SI prefix milli)', () => {
    const fluid = runOf(si({ viscosity: '0.011' })).input.fluid as { viscosityPaS?: number };
    expect(fluid.viscosityPaS).toBeCloseTo(1.1e-5, 15);
  });

  it('names the viscosity when it is not above zero', () => {
    expect(runRangeCheck(si({ viscosity: '-1' })).problems).toEqual({ viscosity: 'viscosityPaS must be > 0' });
  });

  it('asks an ideal gas for its molar mass in g/mol, and sends it in kg/mol', () => {
    expect(runRangeCheck(si({ fluidKind: 'ideal-gas', molarMass: '' })).problems).toEqual({
      molarMass: 'Enter a number.',
    });
    const fluid = runOf(si({ fluidKind: 'ideal-gas', molarMass: '16.043' })).input.fluid as {
      molarMassKgPerMol: number;
    };
    expect(fluid.molarMassKgPerMol).toBeCloseTo(0.016043, 12);
  });

  it('asks a liquid for its reference temperature and expansion, reading the temperature in the display unit', () => {
    const liquid = { fluidKind: 'liquid', flowUnitKey: 't/h', minimumFlow: '10', normalFlow: '50', maximumFlow: '100' };
    expect(
      runRangeCheck(si({ ...liquid, liquidReferenceTemperature: '', liquidExpansion: '' } as Partial<RangeCheckValues>))
        .problems,
    ).toEqual({ liquidReferenceTemperature: 'Enter a number.', liquidExpansion: 'Enter a number.' });
    const fluid = runOf({ ...defaultValues('us'), ...liquid, liquidReferenceTemperature: '68' } as RangeCheckValues)
      .input.fluid as { referenceTemperatureK: number };
    expect(fluid.referenceTemperatureK).toBeCloseTo(293.15, 10); // 68 °F = 20 °C (ISO 80000-5)
  });

  it('reads a US liquid’s density in lb/ft³ and its expansion per °F, and sends kg/m³ and per K', () => {
    const liquid = {
      fluidKind: 'liquid',
      flowUnitKey: 'lb/h',
      minimumFlow: '1e4',
      normalFlow: '5e4',
      maximumFlow: '1e5',
    };
    const fluid = runOf({
      ...defaultValues('us'),
      ...liquid,
      liquidDensity: '62.428',
      liquidExpansion: '0.0001',
    } as RangeCheckValues).input.fluid as { densityKgPerM3: number; expansionPerK: number };
    // 62.428 lb/ft³ × 0.45359237 kg/lb / 0.028316846592 m³/ft³ = 999.999 kg/m³ (NIST SP 811 exact factors).
    expect(relative(fluid.densityKgPerM3, (62.428 * POUND_KG) / CUBIC_FOOT_M3)).toBeLessThan(1e-12);
    expect(fluid.densityKgPerM3).toBeCloseTo(1000, 1);
    expect(fluid.expansionPerK).toBeCloseTo(0.00018, 15); // 0.0001 per °F × 1.8 °F per K (ISO 80000-5)
  });
});

describe('runRangeCheck on the orifice method', () => {
  it('sends no method for ISO 5167-2, the schema’s default', () => {
    const { input } = runOf(si());
    expect(input.element).not.toHaveProperty('method');
    expect(input.element).not.toHaveProperty('expansionReference');
  });

  it('sends API MPMS 14.3 with the static tap a what-if chose', () => {
    const { input } = runOf(si({ orificeMethod: 'api-14.3', expansionReference: 'downstream' }));
    expect(input.element).toMatchObject({
      kind: 'orifice',
      taps: 'flange',
      method: 'api-14.3',
      expansionReference: 'downstream',
    });
  });

  it('says API MPMS 14.3 covers flange taps only when corner taps are chosen with it', () => {
    const { problems, run } = runRangeCheck(si({ orificeMethod: 'api-14.3', taps: 'corner' }));
    expect(run).toBeNull();
    expect(problems.elementKind).toMatch(/taps must be flange for method api-14\.3/);
  });

  it('gives a different C under API MPMS 14.3 than under ISO 5167-2 for the same plate, within 0.5 % (ISO 5167-2 §5.3.3.1)', () => {
    const iso = runOf(si()).result.flows[1];
    const api = runOf(si({ orificeMethod: 'api-14.3' })).result.flows[1];
    expect(api.differentialPressurePa).not.toBe(iso.differentialPressurePa);
    expect(relative(api.differentialPressurePa, iso.differentialPressurePa)).toBeLessThan(0.01);
  });

  it('sends nothing of the orifice method for another element', () => {
    const { input } = runOf(si({ elementKind: 'venturi', orificeMethod: 'api-14.3' }));
    expect(input.element).not.toHaveProperty('method');
  });
});

describe('runRangeCheck on the operating conditions', () => {
  it('says a US gauge pressure below a vacuum leaves no absolute pressure', () => {
    // The span is then above the static pressure too, and may be said as well.
    expect(runRangeCheck({ ...defaultValues('us'), staticPressure: '-20' }).problems).toMatchObject({
      staticPressure: 'The absolute pressure must be above zero.',
    });
  });

  it('says a temperature below absolute zero is below absolute zero', () => {
    expect(runRangeCheck(si({ temperature: '-300' })).problems).toEqual({ temperature: 'Below absolute zero.' });
  });

  it('puts a span above the static pressure on the transmitter with the largest span', () => {
    const transmitters = [
      { span: '50', accuracy: '0.075' },
      { span: '100', accuracy: '0.075' },
    ];
    expect(runRangeCheck(si({ staticPressure: '80', transmitters })).problems).toEqual({
      span1: 'The span must be below the absolute static pressure.',
    });
  });

  it('names the maximum flow when the largest flow would need a DP above the static pressure', () => {
    const { problems } = runRangeCheck(si({ boreDiameter: '10' }));
    expect(Object.keys(problems)).toEqual(['maximumFlow']);
    expect(problems.maximumFlow).toMatch(/would need a DP of at least/);
  });
});

describe('runRangeCheck on the transmitters', () => {
  it('says a span of zero must be above zero', () => {
    expect(runRangeCheck(si({ transmitters: [{ span: '0', accuracy: '0.075' }] })).problems).toEqual({
      span0: 'The span must be above zero.',
    });
  });

  it('names the accuracy of the transmitter at fault', () => {
    const transmitters = [
      { span: '50', accuracy: '0.075' },
      { span: '10', accuracy: '12' },
    ];
    expect(runRangeCheck(si({ transmitters })).problems).toEqual({
      accuracy1: 'must be between 0 and 10 % of span',
    });
  });

  it('asks for each transmitter’s span and accuracy', () => {
    expect(runRangeCheck(si({ transmitters: [{ span: '', accuracy: 'a' }] })).problems).toEqual({
      span0: 'Enter a number.',
      accuracy0: '“a” is not a number.',
    });
  });

  it('keeps a stacked pair in SI, each in the site’s DP unit', () => {
    const transmitters = [
      { span: '200', accuracy: '0.075' },
      { span: '50', accuracy: '0.1' },
    ];
    const spans = runOf({ ...defaultValues('us'), transmitters }).input.transmitters.map((t) => t.spanPa);
    expect(relative(spans[0], 200 * IN_H2O_60F_PA)).toBeLessThan(5e-5);
    expect(relative(spans[1], 50 * IN_H2O_60F_PA)).toBeLessThan(5e-5);
  });
});

describe('runRangeCheck on the flows and the limit', () => {
  it('says a flow must be above zero', () => {
    expect(runRangeCheck(si({ minimumFlow: '0' })).problems).toEqual({ minimumFlow: 'The flow must be above zero.' });
  });

  it('says the normal flow must not be below the minimum', () => {
    expect(runRangeCheck(si({ minimumFlow: '3000', normalFlow: '2500' })).problems).toEqual({
      normalFlow: 'The normal flow must not be below the minimum.',
    });
  });

  it('says the maximum flow must not be below the normal flow', () => {
    expect(runRangeCheck(si({ maximumFlow: '9000' })).problems).toEqual({
      maximumFlow: 'The maximum flow must not be below the normal flow.',
    });
  });

  it.each(['0', '100', '-1'])('refuses an uncertainty limit of %s %%', (limit) => {
    expect(runRangeCheck(si({ uncertaintyLimit: limit })).problems).toEqual({
      uncertaintyLimit: 'Give a limit between 0 and 100 %.',
    });
  });
});
