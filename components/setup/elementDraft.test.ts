/**
 * Expected values: NIST SP 811 (2008), Appendix B.8, 1 in = 0.0254 m exactly; ISO 80000-5,
 * T/K = t/°C + 273.15.
 */
import type { ElementSpec } from '@/shared/flow/flow-types';
import { elementSpecSchema } from '@/shared/schemas/flow-case';
import {
  describeElement,
  draftFromElement,
  elementFromDraft,
  emptyElementDraft,
  parseCalibration,
} from './elementDraft';

describe('parseCalibration', () => {
  it('gives no curve for an empty field', () => {
    expect(parseCalibration('')).toBeUndefined();
    expect(parseCalibration(' \n \n')).toBeUndefined();
  });

  it('reads one "Re_D, C" pair per line, with commas, semicolons, tabs or spaces between', () => {
    expect(parseCalibration('100000, 0.6021\n2e5; 0.6030\r\n 300000\t0.6035 ')).toEqual([
      { reynoldsNumber: 100_000, dischargeCoefficient: 0.6021 },
      { reynoldsNumber: 200_000, dischargeCoefficient: 0.603 },
      { reynoldsNumber: 300_000, dischargeCoefficient: 0.6035 },
    ]);
  });

  it('marks a line that does not hold exactly two numbers with NaN, for the schema to name', () => {
    const [three, word, one] = parseCalibration('100000 0.6 7\nabc, 0.6\n100000') ?? [];
    expect(three.reynoldsNumber).toBeNaN();
    expect(three.dischargeCoefficient).toBeNaN();
    expect(word.reynoldsNumber).toBeNaN();
    expect(word.dischargeCoefficient).toBe(0.6);
    expect(one.reynoldsNumber).toBe(100_000);
    expect(one.dischargeCoefficient).toBeNaN();
  });
});

describe('elementFromDraft', () => {
  it('turns an orifice typed in inches into metres, with its taps and nothing of other kinds', () => {
    const spec = elementFromDraft({
      ...emptyElementDraft,
      lengthUnit: 'in',
      pipeDiameter: '4.026',
      boreDiameter: '2',
      taps: 'corner',
    });
    expect(spec).toEqual({ kind: 'orifice', taps: 'corner', pipeDiameterM: expect.any(Number), boreDiameterM: 0.0508 });
    expect(spec.pipeDiameterM).toBeCloseTo(0.1022604, 12);
  });

  it('gives a cone its cone diameter and no bore, and a venturi its type and no taps', () => {
    const cone = elementFromDraft({ ...emptyElementDraft, kind: 'cone', pipeDiameter: '100', coneDiameter: '80' });
    expect(cone.coneDiameterM).toBeCloseTo(0.08, 12);
    expect(cone).not.toHaveProperty('boreDiameterM');
    expect(cone).not.toHaveProperty('taps');
    const venturi = elementFromDraft({
      ...emptyElementDraft,
      kind: 'venturi',
      pipeDiameter: '100',
      boreDiameter: '50',
    });
    expect(venturi).toMatchObject({ kind: 'venturi', venturiType: 'machined' });
    expect(venturi).not.toHaveProperty('taps');
  });

  it('leaves a blank diameter undefined and a bad one NaN, for the schema to name', () => {
    const spec = elementFromDraft({ ...emptyElementDraft, pipeDiameter: '', boreDiameter: 'two' });
    expect(spec.pipeDiameterM).toBeUndefined();
    expect(spec.boreDiameterM).toBeNaN();
  });

  it('adds a fixed C, materials, a calibration curve and a reference temperature in K only when typed', () => {
    const plain = elementFromDraft({ ...emptyElementDraft, pipeDiameter: '100', boreDiameter: '50' });
    expect(Object.keys(plain).sort()).toEqual(['boreDiameterM', 'kind', 'pipeDiameterM', 'taps']);
    const full = elementFromDraft({
      ...emptyElementDraft,
      pipeDiameter: '100',
      boreDiameter: '50',
      dischargeCoefficient: '0.6',
      calibration: '1e5 0.6',
      pipeMaterial: 'carbon-steel',
      elementMaterial: 'stainless-316',
      referenceTemperatureC: '20',
    });
    expect(full).toMatchObject({
      dischargeCoefficient: 0.6,
      calibration: [{ reynoldsNumber: 100_000, dischargeCoefficient: 0.6 }],
      pipeMaterial: 'carbon-steel',
      elementMaterial: 'stainless-316',
    });
    expect(full.referenceTemperatureK).toBeCloseTo(293.15, 10);
  });
});

