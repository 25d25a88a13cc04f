/** Sizes use the SI decimal prefixes (kilo = 10³, mega = 10⁶, giga = 10⁹; IEC 80000-13). */
import { formatBytes, formatCount } from './ImportsFormat';

describe('formatBytes', () => {
  it('shows sizes with decimal prefixes', () => {
    expect(formatBytes(0)).toBe('0 B');
    expect(formatBytes(812)).toBe('812 B');
    expect(formatBytes(999)).toBe('999 B');
    expect(formatBytes(1000)).toBe('1.0 kB');
    expect(formatBytes(14_200)).toBe('14.2 kB');
    expect(formatBytes(3_500_000)).toBe('3.5 MB');
    expect(formatBytes(2_500_000_000)).toBe('2.50 GB');
  });

  it('shows a dash for a size that cannot be', () => {
    expect(formatBytes(-1)).toBe('—');
    expect(formatBytes(Number.NaN)).toBe('—');
  });
});

describe('formatCount', () => {
  it('groups the digits of a count as the viewer’s locale does', () => {
    const group = new Intl.NumberFormat(undefined).formatToParts(12_400).find((p) => p.type === 'group')?.value ?? '';
    expect(formatCount(12_400)).toBe(`12${group}400`);
    expect(formatCount(7)).toBe('7');
  });
});
