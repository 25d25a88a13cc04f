import { parseTimeWindow } from './params';

describe('parseTimeWindow', () => {
  it('reads a plain date with a contract hour as the contract day that starts on it, in the site zone', () => {
    // By hand: US daylight saving time ends at 02:00 on Sunday 1 November 2026 (first Sunday of
    // November, Energy Policy Act of 2005), so at America/Denver 09:00 on 1 November is MST, UTC−7:
    // 16:00Z; 09:00 on 3 November is 16:00Z too.
    expect(
      parseTimeWindow(
        { from: '2026-11-01', to: '2026-11-03' },
        { maxDays: 31, timeZone: 'America/Denver', contractHour: 9 },
      ),
    ).toEqual({ fromMs: Date.parse('2026-11-01T16:00:00Z'), toMs: Date.parse('2026-11-03T16:00:00Z') });
  });

  it('reads a plain date at a half-hour zone: 06:00 on 1 November at Asia/Kolkata (UTC+05:30) is 00:30Z', () => {
    expect(
      parseTimeWindow(
        { from: '2026-11-01', to: '2026-11-02' },
        { maxDays: 31, timeZone: 'Asia/Kolkata', contractHour: 6 },
      ),
    ).toEqual({ fromMs: Date.parse('2026-11-01T00:30:00Z'), toMs: Date.parse('2026-11-02T00:30:00Z') });
  });

  it('reads a plain date without a contract hour as the local midnight that starts it', () => {
    // 31 October 2026 00:00 at America/Denver is MDT, UTC−6: 06:00Z.
    expect(
      parseTimeWindow({ from: '2026-10-31', to: '2026-11-01' }, { maxDays: 31, timeZone: 'America/Denver' }).fromMs,
    ).toBe(Date.parse('2026-10-31T06:00:00Z'));
  });

  it('leaves an instant with an offset as it is, whatever the contract hour', () => {
    expect(
      parseTimeWindow(
        { from: '2026-11-01T00:00:00Z', to: '2026-11-02T00:00:00Z' },
        { maxDays: 31, timeZone: 'America/Denver', contractHour: 9 },
      ),
    ).toEqual({ fromMs: Date.parse('2026-11-01T00:00:00Z'), toMs: Date.parse('2026-11-02T00:00:00Z') });
  });

  it('refuses a window whose end is not after its start, naming to', () => {
    expect(() =>
      parseTimeWindow({ from: '2026-11-02', to: '2026-11-02' }, { maxDays: 31, timeZone: 'UTC', contractHour: 0 }),
    ).toThrow('to: must be after from');
  });
});
