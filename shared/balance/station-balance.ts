/**
 * The station balance of one period (a contract day or a contract month) of a balance group:
 * inlet and outlet volumes at base conditions, the allowance for fuel and losses, the imbalance
 * and its expanded uncertainty. Pure: the server and the client use it alike.
 *
 * imbalance = Σ inlet − Σ outlet − allowance, in m³ at base conditions; percent of the inlet.
 *
 * Uncertainty (JCGM 100:2008, GUM §5.1.2, eq. 10, the law of propagation of uncertainty for
 * uncorrelated input quantities): u_c²(y) = Σ (∂f/∂x_i)² u²(x_i). Every member's expanded
 * uncertainty U_i = k·u_i (k = 2 for all, so the factor k carries through the root-sum-square
 * unchanged) is its uncertainty_percent × its standard volume / 100. The sensitivity of the
 * imbalance to an outlet is −1; to an inlet it is 1 with a fixed allowance and (1 − a/100) with
 * an allowance of a % of the inlet (the allowance moves with the inlet). A fixed allowance is a
 * contractual number, taken as exact.
 */

/** One member's total for the period. */
export interface MemberVolume {
  meterRunId: string;
  standardVolumeM3: number;
  /** Expanded (k = 2) relative uncertainty of the total, in percent; null when unknown. */
  uncertaintyPercent: number | null;
}

/** What a balance group says about its balance. */
export interface BalanceRule {
  /** Allowance as a percent of the inlet (fuel and losses); exactly one of this and allowanceDailyM3. */
  allowancePercent: number | null;
  /** Allowance as a fixed volume at base conditions per contract day. */
  allowanceDailyM3: number | null;
  /** |imbalance| above this percent of the inlet is out of tolerance. */
  tolerancePercent: number;
}

export interface StationBalance {
  inletStandardVolumeM3: number;
  outletStandardVolumeM3: number;
  allowanceM3: number;
  imbalanceM3: number;
  /** Imbalance in percent of the inlet; null when there was no inlet volume. */
  imbalancePercent: number | null;
  /** Expanded (k = 2) uncertainty of the imbalance; null when a member with volume has no uncertainty. */
  uncertaintyM3: number | null;
  withinTolerance: boolean;
  /** Whether |imbalance| is larger than its own expanded uncertainty; null when that is unknown. */
  exceedsUncertainty: boolean | null;
}

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

/**
 * @param rule the group's allowance and tolerance
 * @param period the members' totals and the number of contract days the period spans (1 for a day)
 */
export function stationBalance(
  rule: BalanceRule,
  period: { inlets: MemberVolume[]; outlets: MemberVolume[]; days: number },
): StationBalance {
  const inletStandardVolumeM3 = sum(period.inlets.map((m) => m.standardVolumeM3));
  const outletStandardVolumeM3 = sum(period.outlets.map((m) => m.standardVolumeM3));
  const allowanceM3 =
    rule.allowancePercent !== null
      ? (inletStandardVolumeM3 * rule.allowancePercent) / 100
      : (rule.allowanceDailyM3 ?? 0) * period.days;
  const imbalanceM3 = inletStandardVolumeM3 - outletStandardVolumeM3 - allowanceM3;
  const imbalancePercent = inletStandardVolumeM3 > 0 ? (imbalanceM3 / inletStandardVolumeM3) * 100 : null;

  const inletSensitivity = rule.allowancePercent !== null ? 1 - rule.allowancePercent / 100 : 1;
  const terms = [
    ...period.inlets.map((m) => contribution(m, inletSensitivity)),
    ...period.outlets.map((m) => contribution(m, -1)),
  ];
  const uncertaintyM3 = terms.some((x) => x === null) ? null : Math.sqrt(sum((terms as number[]).map((x) => x * x)));

  const withinTolerance =
    imbalancePercent !== null ? Math.abs(imbalancePercent) <= rule.tolerancePercent : imbalanceM3 === 0;
  return {
    inletStandardVolumeM3,
    outletStandardVolumeM3,
    allowanceM3,
    imbalanceM3,
    imbalancePercent,
    uncertaintyM3,
    withinTolerance,
    exceedsUncertainty: uncertaintyM3 === null ? null : Math.abs(imbalanceM3) > uncertaintyM3,
  };
}

/** c_i · U_i of one member; a member without volume contributes nothing whether or not its uncertainty is known. */
function contribution(m: MemberVolume, sensitivity: number): number | null {
  if (m.standardVolumeM3 === 0) return 0;
  if (m.uncertaintyPercent === null) return null;
  return (sensitivity * m.uncertaintyPercent * m.standardVolumeM3) / 100;
}
