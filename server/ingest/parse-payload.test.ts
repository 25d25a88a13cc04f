import fc from 'fast-check';
import { parsePayload } from './parse-payload';
import { validateReading } from './validate-reading';
import type { CatalogTransmitter } from './catalog';

/**
 * Issue 12 "What to prove": the MQTT payload parser takes any bytes and answers with readings or a
 * reason, never a throw; a reading is then kept or refused on its own, so good readings beside bad
 * ones in one message are kept. Seeded (tests/support/fast-check-seed.ts); the seed is printed on failure.
 */
const now = Date.parse('2026-12-02T12:00:00Z');
const transmitter: CatalogTransmitter = {
  id: '7',
  tag: 'DP-1',
  meterRunId: '3',
  siteId: '1',
  siteCode: 'S',
  timeZone: 'UTC',
  measures: 'differential-pressure',
  unit: 'Pa',
  pressureReference: 'gauge',
  lowerRange: 0,
  upperRange: 25_000,
  atmosphericPressurePa: 101_325,
};

/** The parser and the per-reading check as the ingest runs them: every reading kept or refused with a reason. */
function ingestOutcome(payload: Buffer | string) {
  const raw = parsePayload(payload);
  if (typeof raw === 'string') return { refused: raw, kept: [], reasons: [] as string[] };
  const checked = raw.map((r) => validateReading(r, transmitter, now));
  return {
    refused: null,
    kept: checked.filter((c) => typeof c !== 'string'),
    reasons: checked.filter((c): c is string => typeof c === 'string'),
  };
}

const goodReading = fc.record({
  t: fc.oneof(
    fc.integer({ min: Date.UTC(2020, 0, 1), max: now }),
    fc.integer({ min: Date.UTC(2020, 0, 1), max: now }).map((ms) => new Date(ms).toISOString()),
  ),
  v: fc.double({ min: 0, max: 20_000, noNaN: true }),
  q: fc.constantFrom('good', 'uncertain', 'bad', 'substituted'),
});
const badReading = fc.oneof(
  fc.record({
    t: fc.constantFrom('yesterday', '2026-12-02T10:00:00', null, 1.5),
    v: fc.double(),
    q: fc.constant('good'),
  }),
  fc.record({ t: fc.constant(now - 1000), v: fc.constantFrom('twelve', 'NaN', '', '1,5', '0x10', null, [], {}) }),
  fc.record({ t: fc.constant(now - 1000), v: fc.constant(1), q: fc.string({ minLength: 13, maxLength: 30 }) }),
  fc.record({ t: fc.constant(now + 3_600_000), v: fc.constant(1) }),
  fc.record({ t: fc.constant(now - 1000), v: fc.constant(1), u: fc.constantFrom('furlong', 'degF', 'psi?') }),
);

describe('parsePayload', () => {
  it('refuses an epoch time beyond the dates a clock can hold with a reason, instead of throwing', () => {
    // Found by the property below: `new Date(8640000000000001).toISOString()` throws a RangeError.
    expect(ingestOutcome('[{"t":8640000000000001,"v":1},{"t":-8640000000000001,"v":1}]').reasons).toEqual([
      'time: 8640000000000001 is beyond the dates a clock can hold',
      'time: -8640000000000001 is beyond the dates a clock can hold',
    ]);
  });

  it('refuses a stray number, text, null or array among the readings alone and keeps the good readings beside it', () => {
    const good = { t: now - 1000, v: 12.5, q: 'good' };
    const outcome = ingestOutcome(JSON.stringify([good, 5, 'twelve', null, [1, 2], { ...good, v: 13 }]));
    expect(outcome.refused).toBeNull();
    expect(outcome.kept.map((k) => k.value)).toEqual([12.5, 13]);
    expect(outcome.reasons).toEqual(Array(4).fill('reading: must be an object { "t", "v", "q" }'));
  });

  it('answers any bytes with readings or a reason, and the readings each with a reading or a reason, never a throw', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.uint8Array({ maxLength: 512 }).map((bytes) => Buffer.from(bytes)),
          fc.string({ unit: 'grapheme', maxLength: 200 }),
          fc.jsonValue({ maxDepth: 4 }).map((v) => JSON.stringify(v) ?? 'null'),
          fc
            .array(fc.dictionary(fc.constantFrom('t', 'v', 'q', 'u', 'x'), fc.jsonValue({ maxDepth: 2 })), {
              maxLength: 20,
            })
            .map((a) => JSON.stringify(a)),
        ),
        (payload) => {
          const outcome = ingestOutcome(payload);
          if (outcome.refused !== null) expect(outcome.refused).toMatch(/^payload: /);
          for (const reason of outcome.reasons) expect(reason).toMatch(/^(time|value|quality|unit|reading)\b/);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('keeps every good reading of a message beside bad ones, and gives a reason for each bad one', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.oneof(
            goodReading.map((r) => ({ good: true, r })),
            badReading.map((r) => ({ good: false, r })),
          ),
          {
            minLength: 1,
            maxLength: 40,
          },
        ),
        (items) => {
          const outcome = ingestOutcome(JSON.stringify(items.map((i) => i.r)));
          expect(outcome.refused).toBeNull();
          const good = items.filter((i) => i.good);
          expect(outcome.kept.map((k) => k.value)).toEqual(good.map((i) => i.r.v));
          expect(outcome.reasons).toHaveLength(items.length - good.length);
        },
      ),
      { numRuns: 200 },
    );
  });
});
