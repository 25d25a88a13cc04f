import { standardSpanAtOrBelow } from './standard-span';

describe('standardSpanAtOrBelow', () => {
  it.each([
    [27.3, 25],
    [100, 100],
    [99.9, 75],
    [180, 150],
    [0.037, 0.03],
    [4400, 4000],
  ])('rounds %p down to %p', (value, expected) => {
    expect(standardSpanAtOrBelow(value)).toBe(expected);
  });
});
