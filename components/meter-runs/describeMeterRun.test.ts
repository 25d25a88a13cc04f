/**
 * β = d/D (ISO 5167-1, 3.3.2.1); for a cone, the equivalent β = √(1 − dc²/D²) (ISO 5167-5).
 * At the element's reference temperature (20 °C unless given) no thermal expansion applies.
 */
import { betaOf, elementName, fluidDetail, fluidName } from './describeMeterRun';

describe('betaOf', () => {
  it('gives an orifice’s β as d/D: 50 mm in 100 mm is 0.5', () => {
    expect(betaOf({ kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1, boreDiameterM: 0.05 })).toBeCloseTo(0.5, 12);
  });

  it('gives a cone’s β as √(1 − dc²/D²): an 80 mm cone in 100 mm is 0.6', () => {
    expect(betaOf({ kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.08 })).toBeCloseTo(0.6, 12);
  });

  it('gives null when the geometry is incomplete', () => {
    expect(betaOf({ kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1 })).toBeNull();
  });
});

describe('elementName', () => {
  it('names the element and its taps or type', () => {
    expect(elementName({ kind: 'orifice', taps: 'D-D/2', pipeDiameterM: 0.1 })).toBe('Orifice, D and D/2 taps');
    expect(elementName({ kind: 'venturi', venturiType: 'rough-welded', pipeDiameterM: 0.1 })).toBe(
      'Venturi, rough-welded',
    );
    expect(elementName({ kind: 'nozzle', nozzleType: 'isa-1932', pipeDiameterM: 0.1 })).toBe('Nozzle, ISA 1932');
  });

  it('says whether a cone is calibrated', () => {
    const cone = { kind: 'cone' as const, pipeDiameterM: 0.1, coneDiameterM: 0.08 };
    expect(elementName(cone)).toBe('Cone, uncalibrated');
    expect(elementName({ ...cone, calibration: [{ reynoldsNumber: 1e5, dischargeCoefficient: 0.8 }] })).toBe(
      'Cone, calibrated',
    );
  });
});

describe('fluidName and fluidDetail', () => {
  it('names each kind of fluid', () => {
    expect(fluidName({ kind: 'natural-gas', composition: { methane: 1 } })).toBe('Natural gas');
    expect(fluidName({ kind: 'steam' })).toBe('Steam');
  });

  it('lists a natural gas’s four largest components in mol %, largest first, and counts the rest', () => {
    const composition = {
      nitrogen: 0.01,
      methane: 0.914,
      ethane: 0.0421,
      propane: 0.02,
      'n-butane': 0.0089,
      'carbon-dioxide': 0.005,
    };
    expect(fluidDetail({ kind: 'natural-gas', composition })).toBe(
      'methane 91.4 %, ethane 4.21 %, propane 2.00 %, nitrogen 1.00 % and 2 more (mole fractions)',
    );
    expect(fluidDetail({ kind: 'natural-gas', composition: { methane: 1 } })).toBe('methane 100 % (mole fractions)');
  });

  it('gives an ideal gas’s molar mass in g/mol and a liquid’s density with its temperature in °C', () => {
    expect(fluidDetail({ kind: 'ideal-gas', molarMassKgPerMol: 0.018015 })).toBe('molar mass 18.02 g/mol, Z 1');
    expect(
      fluidDetail({ kind: 'liquid', densityKgPerM3: 998.2, referenceTemperatureK: 293.15, expansionPerK: 0 }),
    ).toBe('998.2 kg/m³ at 20.0 °C');
    expect(fluidDetail({ kind: 'water' })).toBe('IAPWS-IF97 properties');
  });
});
