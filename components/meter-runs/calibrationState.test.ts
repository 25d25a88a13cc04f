import { calibrationState } from './calibrationState';

describe('calibrationState', () => {
  it('says when no due date is recorded', () => {
    expect(calibrationState(null, '2026-03-03')).toEqual({ text: 'not recorded', abnormal: false });
  });

  it('marks an overdue calibration as abnormal, with a shape and the days overdue', () => {
    expect(calibrationState('2026-03-01', '2026-03-03')).toEqual({
      text: '⚑ 2026-03-01, overdue by 2 days',
      abnormal: true,
    });
    expect(calibrationState('2026-03-02', '2026-03-03')).toEqual({
      text: '⚑ 2026-03-02, overdue by 1 day',
      abnormal: true,
    });
  });

  it('reminds in words, not as abnormal, within 30 days of the due date', () => {
    expect(calibrationState('2026-03-03', '2026-03-03')).toEqual({ text: '2026-03-03 (in 0 days)', abnormal: false });
    expect(calibrationState('2026-03-04', '2026-03-03')).toEqual({ text: '2026-03-04 (in 1 day)', abnormal: false });
    expect(calibrationState('2026-04-02', '2026-03-03')).toEqual({ text: '2026-04-02 (in 30 days)', abnormal: false });
  });

  it('shows a date further off as it is', () => {
    expect(calibrationState('2026-04-03', '2026-03-03')).toEqual({ text: '2026-04-03', abnormal: false });
  });

  it('counts calendar days, 29 February included in a leap year (Gregorian calendar)', () => {
    expect(calibrationState('2028-03-01', '2028-02-28').text).toBe('2028-03-01 (in 2 days)');
    expect(calibrationState('2027-03-01', '2027-02-28').text).toBe('2027-03-01 (in 1 day)');
  });

  it('shows a date it cannot read as it came', () => {
    expect(calibrationState('next spring', '2026-03-03')).toEqual({ text: 'next spring', abnormal: false });
  });
});