describe('elementFromDraft and draftFromElement: a fixed C from a calibration', () => {
  it('marks a typed fixed C as calibrated with its certificate U(C) and laboratory, and reads them back', () => {
    const spec = elementFromDraft({
      ...emptyElementDraft,
      kind: 'cone',
      pipeDiameter: '257.5',
      coneDiameter: '184',
      dischargeCoefficient: '0.81',
      fixedCoefficientSource: 'calibration',
      calibrationUncertaintyPercent: '0.5',
      calibrationLaboratory: ' Flow laboratory, certificate 2026-118 ',
    });
    expect(spec).toMatchObject({
      dischargeCoefficient: 0.81,
      dischargeCoefficientCalibrated: true,
      calibrationUncertaintyPercent: 0.5,
      calibrationLaboratory: 'Flow laboratory, certificate 2026-118',
    });
    expect(elementSpecSchema.safeParse(spec).success).toBe(true);
    expect(draftFromElement(spec as ElementSpec, 'mm')).toMatchObject({
      fixedCoefficientSource: 'calibration',
      calibrationUncertaintyPercent: '0.5',
      calibrationLaboratory: 'Flow laboratory, certificate 2026-118',
    });
  });

  it('leaves a fixed C not from a calibration unmarked', () => {
    const spec = elementFromDraft({
      ...emptyElementDraft,
      kind: 'cone',
      pipeDiameter: '257.5',
      coneDiameter: '184',
      dischargeCoefficient: '0.81',
    });
    expect(spec.dischargeCoefficientCalibrated).toBeUndefined();
    expect(spec.calibrationUncertaintyPercent).toBeUndefined();
  });
});

describe('draftFromElement', () => {
  const element: ElementSpec = {
    kind: 'orifice',
    taps: 'D-D/2',
    pipeDiameterM: 0.1022604,
    boreDiameterM: 0.0508,
    referenceTemperatureK: 293.15,
    calibration: [{ reynoldsNumber: 100_000, dischargeCoefficient: 0.6021 }],
  };

  it('shows the diameters in the chosen unit and the reference temperature in °C', () => {
    const draft = draftFromElement(element, 'in');
    expect(draft).toMatchObject({
      kind: 'orifice',
      taps: 'D-D/2',
      lengthUnit: 'in',
      pipeDiameter: '4.026',
      boreDiameter: '2',
      coneDiameter: '',
      dischargeCoefficient: '',
      calibration: '100000, 0.6021',
      referenceTemperatureC: '20',
    });
  });

  it('gives back the same element when the draft is read again', () => {
    const again = elementFromDraft(draftFromElement(element, 'mm'));
    expect(again.pipeDiameterM).toBeCloseTo(element.pipeDiameterM, 12);
    expect(again.boreDiameterM).toBeCloseTo(element.boreDiameterM as number, 12);
    expect(again.calibration).toEqual(element.calibration);
    expect(again.referenceTemperatureK).toBeCloseTo(293.15, 10);
  });
});

describe('describeElement', () => {
  it('sums up an orifice in the chosen unit', () => {
    const orifice: ElementSpec = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1023, boreDiameterM: 0.0511 };
    expect(describeElement(orifice, 'mm')).toBe('orifice, flange taps, D 102.3 mm, d 51.1 mm');
  });

  it('sums up a cone by its cone diameter', () => {
    const cone: ElementSpec = { kind: 'cone', pipeDiameterM: 0.1016, coneDiameterM: 0.0762 };
    expect(describeElement(cone, 'in')).toBe('cone, D 4 in, cone 3 in');
  });

  it('marks a missing diameter and a missing element', () => {
    expect(describeElement({ kind: 'venturi', venturiType: 'as-cast', pipeDiameterM: 0.2 }, 'mm')).toBe(
      'venturi, as-cast, D 200 mm, d ?',
    );
    expect(describeElement(undefined, 'mm')).toBe('no element');
  });
});

describe('the orifice method choice', () => {
  it('leaves ISO 5167-2 implicit, so an existing orifice reads back unchanged', () => {
    const spec = elementFromDraft({ ...emptyElementDraft, pipeDiameter: '100', boreDiameter: '50' });
    expect(spec).not.toHaveProperty('method');
    expect(spec).not.toHaveProperty('expansionReference');
    const draft = draftFromElement({ kind: 'orifice', taps: 'flange', pipeDiameterM: 0.1, boreDiameterM: 0.05 }, 'mm');
    expect(draft.method).toBe('iso-5167-2');
    expect(draft.expansionReference).toBe('upstream');
  });

  it('carries API 14.3 and the downstream tap there and back, and names the method in lists', () => {
    const spec = elementFromDraft({
      ...emptyElementDraft,
      pipeDiameter: '100',
      boreDiameter: '50',
      method: 'api-14.3',
      expansionReference: 'downstream',
    });
    expect(spec.method).toBe('api-14.3');
    expect(spec.expansionReference).toBe('downstream');
    const draft = draftFromElement(spec as ElementSpec, 'mm');
    expect(draft.method).toBe('api-14.3');
    expect(draft.expansionReference).toBe('downstream');
    expect(describeElement(spec as ElementSpec, 'mm')).toBe('orifice, flange taps, API 14.3, D 100 mm, d 50 mm');
  });

  it('gives a venturi no method even when the draft still holds API 14.3', () => {
    const venturi = elementFromDraft({
      ...emptyElementDraft,
      kind: 'venturi',
      method: 'api-14.3',
      pipeDiameter: '100',
    });
    expect(venturi).not.toHaveProperty('method');
    expect(venturi).not.toHaveProperty('expansionReference');
  });
});
