import { flowCaseErrorFromEngine, parseFlowCase } from './flow-case';

const good = {
  element: {
    kind: 'orifice',
    taps: 'flange',
    pipeDiameterM: 0.1,
    boreDiameterM: 0.05,
    referenceTemperatureK: 293.15,
    pipeExpansionPerK: 1.116e-5,
    elementExpansionPerK: 1.665e-5,
  },
  fluid: { kind: 'natural-gas', composition: { methane: 0.965222, ethane: 0.034778 } },
  conditions: { differentialPressurePa: 25000, staticPressurePa: 6e6, temperatureK: 293.15 },
  base: { pressurePa: 101325, temperatureK: 288.15 },
};

function fieldOf(value: unknown): string | null {
  const r = parseFlowCase(value);
  if (r.ok) throw new Error('expected a schema failure');
  expect(r.error.code).toBe('invalid_case');
  return r.error.field;
}

describe('flowCaseSchema', () => {
  it('accepts the case of DESIGN.md', () => {
    expect(parseFlowCase(good).ok).toBe(true);
  });

  it('accepts each element kind with its own fields and a cone calibration curve', () => {
    const cases = [
      { kind: 'venturi', venturiType: 'as-cast', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
      { kind: 'nozzle', nozzleType: 'long-radius', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
      {
        kind: 'cone',
        pipeDiameterM: 0.2,
        coneDiameterM: 0.14,
        calibration: [
          { reynoldsNumber: 1e5, dischargeCoefficient: 0.8 },
          { reynoldsNumber: 1e6, dischargeCoefficient: 0.81 },
        ],
      },
      {
        kind: 'cone',
        pipeDiameterM: 0.2,
        coneDiameterM: 0.14,
        dischargeCoefficient: 0.8,
        pipeMaterial: 'carbon-steel',
        elementMaterial: 'stainless-316',
      },
    ];
    for (const element of cases) expect(parseFlowCase({ ...good, element }).ok).toBe(true);
  });

  it('names element.boreDiameterM when the bore is not below the pipe diameter', () => {
    expect(fieldOf({ ...good, element: { ...good.element, boreDiameterM: 0.1 } })).toBe('element.boreDiameterM');
  });

  it('names element.boreDiameterM when it is not a number', () => {
    expect(fieldOf({ ...good, element: { ...good.element, boreDiameterM: '50 mm' } })).toBe('element.boreDiameterM');
  });

  it('names element.coneDiameterM when the cone is not below the pipe diameter', () => {
    expect(fieldOf({ ...good, element: { kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.12 } })).toBe(
      'element.coneDiameterM',
    );
  });

  it('requires taps for an orifice, the type for a venturi and a nozzle', () => {
    expect(fieldOf({ ...good, element: { kind: 'orifice', pipeDiameterM: 0.1, boreDiameterM: 0.05 } })).toBe(
      'element.taps',
    );
    expect(fieldOf({ ...good, element: { kind: 'venturi', pipeDiameterM: 0.1, boreDiameterM: 0.05 } })).toBe(
      'element.venturiType',
    );
    expect(fieldOf({ ...good, element: { kind: 'nozzle', pipeDiameterM: 0.1, boreDiameterM: 0.05 } })).toBe(
      'element.nozzleType',
    );
  });

  it('rejects both a fixed C and a calibration curve', () => {
    expect(
      fieldOf({
        ...good,
        element: {
          kind: 'cone',
          pipeDiameterM: 0.1,
          coneDiameterM: 0.07,
          dischargeCoefficient: 0.8,
          calibration: [{ reynoldsNumber: 1e5, dischargeCoefficient: 0.8 }],
        },
      }),
    ).toBe('element.calibration');
  });

  it('requires a composition for natural gas whose fractions add up to 1', () => {
    expect(fieldOf({ ...good, fluid: { kind: 'natural-gas' } })).toBe('fluid.composition');
    expect(fieldOf({ ...good, fluid: { kind: 'natural-gas', composition: { methane: 0.5 } } })).toBe(
      'fluid.composition',
    );
  });

  it('accepts every spelling the fluids module accepts and gives the canonical names (carbon dioxide, CO2, Carbon Dioxide)', () => {
    const gas = (carbonDioxide: string) => ({
      ...good,
      fluid: { kind: 'natural-gas', composition: { Methane: 0.9, [carbonDioxide]: 0.05, 'i-butane': 0.05 } },
    });
    for (const spelling of ['carbon-dioxide', 'carbon dioxide', 'CO2', 'Carbon Dioxide', 'carbon_dioxide']) {
      const r = parseFlowCase(gas(spelling));
      expect(r.ok && r.value.fluid.kind === 'natural-gas' && r.value.fluid.composition).toEqual({
        methane: 0.9,
        'carbon-dioxide': 0.05,
        isobutane: 0.05,
      });
    }
  });

  it('refuses an unknown component at fluid.composition.<name>, listing close matches', () => {
    const r = parseFlowCase({
      ...good,
      fluid: { kind: 'natural-gas', composition: { methane: 0.9, 'carbon dioxid': 0.1 } },
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.field).toBe('fluid.composition.carbon dioxid');
    expect(r.error.message).toMatch(/unknown component "carbon dioxid" \(did you mean carbon-dioxide/);
  });

  it('refuses one component given twice under two spellings, naming the second', () => {
    expect(
      fieldOf({
        ...good,
        fluid: { kind: 'natural-gas', composition: { methane: 0.9, CO2: 0.05, 'Carbon Dioxide': 0.05 } },
      }),
    ).toBe('fluid.composition.Carbon Dioxide');
  });

  it('takes a fixed C from a calibration only with its certificate U(C), and a laboratory only with a calibration', () => {
    const cone = { kind: 'cone', pipeDiameterM: 0.2, coneDiameterM: 0.14, dischargeCoefficient: 0.81 };
    expect(
      parseFlowCase({
        ...good,
        element: {
          ...cone,
          dischargeCoefficientCalibrated: true,
          calibrationUncertaintyPercent: 0.5,
          calibrationLaboratory: 'Flow laboratory, certificate 2026-118',
        },
      }).ok,
    ).toBe(true);
    expect(fieldOf({ ...good, element: { ...cone, dischargeCoefficientCalibrated: true } })).toBe(
      'element.calibrationUncertaintyPercent',
    );
    expect(fieldOf({ ...good, element: { ...cone, calibrationUncertaintyPercent: 0.5 } })).toBe(
      'element.calibrationUncertaintyPercent',
    );
    expect(fieldOf({ ...good, element: { ...cone, calibrationLaboratory: 'Lab' } })).toBe(
      'element.calibrationLaboratory',
    );
    const { dischargeCoefficient: _c, ...noC } = cone;
    expect(
      fieldOf({
        ...good,
        element: { ...noC, dischargeCoefficientCalibrated: true, calibrationUncertaintyPercent: 0.5 },
      }),
    ).toBe('element.dischargeCoefficient');
  });

  it('requires the molar mass of an ideal gas and the density line of a liquid', () => {
    expect(fieldOf({ ...good, fluid: { kind: 'ideal-gas' } })).toBe('fluid.molarMassKgPerMol');
    expect(fieldOf({ ...good, fluid: { kind: 'liquid', densityKgPerM3: 850, referenceTemperatureK: 288.15 } })).toBe(
      'fluid.expansionPerK',
    );
  });

  it('names fluid.kind for an unknown fluid', () => {
    expect(fieldOf({ ...good, fluid: { kind: 'oil' } })).toBe('fluid.kind');
  });

  it('names conditions.differentialPressurePa when the DP is not below the absolute static pressure, and a missing conditions object', () => {
    expect(
      fieldOf({ ...good, conditions: { differentialPressurePa: 7e6, staticPressurePa: 6e6, temperatureK: 293.15 } }),
    ).toBe('conditions.differentialPressurePa');
    expect(fieldOf({ ...good, conditions: { ...good.conditions, temperatureK: -5 } })).toBe('conditions.temperatureK');
    const { conditions: _omitted, ...noConditions } = good;
    expect(fieldOf(noConditions)).toBe('conditions');
  });

  it('gives a null field for a case that is not an object', () => {
    expect(fieldOf([1, 2])).toBeNull();
  });
});

describe('flowCaseErrorFromEngine', () => {
  it('picks the field path out of an engine message', () => {
    expect(
      flowCaseErrorFromEngine(new Error('prepareElement: element.nozzleType is required for this element kind')),
    ).toEqual({
      code: 'invalid_case',
      message: 'prepareElement: element.nozzleType is required for this element kind',
      field: 'element.nozzleType',
    });
  });

  it('gives a null field when the message names none', () => {
    expect(flowCaseErrorFromEngine('something odd').field).toBeNull();
  });
});
