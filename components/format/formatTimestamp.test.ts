import { formatTimestamp } from './formatTimestamp';

describe('formatTimestamp', () => {
  it('shows an instant in the site’s zone with the zone named, the month in letters', () => {
    // America/Denver is UTC−7 (MST) in March before the second Sunday (US Energy Policy Act of 2005).
    expect(formatTimestamp('2025-03-03T14:05:22Z', 'America/Denver')).toBe('3 Mar 2025, 07:05 MST');
  });

  it('falls back to the viewer’s zone, named, when the screen knows no site', () => {
    const text = formatTimestamp('2025-03-03T14:05:22Z');
    expect(text).toMatch(/^\d{1,2} Mar 2025, \d{2}:\d{2} \S+$/);
  });

  it('shows text that is not a date unchanged', () => {
    expect(formatTimestamp('not a date')).toBe('not a date');
    expect(formatTimestamp('')).toBe('');
  });
});
