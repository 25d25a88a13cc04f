/**
 * The rows of an hourly record's uncertainty budget as the meter-run screen lists them: each term
 * of U(qm)/qm (ISO 5167-1:2003 §8) in words, its share (k = 2, percent) and its source, largest
 * first, so the term that decides the hour's uncertainty is read first.
 */
import { formatNumber } from '@/constants/units-display';

export interface BudgetTerm {
  term: string;
  percent: number;
  source: string;
}

export interface BudgetRow {
  key: string;
  label: string;
  share: string;
  source: string;
}

/** The quantity each term of the budget is the uncertainty of. */
const TERM_LABELS: Readonly<Record<string, string>> = {
  dischargeCoefficient: 'Discharge coefficient C',
  expansibility: 'Expansibility ε',
  pipeDiameter: 'Pipe diameter D',
  elementDiameter: 'Element diameter d',
  differentialPressure: 'Differential pressure Δp',
  density: 'Density ρ (equation of state)',
  staticPressure: 'Static pressure p (through ρ)',
  temperature: 'Temperature T (through ρ)',
};

/**
 * @param budget the record's terms (null: stored before budgets were kept)
 * @returns the rows, largest share first; empty when there is no budget
 */
export function budgetRows(budget: readonly BudgetTerm[] | null | undefined): BudgetRow[] {
  return [...(budget ?? [])]
    .sort((a, b) => b.percent - a.percent)
    .map((t) => ({
      key: t.term,
      label: TERM_LABELS[t.term] ?? t.term,
      share: `±${formatNumber(t.percent, 3)} %`,
      source: t.source,
    }));
}
