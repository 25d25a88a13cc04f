import type { ElementSpec } from '../flow/flow-types';
import { prepareElement } from '../flow/prepare-element';
import { elementDischargeCoefficientUncertaintyPercent } from './sample-uncertainty';

/**
 * U(C) of a cone with one fixed C. Expected values are the configured certificate figure and the
 * default of ISO 5167-5:2016 for a cone that is not calibrated, C = 0.82 with 5 % (TRADE.md §6
 * table "C, cone not calibrated", quoted there from ISO 5167-5 [mem]; not read off the code).
 */
describe('elementDischargeCoefficientUncertaintyPercent', () => {
  const cone: ElementSpec = { kind: 'cone', pipeDiameterM: 0.2575, coneDiameterM: 0.184, dischargeCoefficient: 0.81 };
  const uC = (spec: ElementSpec) =>
    elementDischargeCoefficientUncertaintyPercent(prepareElement(spec, 293.15), spec, 1e6);

  it('takes U(C) = 0.5 % for a cone whose fixed C comes from a calibration stated at 0.5 % (k = 2)', () => {
    expect(
      uC({
        ...cone,
        dischargeCoefficientCalibrated: true,
        calibrationUncertaintyPercent: 0.5,
        calibrationLaboratory: 'Flow laboratory, certificate 2026-118',
      }),
    ).toBe(0.5);
    expect(uC({ ...cone, dischargeCoefficientCalibrated: true, calibrationUncertaintyPercent: 0.3 })).toBe(0.3);
  });

  it('keeps the uncalibrated default of 5 % for a fixed C not marked as calibrated', () => {
    expect(uC(cone)).toBe(5);
    expect(uC({ ...cone, dischargeCoefficientCalibrated: false })).toBe(5);
  });
});
