import { configDifference } from './config-difference';

// Every expected value below is written by hand from the two configurations beside it.

const orifice = {
  kind: 'orifice',
  taps: 'flange',
  pipeDiameterM: 0.1023,
  boreDiameterM: 0.05,
};

describe('configDifference', () => {
  it('finds nothing between two equal configurations, whatever order their keys were written in', () => {
    expect(
      configDifference(
        { element: orifice, fluid: { kind: 'steam' } },
        {
          fluid: { kind: 'steam' },
          element: { boreDiameterM: 0.05, pipeDiameterM: 0.1023, taps: 'flange', kind: 'orifice' },
        },
      ),
    ).toEqual([]);
  });

  it('names a re-measured bore by its nested path, with the value before and after', () => {
    expect(
      configDifference(
        { element: orifice, fluid: { kind: 'steam' } },
        { element: { ...orifice, boreDiameterM: 0.048 }, fluid: { kind: 'steam' } },
      ),
    ).toEqual([{ path: 'element.boreDiameterM', before: 0.05, after: 0.048 }]);
  });

  it('reports a difference in the last digit exactly, without a tolerance', () => {
    expect(configDifference({ boreDiameterM: 0.05 }, { boreDiameterM: 0.0500001 })).toEqual([
      { path: 'boreDiameterM', before: 0.05, after: 0.0500001 },
    ]);
  });

  it('lists several changes in path order, keys sorted', () => {
    expect(
      configDifference(
        { element: orifice, fluid: { kind: 'steam' } },
        { element: { ...orifice, taps: 'corner', pipeDiameterM: 0.1 }, fluid: { kind: 'water' } },
      ),
    ).toEqual([
      { path: 'element.pipeDiameterM', before: 0.1023, after: 0.1 },
      { path: 'element.taps', before: 'flange', after: 'corner' },
      { path: 'fluid.kind', before: 'steam', after: 'water' },
    ]);
  });

  it('gives an added key null before and a removed key null after', () => {
    expect(
      configDifference(
        { element: { kind: 'cone', dischargeCoefficient: 0.82 } },
        { element: { kind: 'cone', pipeExpansionPerK: 1.2e-5 } },
      ),
    ).toEqual([
      { path: 'element.dischargeCoefficient', before: 0.82, after: null },
      { path: 'element.pipeExpansionPerK', before: null, after: 1.2e-5 },
    ]);
  });

  it('reports an added object leaf by leaf, with null before each', () => {
    expect(
      configDifference(
        { element: { kind: 'cone' } },
        { element: { kind: 'cone', calibration: { dischargeCoefficient: 0.8, reynoldsNumber: 2e5 } } },
      ),
    ).toEqual([
      { path: 'element.calibration.dischargeCoefficient', before: null, after: 0.8 },
      { path: 'element.calibration.reynoldsNumber', before: null, after: 2e5 },
    ]);
  });

  it('compares arrays item by item, by index, with null for items beyond the shorter one', () => {
    expect(
      configDifference(
        {
          fluid: {
            composition: [
              { component: 'methane', moleFraction: 0.9 },
              { component: 'ethane', moleFraction: 0.1 },
            ],
          },
        },
        {
          fluid: {
            composition: [
              { component: 'methane', moleFraction: 0.88 },
              { component: 'ethane', moleFraction: 0.1 },
              { component: 'propane', moleFraction: 0.02 },
            ],
          },
        },
      ),
    ).toEqual([
      { path: 'fluid.composition.0.moleFraction', before: 0.9, after: 0.88 },
      { path: 'fluid.composition.2.component', before: null, after: 'propane' },
      { path: 'fluid.composition.2.moleFraction', before: null, after: 0.02 },
    ]);
  });

  it('reports a value that changed kind, or an empty object added, as a whole', () => {
    expect(configDifference({ a: 5, b: [1], c: null }, { a: { x: 1 }, b: { 0: 1 }, c: {} })).toEqual([
      { path: 'a', before: 5, after: { x: 1 } },
      { path: 'b', before: [1], after: { 0: 1 } },
      { path: 'c', before: null, after: {} },
    ]);
  });

  it('treats a field set to null like a missing one, and false and 0 as values', () => {
    expect(configDifference({ a: null, b: false, c: 0 }, { b: true, c: null })).toEqual([
      { path: 'b', before: false, after: true },
      { path: 'c', before: 0, after: null },
    ]);
  });

  it('refuses a number JSON cannot hold, naming its path', () => {
    expect(() => configDifference({ element: { boreDiameterM: 0.05 } }, { element: { boreDiameterM: NaN } })).toThrow(
      'configDifference: element.boreDiameterM is NaN',
    );
  });
});
