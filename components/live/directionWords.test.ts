/**
 * The live card's direction of flow in words (issue 13 §11): an arrow and words, never a bare
 * sign; a one-way meter run speaks only when it sees reverse flow. The alarm title is the one
 * the product decided ("Reverse flow on a one-way meter run").
 */
import { directionWords } from './flowFigures';

describe('directionWords', () => {
  it('says "→ Forward flow" on a bi-directional meter run flowing forward', () => {
    expect(directionWords('forward', true)).toBe('→ Forward flow');
  });

  it('says "← Reverse flow" on a bi-directional meter run flowing in reverse', () => {
    expect(directionWords('reverse', true)).toBe('← Reverse flow');
  });

  it('names the one-way meter run’s matter when it sees reverse flow', () => {
    expect(directionWords('reverse', false)).toBe('← Reverse flow on a one-way meter run');
  });

  it('says nothing on a one-way meter run flowing forward, with no direction or from an older server', () => {
    expect(directionWords('forward', false)).toBeNull();
    expect(directionWords(null, false)).toBeNull();
    expect(directionWords(undefined, false)).toBeNull();
  });

  it('says there is no direction now on a bi-directional meter run with no flow or no fresh reading', () => {
    const words = 'No flow direction now (no flow or no fresh reading)';
    expect(directionWords(null, true)).toBe(words);
    expect(directionWords(undefined, true)).toBe(words);
  });
});
