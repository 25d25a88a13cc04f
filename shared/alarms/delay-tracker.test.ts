import { initialDelayTracker, observeCondition } from './delay-tracker';

// Expected times are worked by hand from the definition of on- and off-delays (ISA-18.2).
const delays = { onDelayMs: 300_000, offDelayMs: 60_000 };

describe('observeCondition', () => {
  it('raises once the condition has held for the on-delay, at onset + on-delay', () => {
    const s = initialDelayTracker();
    expect(observeCondition(s, true, 1_000_000, delays)).toEqual([]);
    expect(observeCondition(s, true, 1_200_000, delays)).toEqual([]);
    expect(observeCondition(s, true, 1_400_000, delays)).toEqual([
      { kind: 'raise', timeMs: 1_300_000, onsetMs: 1_000_000 },
    ]);
  });

  it('cancels a pending raise when the condition goes away within the on-delay', () => {
    const s = initialDelayTracker();
    observeCondition(s, true, 0, delays);
    observeCondition(s, false, 200_000, delays);
    expect(observeCondition(s, false, 10_000_000, delays)).toEqual([]);
    expect(s.active).toBe(false);
  });

  it('clears at end + off-delay, and not at all when the condition returns within the off-delay', () => {
    const s = initialDelayTracker();
    observeCondition(s, true, 0, delays);
    observeCondition(s, true, 300_000, delays);
    expect(s.active).toBe(true);
    observeCondition(s, false, 400_000, delays);
    expect(observeCondition(s, true, 430_000, delays)).toEqual([]); // back within 60 s: still one alarm
    observeCondition(s, false, 500_000, delays);
    expect(observeCondition(s, false, 600_000, delays)).toEqual([{ kind: 'clear', timeMs: 560_000, onsetMs: 500_000 }]);
  });

  it('holds its state when the condition cannot be judged (null)', () => {
    const s = initialDelayTracker();
    observeCondition(s, true, 0, { onDelayMs: 0, offDelayMs: 0 });
    expect(observeCondition(s, null, 5_000, { onDelayMs: 0, offDelayMs: 0 })).toEqual([]);
    expect(s.active).toBe(true);
  });

  it('raises at once with no on-delay', () => {
    const s = initialDelayTracker();
    expect(observeCondition(s, true, 42, { onDelayMs: 0, offDelayMs: 0 })).toEqual([
      { kind: 'raise', timeMs: 42, onsetMs: 42 },
    ]);
  });

  it('survives a JSON round trip (the state is stored as jsonb)', () => {
    const s = initialDelayTracker();
    const copy = JSON.parse(JSON.stringify(s));
    expect(observeCondition(copy, true, 1_000, delays)).toEqual([]);
    expect(observeCondition(copy, true, 301_000, delays)).toEqual([{ kind: 'raise', timeMs: 301_000, onsetMs: 1_000 }]);
  });
});
