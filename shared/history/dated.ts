/**
 * Dated settings (issue 9 §2): a setting's versions, each in force from its effective time until
 * the next one's. Helpers shared by the history worker and its tests.
 */

/** Anything with an effective time, epoch ms. */
export interface Dated {
  effectiveFromMs: number;
}

/**
 * @param versions sorted by effective time (ties: the later in the array was written later and wins)
 * @param timeMs the instant
 * @returns the version in force at timeMs: the last one effective at or before it; before the
 *   first one's time, the first (history before a meter run's first setting is computed with it)
 * @throws Error when there are no versions
 */
export function inEffectAt<T extends Dated>(versions: readonly T[], timeMs: number): T {
  if (!versions.length) throw new Error('inEffectAt: versions must not be empty');
  let found = versions[0];
  for (const v of versions) {
    if (v.effectiveFromMs > timeMs) break;
    found = v;
  }
  return found;
}

/**
 * The instants strictly inside (startMs, endMs) at which any of the given versions takes effect,
 * sorted and unique: where an hour is split into separate records.
 */
export function versionInstantsWithin(versionLists: readonly (readonly Dated[])[], startMs: number, endMs: number) {
  const instants = new Set<number>();
  for (const list of versionLists)
    for (const v of list) if (v.effectiveFromMs > startMs && v.effectiveFromMs < endMs) instants.add(v.effectiveFromMs);
  return [...instants].sort((a, b) => a - b);
}
