/**
 * Seeded, counter-based pseudo-random numbers: the noise of a transmitter at a time is a pure
 * function of (its seed, the time), so back-fill and live mode give the same value for the same
 * instant, in any order, with no state to carry.
 */

/**
 * 32-bit FNV-1a hash of a text (offset basis 2166136261, prime 16777619: the published FNV
 * parameters [mem]).
 * @param text e.g. a transmitter tag
 * @returns unsigned 32-bit seed
 */
export function seedOfText(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/**
 * Uniform number in [0, 1) for a seed and a counter: a murmur3-style 32-bit finaliser over the
 * seed mixed with the counter (a well-mixed hash is a counter-based generator).
 * @param seed unsigned 32-bit seed
 * @param counter integer (e.g. whole seconds of the sample time; any safe integer)
 * @returns uniform in [0, 1)
 */
export function uniformAt(seed: number, counter: number): number {
  const low = counter >>> 0;
  const high = Math.floor(counter / 4294967296) >>> 0;
  let h = (seed ^ Math.imul(low, 0x9e3779b1) ^ Math.imul(high, 0x85ebca77)) >>> 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return (h >>> 0) / 4294967296;
}

/**
 * Standard normal number for a seed and a counter (Box–Muller transform of two uniforms).
 * @param seed unsigned 32-bit seed
 * @param counter integer
 * @returns a draw of N(0, 1)
 */
export function gaussianAt(seed: number, counter: number): number {
  const u1 = uniformAt(seed, 2 * counter);
  const u2 = uniformAt(seed ^ 0x5bd1e995, 2 * counter + 1);
  return Math.sqrt(-2 * Math.log(1 - u1)) * Math.cos(2 * Math.PI * u2);
}
