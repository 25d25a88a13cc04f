import { fromSI } from '../units';

/** The quantities a field total can state (the field-totals CSV's `quantity`). */
export type FieldTotalQuantity = 'standard-volume' | 'mass' | 'energy';

/** The SI unit each quantity is stored in: a field total imported without a unit on record is shown in it. */
export const SI_UNIT_OF: Record<FieldTotalQuantity, string> = { 'standard-volume': 'm3', mass: 'kg', energy: 'J' };

export interface ReconciliationFigures {
  /** Tallyrun's total in SI (m³ at base conditions, kg or J), or null when Tallyrun has no figure of this quantity. */
  tallyrunSI: number | null;
  /** The field device's total in SI. */
  fieldSI: number;
  /** The unit both are shown in: the field total's own. */
  unit: string;
  tolerancePercent: number;
}

export interface ReconciledFigures {
  tallyrunValue: number | null;
  fieldValue: number;
  /** Tallyrun − field, in `unit`. */
  difference: number | null;
  /** 100 × (Tallyrun − field) / field: a percent of the field total; null when the field total is zero. */
  differencePercent: number | null;
  tolerancePercent: number;
  /** |differencePercent| ≤ tolerancePercent; with a zero field total, Tallyrun must be zero too; null without a Tallyrun figure. */
  withinTolerance: boolean | null;
}

/**
 * Compares Tallyrun's total of a period with the field device's. The difference is Tallyrun minus
 * field and its percent is of the field total (the device's figure is the reference the
 * accountant is asked to explain against). The percent and the verdict are taken from the SI
 * values, so converting to the field total's unit cannot move a day across the tolerance.
 */
export function reconcileFigures(input: ReconciliationFigures): ReconciledFigures {
  const { tallyrunSI, fieldSI, unit, tolerancePercent } = input;
  const fieldValue = fromSI(fieldSI, unit);
  if (tallyrunSI === null) {
    return {
      tallyrunValue: null,
      fieldValue,
      difference: null,
      differencePercent: null,
      tolerancePercent,
      withinTolerance: null,
    };
  }
  const tallyrunValue = fromSI(tallyrunSI, unit);
  const differencePercent = fieldSI === 0 ? null : (100 * (tallyrunSI - fieldSI)) / fieldSI;
  return {
    tallyrunValue,
    fieldValue,
    difference: tallyrunValue - fieldValue,
    differencePercent,
    tolerancePercent,
    withinTolerance: differencePercent === null ? tallyrunSI === 0 : Math.abs(differencePercent) <= tolerancePercent,
  };
}

export interface ReconciledDay extends ReconciledFigures {
  startMs: number;
  endMs: number;
  quantity: FieldTotalQuantity;
  unit: string;
}

/** The sum of one quantity in one unit over the days given, judged against the tolerance as a whole. */
export interface ReconciliationSum extends ReconciledFigures {
  quantity: FieldTotalQuantity;
  unit: string;
  days: number;
  daysOutsideTolerance: number;
  /** Days of the field without a Tallyrun figure of the quantity: left out of both sums. */
  daysWithoutTallyrunFigure: number;
}

/**
 * Sums reconciled days per quantity and unit (a month's sum when the days are a month's). Both
 * sums take only the days that have both figures, so the sums compare like with like.
 */
export function sumReconciledDays(days: readonly ReconciledDay[], tolerancePercent: number): ReconciliationSum[] {
  const groups = new Map<string, ReconciledDay[]>();
  for (const d of days) {
    const key = `${d.quantity} ${d.unit}`;
    groups.set(key, [...(groups.get(key) ?? []), d]);
  }
  return [...groups.values()].map((list) => {
    const { quantity, unit } = list[0];
    const both = list.filter((d) => d.tallyrunValue !== null);
    const tallyrun = both.reduce((a, d) => a + (d.tallyrunValue ?? 0), 0);
    const field = both.reduce((a, d) => a + d.fieldValue, 0);
    // Sums are in the unit already; converting through SI would only add rounding.
    const differencePercent = field === 0 ? null : (100 * (tallyrun - field)) / field;
    return {
      quantity,
      unit,
      days: list.length,
      daysOutsideTolerance: list.filter((d) => d.withinTolerance === false).length,
      daysWithoutTallyrunFigure: list.length - both.length,
      tallyrunValue: both.length ? tallyrun : null,
      fieldValue: field,
      difference: both.length ? tallyrun - field : null,
      differencePercent: both.length ? differencePercent : null,
      tolerancePercent,
      withinTolerance: !both.length
        ? null
        : differencePercent === null
          ? tallyrun === 0
          : Math.abs(differencePercent) <= tolerancePercent,
    };
  });
}
