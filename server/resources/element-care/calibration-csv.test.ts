import { parseCalibrationCsv } from './calibration-csv';

const messageOf = (f: () => unknown) => {
  try {
    f();
  } catch (err) {
    return (err as Error).message;
  }
  return 'no error';
};

describe('parseCalibrationCsv', () => {
  it('reads the points under the header, in plain and exponent notation, skipping blank lines and CRLF', () => {
    const csv = 'reynoldsNumber,dischargeCoefficient\r\n5e4,0.801\r\n\r\n150000,0.8032\r\n1.2E6, 0.8050 \r\n';
    expect(parseCalibrationCsv(csv)).toEqual([
      { reynoldsNumber: 50000, dischargeCoefficient: 0.801 },
      { reynoldsNumber: 150000, dischargeCoefficient: 0.8032 },
      { reynoldsNumber: 1200000, dischargeCoefficient: 0.805 },
    ]);
  });

  it('names the line of a bad header, a bad number, a C above 1.2 and a repeated Re_D', () => {
    expect(messageOf(() => parseCalibrationCsv('re,c\n1e5,0.8\n'))).toMatch(/^pointsCsv: line 1: the header/);
    expect(messageOf(() => parseCalibrationCsv('reynoldsNumber,dischargeCoefficient\n1e5,0.8\n2e5,0,8\n'))).toMatch(
      /^pointsCsv: line 3: expected 2 fields/,
    );
    expect(messageOf(() => parseCalibrationCsv('reynoldsNumber,dischargeCoefficient\nabc,0.8\n'))).toMatch(
      /^pointsCsv: line 2: reynoldsNumber/,
    );
    expect(messageOf(() => parseCalibrationCsv('reynoldsNumber,dischargeCoefficient\n1e5,1.3\n'))).toMatch(
      /^pointsCsv: line 2: dischargeCoefficient/,
    );
    expect(messageOf(() => parseCalibrationCsv('reynoldsNumber,dischargeCoefficient\n1e5,0.8\n100000,0.81\n'))).toMatch(
      /^pointsCsv: line 3: a second point/,
    );
  });

  it('refuses a header without points', () => {
    expect(messageOf(() => parseCalibrationCsv('reynoldsNumber,dischargeCoefficient\n'))).toMatch(
      /no calibration points/,
    );
  });
});
