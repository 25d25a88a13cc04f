import { formatAge, formatFigure, formatShare } from './formatFigure';

/**
 * formatFigure groups digits in the viewer's own locale, so the expected text is written in
 * en-US and its separators swapped for this machine's.
 */
function local(enUS: string): string {
  const parts = new Intl.NumberFormat(undefined).formatToParts(12_345.6);
  const group = parts.find((part) => part.type === 'group')?.value ?? ',';
  const decimal = parts.find((part) => part.type === 'decimal')?.value ?? '.';
  return enUS.replace(/[,.]/g, (c) => (c === ',' ? group : decimal));
}

describe('formatFigure', () => {
  it('shows no decimals from 100 up, with grouped thousands', () => {
    expect(formatFigure(1234.5)).toBe(local('1,235'));
    expect(formatFigure(250)).toBe(local('250'));
    expect(formatFigure(-150.4)).toBe(local('-150'));
  });

  it('shows one decimal from 10, two from 1 and three below 1', () => {
    expect(formatFigure(12.345)).toBe(local('12.3'));
    expect(formatFigure(5)).toBe(local('5.00'));
    expect(formatFigure(0.4567)).toBe(local('0.457'));
  });

  it('shows zero as 0 and a non-finite figure as a dash', () => {
    expect(formatFigure(0)).toBe('0');
    expect(formatFigure(Number.NaN)).toBe('—');
    expect(formatFigure(Number.NEGATIVE_INFINITY)).toBe('—');
  });
});

describe('formatAge', () => {
  it('shows seconds below a minute, rounded', () => {
    expect(formatAge(8)).toBe('8 s');
    expect(formatAge(8.4)).toBe('8 s');
    expect(formatAge(59.4)).toBe('59 s');
  });

  it('shows whole minutes below an hour', () => {
    expect(formatAge(59.6)).toBe('1 min');
    expect(formatAge(180)).toBe('3 min');
    expect(formatAge(3599)).toBe('59 min');
  });

  it('shows hours and minutes below two days', () => {
    expect(formatAge(7500)).toBe('2 h 5 min');
    expect(formatAge(7200)).toBe('2 h');
    expect(formatAge(47 * 3600)).toBe('47 h');
  });

  it('shows days and hours from two days on', () => {
    expect(formatAge(48 * 3600)).toBe('2 d');
    expect(formatAge(76 * 3600 + 59)).toBe('3 d 4 h');
  });

  it('shows a negative age (a clock ahead of the server) as 0 s and a non-finite one as a dash', () => {
    expect(formatAge(-5)).toBe('0 s');
    expect(formatAge(Number.POSITIVE_INFINITY)).toBe('—');
  });
});

describe('formatShare', () => {
  it('shows a share of span as a whole percent from 10 % up', () => {
    expect(formatShare(0.42)).toBe('42 %');
    expect(formatShare(1.234)).toBe('123 %');
  });

  it('shows one decimal below 10 %, where a reading low in range matters most', () => {
    expect(formatShare(0.054)).toBe('5.4 %');
    expect(formatShare(0)).toBe('0.0 %');
  });
});
