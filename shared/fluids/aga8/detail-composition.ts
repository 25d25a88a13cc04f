import { DETAIL_COMPONENTS, DETAIL_COMPONENT_COUNT } from './detail-constants';
import type { Warning } from '../warning';

/** Other spellings accepted for the DETAIL components (after lower-casing and hyphenation). */
const ALIASES: Record<string, string> = {
  ch4: 'methane',
  n2: 'nitrogen',
  co2: 'carbon-dioxide',
  c2h6: 'ethane',
  c3h8: 'propane',
  'i-butane': 'isobutane',
  'iso-butane': 'isobutane',
  'i-c4h10': 'isobutane',
  'n-c4h10': 'n-butane',
  'i-pentane': 'isopentane',
  'iso-pentane': 'isopentane',
  'i-c5h12': 'isopentane',
  'n-c5h12': 'n-pentane',
  'n-c6h14': 'n-hexane',
  'n-c7h16': 'n-heptane',
  'n-c8h18': 'n-octane',
  'n-c9h20': 'n-nonane',
  'n-c10h22': 'n-decane',
  h2: 'hydrogen',
  o2: 'oxygen',
  co: 'carbon-monoxide',
  h2o: 'water',
  h2s: 'hydrogen-sulfide',
  'hydrogen-sulphide': 'hydrogen-sulfide',
  he: 'helium',
  ar: 'argon',
};

const INDEX = new Map<string, number>(DETAIL_COMPONENTS.map((name, i) => [name, i]));

/**
 * Canonical kebab-case name of a component as written by a user: trimmed, lower-cased,
 * spaces and underscores turned into hyphens ("Carbon Dioxide", "carbon_dioxide" →
 * "carbon-dioxide"); a few formulas and spellings ("CO2", "i-butane", "hydrogen sulphide")
 * are accepted as aliases.
 *
 * @param name component name as given
 * @returns the canonical name (not necessarily a known component)
 */
export function canonicalComponentName(name: string): string {
  const s = name
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, '-')
    .replace(/-+/g, '-');
  return ALIASES[s] ?? s;
}

/** The result of looking a component name up: its canonical name, or the closest known names. */
export type ComponentLookup =
  { known: true; canonical: string } | { known: false; canonical: string; closeMatches: string[] };

/** Edit distance (insertions, deletions, substitutions) between two short names. */
function editDistance(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    for (let j = 1; j <= b.length; j++)
      row[j] = Math.min(previous[j] + 1, row[j - 1] + 1, previous[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    previous = row;
  }
  return previous[b.length];
}

/**
 * Looks a component name up in the spellings this module accepts (see `canonicalComponentName`):
 * every boundary where a composition is typed uses this, so they all accept the same names.
 * An unknown name comes back with up to three close known names (canonical names and accepted
 * spellings within an edit distance of a third of the name's length, at least 2), nearest first.
 *
 * @param name component name as given
 * @returns { known: true, canonical } or { known: false, canonical, closeMatches }
 */
export function lookUpComponentName(name: string): ComponentLookup {
  const canonical = canonicalComponentName(name);
  if (INDEX.has(canonical)) return { known: true, canonical };
  const limit = Math.max(2, Math.floor(canonical.length / 3));
  const candidates = [...DETAIL_COMPONENTS, ...Object.keys(ALIASES)]
    .map((candidate) => ({ candidate, distance: editDistance(canonical, candidate) }))
    .filter((c) => c.distance <= limit)
    .sort((a, b) => a.distance - b.distance || a.candidate.localeCompare(b.candidate));
  const closeMatches: string[] = [];
  for (const c of candidates) {
    const shown = INDEX.has(c.candidate) ? c.candidate : `${c.candidate} (${ALIASES[c.candidate]})`;
    if (!closeMatches.includes(shown)) closeMatches.push(shown);
    if (closeMatches.length === 3) break;
  }
  return { known: false, canonical, closeMatches };
}

/** Sum deviation beyond which normalisation is reported (brief: 1e-4). */
export const COMPOSITION_SUM_TOLERANCE = 1e-4;

/** A composition as mole fractions in the DETAIL component order. */
export interface DetailComposition {
  /** Mole fractions in DETAIL order, normalised to sum to 1. */
  moleFractions: Float64Array;
  warnings: Warning[];
}

/**
 * Parse a composition given as mole fractions keyed by component name into the DETAIL order.
 * Lenient names (see `canonicalComponentName`); unknown names, repeated components and
 * negative or non-finite fractions throw; a sum differing from 1 by more than 1e-4 is
 * normalised with a 'fluid.compositionNormalised' warning (smaller differences are
 * normalised silently, as AGA 8 requires Σx = 1).
 *
 * @param composition mole fractions keyed by component name
 * @param caller name of the calling function, for error messages
 * @returns normalised mole fractions and warnings
 * @throws Error naming the function and the offending component
 */
export function parseDetailComposition(
  composition: Record<string, number>,
  caller = 'parseDetailComposition',
): DetailComposition {
  if (composition === null || typeof composition !== 'object' || Array.isArray(composition)) {
    throw new Error(`${caller}: composition must be an object of mole fractions keyed by component name`);
  }
  const x = new Float64Array(DETAIL_COMPONENT_COUNT);
  const seen = new Array<string | undefined>(DETAIL_COMPONENT_COUNT);
  let sum = 0;
  for (const [key, value] of Object.entries(composition)) {
    const name = canonicalComponentName(key);
    const i = INDEX.get(name);
    if (i === undefined) {
      throw new Error(
        `${caller}: composition has unknown component "${key}" (AGA 8 DETAIL knows: ${DETAIL_COMPONENTS.join(', ')})`,
      );
    }
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      throw new Error(`${caller}: composition["${key}"] must be a finite mole fraction ≥ 0, got ${value}`);
    }
    if (seen[i] !== undefined) {
      throw new Error(`${caller}: composition lists ${name} twice ("${seen[i]}" and "${key}")`);
    }
    seen[i] = key;
    x[i] = value;
    sum += value;
  }
  if (!(sum > 0)) {
    throw new Error(`${caller}: composition must have at least one component with a mole fraction > 0`);
  }
  const warnings: Warning[] = [];
  if (Math.abs(sum - 1) > COMPOSITION_SUM_TOLERANCE) {
    const percentHint = Math.abs(sum - 100) < 1 ? ' (it looks like mol %; mole fractions are expected)' : '';
    warnings.push({
      code: 'fluid.compositionNormalised',
      message: `Mole fractions summed to ${sum}${percentHint}; they were divided by the sum so that they total 1.`,
    });
  }
  for (let i = 0; i < DETAIL_COMPONENT_COUNT; i++) x[i] /= sum;
  return { moleFractions: x, warnings };
}
