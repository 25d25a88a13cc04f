import { validateReading } from './validate-reading';
import type { CatalogTransmitter } from './catalog';

const now = Date.parse('2026-12-02T12:00:00Z');
const base: CatalogTransmitter = {
  id: '7',
  tag: 'PT-1',
  meterRunId: '3',
  siteId: '1',
  siteCode: 'S',
  timeZone: 'UTC',
  measures: 'static-pressure',
  unit: 'psi',
  pressureReference: 'gauge',
  lowerRange: 0,
  upperRange: 1000,
  atmosphericPressurePa: 84_000,
};

describe('validateReading', () => {
  it('accepts an ISO time with an offset and converts it to epoch milliseconds', () => {
    expect(validateReading({ time: '2026-12-02T05:00:00-07:00', value: 250 }, base, now)).toMatchObject({
      timeMs: Date.parse('2026-12-02T12:00:00Z'),
      value: 250,
      quality: 0,
    });
  });

  it('accepts epoch milliseconds and a quality name in any letter case', () => {
    expect(validateReading({ time: now - 1000, value: '12.5', quality: 'Substituted' }, base, now)).toMatchObject({
      timeMs: now - 1000,
      value: 12.5,
      quality: 3,
    });
  });

  it.each([
    [{ time: '2026-12-02T05:00:00', value: 1 }, /^time: .*offset/],
    [{ time: '2026-12-02', value: 1 }, /^time: .*offset/],
    [{ time: now + 3_600_000, value: 1 }, /^time: .*future/],
    [{ time: now, value: 'NaN' }, /^value: .*not a number/],
    [{ time: now, value: 'ten' }, /^value: .*not a number/],
    [{ time: now, value: null }, /^value: .*not a number/],
    [{ time: now, value: 1, quality: 'excellent' }, /^quality: /],
    [{ time: now, value: 1, unit: 'kPa' }, /^unit: .*psi/],
  ])('refuses %j naming the field', (raw, message) => {
    expect(validateReading(raw, base, now)).toMatch(message);
  });

  it('refuses a gauge pressure below minus the atmospheric pressure (a negative absolute pressure)', () => {
    // 84 kPa of atmosphere is 12.18 psi (84000 / 6894.757); -13 psig would be below vacuum.
    expect(validateReading({ time: now, value: -13 }, base, now)).toMatch(/negative absolute pressure/);
    expect(validateReading({ time: now, value: -12 }, base, now)).toMatchObject({ value: -12 });
  });

  it('refuses a temperature at or below absolute zero (−459.67 °F)', () => {
    const tt: CatalogTransmitter = { ...base, measures: 'temperature', unit: 'degF' };
    expect(validateReading({ time: now, value: -460 }, tt, now)).toMatch(/absolute zero/);
    expect(validateReading({ time: now, value: -40 }, tt, now)).toMatchObject({ value: -40 });
  });

  it('refuses a reading from before the meter run history starts, naming the start', () => {
    const started = { ...base, historyStartMs: Date.parse('2026-11-01T07:00:00Z') };
    expect(validateReading({ time: '2026-11-01T06:59:59Z', value: 1 }, started, now)).toBe(
      'time: 2026-11-01T06:59:59.000Z is before the history of the meter run of PT-1 starts (2026-11-01T07:00:00.000Z)',
    );
    expect(validateReading({ time: '2026-11-01T07:00:00Z', value: 1 }, started, now)).toMatchObject({
      timeMs: Date.parse('2026-11-01T07:00:00Z'),
    });
  });

  it('carries how long the reading may stand for with it, so the hours it feeds can be queued', () => {
    expect(validateReading({ time: now - 1000, value: 1 }, { ...base, reachS: 90 }, now)).toMatchObject({
      reachS: 90,
    });
  });
});
