import { formatTimestamp } from './formatTimestamp';

describe('formatTimestamp', () => {
  it('shows an instant with its date, seconds and the viewer’s zone named', () => {
    const text = formatTimestamp('2025-03-03T14:05:22Z');
    expect(text).toMatch(/2025/);
    // Every zone in use today is offset by whole minutes, so the seconds show as they are.
    expect(text).toMatch(/:22\b/);
    const zone = new Intl.DateTimeFormat(undefined, { timeZoneName: 'short' })
      .formatToParts(new Date('2025-03-03T14:05:22Z'))
      .find((part) => part.type === 'timeZoneName')?.value;
    expect(text).toContain(zone);
  });

  it('shows text that is not a date unchanged', () => {
    expect(formatTimestamp('not a date')).toBe('not a date');
    expect(formatTimestamp('')).toBe('');
  });
});
