import fc from 'fast-check';
import { cachedHourStartOf } from './hour-start-cache';
import { hourStartOf } from '../../shared/history/contract-day';

describe('cachedHourStartOf', () => {
  it.each(['UTC', 'America/Denver', 'Europe/Berlin', 'Asia/Kolkata', 'Asia/Kathmandu', 'Australia/Adelaide'])(
    'gives the same hour start as the calendar for any instant in %s, DST days included',
    (zone) => {
      const cached = cachedHourStartOf();
      fc.assert(
        fc.property(
          fc.integer({ min: Date.UTC(2020, 0, 1), max: Date.UTC(2030, 0, 1) }),
          (t) => cached(t, zone) === hourStartOf(t, zone),
        ),
        { numRuns: 2000 },
      );
    },
  );
});
