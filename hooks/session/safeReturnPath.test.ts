import { safeReturnPath } from './safeReturnPath';

describe('safeReturnPath', () => {
  it('follows a path inside the app', () => {
    expect(safeReturnPath('/alarms')).toBe('/alarms');
    expect(safeReturnPath('/meter-runs/42?window=24h')).toBe('/meter-runs/42?window=24h');
  });

  it('takes the first of repeated parameters', () => {
    expect(safeReturnPath(['/totals', '/users'])).toBe('/totals');
  });

  it('refuses anything that could leave the app: another origin, a protocol-relative or backslashed path', () => {
    expect(safeReturnPath('https://elsewhere.example/')).toBeUndefined();
    expect(safeReturnPath('//elsewhere.example/alarms')).toBeUndefined();
    expect(safeReturnPath('/\\elsewhere.example')).toBeUndefined();
    expect(safeReturnPath('javascript:alert(1)')).toBeUndefined();
  });

  it('does not return to the sign-in screen itself', () => {
    expect(safeReturnPath('/sign-in')).toBeUndefined();
    expect(safeReturnPath('/sign-in?next=/alarms')).toBeUndefined();
  });

  it('gives nothing when there is no path', () => {
    expect(safeReturnPath(undefined)).toBeUndefined();
    expect(safeReturnPath('')).toBeUndefined();
    expect(safeReturnPath([])).toBeUndefined();
  });
});
