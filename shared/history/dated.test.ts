import { inEffectAt, versionInstantsWithin } from './dated';

const v = (effectiveFromMs: number, name: string) => ({ effectiveFromMs, name });

describe('inEffectAt', () => {
  const versions = [v(100, 'a'), v(200, 'b'), v(200, 'b2'), v(300, 'c')];

  it('gives the last version effective at or before the instant, the later written of two at one instant', () => {
    expect(inEffectAt(versions, 150).name).toBe('a');
    expect(inEffectAt(versions, 200).name).toBe('b2');
    expect(inEffectAt(versions, 10_000).name).toBe('c');
  });

  it('gives the first version before any takes effect (history before the first is computed with it)', () => {
    expect(inEffectAt(versions, 0).name).toBe('a');
  });

  it('refuses an empty list, naming it', () => {
    expect(() => inEffectAt([], 0)).toThrow(/versions must not be empty/);
  });
});

describe('versionInstantsWithin', () => {
  it('lists the instants strictly inside the span, from every list, sorted and once each', () => {
    expect(
      versionInstantsWithin(
        [
          [v(0, ''), v(30, '')],
          [v(30, ''), v(10, ''), v(60, '')],
        ],
        0,
        60,
      ),
    ).toEqual([10, 30]);
  });
});
