import { gaussianAt, seedOfText, uniformAt } from './seeded-noise';

describe('seeded noise', () => {
  it('hashes "a" to 0xe40c292c with 32-bit FNV-1a (the FNV reference test vector [mem])', () => {
    expect(seedOfText('a')).toBe(0xe40c292c);
    expect(seedOfText('foobar')).toBe(0xbf9cf968); // FNV reference test vector [mem]; python check agrees
    expect(seedOfText('')).toBe(0x811c9dc5); // the offset basis itself
  });

  it('gives the same number for the same seed and counter, in any order', () => {
    const seed = seedOfText('KFG-101-DPH');
    const forward = [1, 2, 3, 1_793_509_200].map((c) => uniformAt(seed, c));
    const backward = [1_793_509_200, 3, 2, 1].map((c) => uniformAt(seed, c)).reverse();
    expect(forward).toEqual(backward);
  });

  it('draws uniforms in [0, 1) with mean 1/2 and variance 1/12 (the uniform distribution), within sampling error over 100 000 draws', () => {
    const seed = seedOfText('uniform');
    let sum = 0;
    let sumSq = 0;
    let outside = 0;
    const n = 100_000;
    for (let i = 0; i < n; i++) {
      const u = uniformAt(seed, 1_790_000_000 + i);
      if (!(u >= 0 && u < 1)) outside++;
      sum += u;
      sumSq += u * u;
    }
    expect(outside).toBe(0);
    const mean = sum / n;
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.005); // 5 standard errors: sqrt(1/12/n) = 0.0009
    expect(Math.abs(sumSq / n - mean * mean - 1 / 12)).toBeLessThan(0.002);
  });

  it('draws standard normals with mean 0 and standard deviation 1, within sampling error over 100 000 draws', () => {
    const seed = seedOfText('gaussian');
    let sum = 0;
    let sumSq = 0;
    let beyondTwo = 0;
    const n = 100_000;
    for (let i = 0; i < n; i++) {
      const g = gaussianAt(seed, i);
      sum += g;
      sumSq += g * g;
      if (Math.abs(g) > 2) beyondTwo++;
    }
    expect(Math.abs(sum / n)).toBeLessThan(0.02);
    expect(Math.abs(Math.sqrt(sumSq / n) - 1)).toBeLessThan(0.02);
    // P(|Z| > 2) = 0.0455 for a standard normal (normal table).
    expect(Math.abs(beyondTwo / n - 0.0455)).toBeLessThan(0.004);
  });

  it('draws differently for different seeds', () => {
    expect(uniformAt(seedOfText('KFG-101-DPH'), 42)).not.toBe(uniformAt(seedOfText('KFG-101-DPL'), 42));
  });
});
