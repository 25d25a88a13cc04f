import { badRequest } from '../../errors';
import { DETAIL_COMPONENTS, lookUpComponentName } from '../../../shared/fluids';

/** Default tolerance of a composition's sum, as a fraction of 1 (issue 11 §3). */
export const DEFAULT_SUM_TOLERANCE = 0.0001;

/** A laboratory's components as the configuration takes them. */
export interface AnalysedComposition {
  /** Mole fractions by canonical component name (methane, carbon-dioxide, …), as given (not normalised). */
  composition: Record<string, number>;
  /** Whether the laboratory reported mole fractions (sum 1) or mol % (sum 100). */
  basis: 'fraction' | 'percent';
  sum: number;
}

/**
 * Reads a gas analysis's components: names in any spelling the fluids module accepts ("CO2",
 * "Carbon Dioxide", "i-butane"), values as mole fractions summing to 1 or as mol % summing to
 * 100, each within `sumTolerance` (a fraction of 1, so 0.0001 allows 0.9999–1.0001 or
 * 99.99–100.01 %). A composition outside it is refused rather than normalised: a sample that
 * does not add up is a typing or laboratory error to be looked at, not silently scaled.
 * @throws bad request naming `components` (or `components.<name>`)
 */
export function analysedComposition(components: Record<string, number>, sumTolerance: number): AnalysedComposition {
  const byName = new Map<string, { key: string; value: number }>();
  for (const [key, value] of Object.entries(components)) {
    const found = lookUpComponentName(key);
    const name = found.canonical;
    if (!found.known)
      throw badRequest(
        `components.${key}: unknown component (${found.closeMatches.length ? `did you mean ${found.closeMatches.join(', ')}? ` : ''}known: ${DETAIL_COMPONENTS.join(', ')})`,
        `components.${key}`,
        'invalid_field',
      );
    const earlier = byName.get(name);
    if (earlier)
      throw badRequest(
        `components.${key}: ${name} is listed twice ("${earlier.key}" and "${key}")`,
        `components.${key}`,
        'invalid_field',
      );
    byName.set(name, { key, value });
  }
  if (byName.size === 0)
    throw badRequest('components: at least one component is required', 'components', 'invalid_field');
  const sum = [...byName.values()].reduce((s, c) => s + c.value, 0);
  const basis =
    Math.abs(sum - 1) <= sumTolerance ? 'fraction' : Math.abs(sum - 100) <= sumTolerance * 100 ? 'percent' : null;
  if (basis === null)
    throw badRequest(
      `components: the mole fractions sum to ${sum}; they must sum to 1 (or 100 %) within ${sumTolerance} (sumTolerance)`,
      'components',
      'invalid_field',
    );
  const divisor = basis === 'percent' ? 100 : 1;
  const composition: Record<string, number> = {};
  for (const [name, c] of byName) composition[name] = c.value / divisor;
  return { composition, basis, sum };
}
