import { prepareCalibration } from './cone-discharge-coefficient';

describe('prepareCalibration (a lab curve of C against Re_D, linear in log Re_D)', () => {
  const curve = prepareCalibration([
    { reynoldsNumber: 1e6, dischargeCoefficient: 0.81 },
    { reynoldsNumber: 1e5, dischargeCoefficient: 0.8 },
  ]);

  it('returns the calibrated C at a calibration point', () => {
    expect(curve.dischargeCoefficientAt(1e5)).toBe(0.8);
    expect(curve.dischargeCoefficientAt(1e6)).toBe(0.81);
  });

  it('interpolates linearly in log10 Re_D: halfway in log (Re_D = 10^5.5) gives the mean C', () => {
    expect(curve.dischargeCoefficientAt(Math.pow(10, 5.5))).toBeCloseTo(0.805, 14);
  });

  it('clamps outside the calibrated range to the end points', () => {
    expect(curve.dischargeCoefficientAt(1e3)).toBe(0.8);
    expect(curve.dischargeCoefficientAt(1e8)).toBe(0.81);
    expect(curve.minimumReynoldsNumber).toBe(1e5);
    expect(curve.maximumReynoldsNumber).toBe(1e6);
  });

  it('rejects an empty curve and a non-positive Re_D, naming the field', () => {
    expect(() => prepareCalibration([])).toThrow(/element\.calibration/);
    expect(() => prepareCalibration([{ reynoldsNumber: 0, dischargeCoefficient: 0.8 }])).toThrow(
      /element\.calibration\.0\.reynoldsNumber/,
    );
  });
});
