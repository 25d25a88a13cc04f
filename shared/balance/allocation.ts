/**
 * Pro-rata allocation of a sales meter's monthly total to the wells that feed it: each well's
 * allocation factor is its own measured share of the inlets (own / Σ inlets), and its allocated
 * volume is that factor times the sales meter's volume. Energy is shared out the same way by the
 * wells' own energies (their heating values differ), so energy and volume each add up to the
 * sales meter's. This is the proportional method of API MPMS Ch. 20.1 (allocation measurement).
 * Pure: the server and the client use it alike.
 */

export interface WellTotal {
  meterRunId: string;
  standardVolumeM3: number;
  /** Energy at base conditions in J; null when the meter run has no heating value. */
  energyJ: number | null;
}

export interface WellAllocation extends WellTotal {
  /** Own standard volume / Σ inlets' standard volumes; null when the inlets measured nothing. */
  factor: number | null;
  allocatedStandardVolumeM3: number | null;
  /** Own energy / Σ inlets' energies; null when an inlet or the sales meter has no energy. */
  energyFactor: number | null;
  allocatedEnergyJ: number | null;
}

/**
 * @param sales the sales meter's total for the month
 * @param wells the inlet meter runs' totals for the month
 */
export function allocateProRata(sales: { standardVolumeM3: number; energyJ: number | null }, wells: WellTotal[]) {
  const volumeSum = wells.reduce((a, w) => a + w.standardVolumeM3, 0);
  const energies = wells.map((w) => w.energyJ);
  const energySum = energies.every((e) => e !== null) ? (energies as number[]).reduce((a, b) => a + b, 0) : null;
  const energyKnown = sales.energyJ !== null && energySum !== null && energySum > 0;
  return wells.map((w): WellAllocation => {
    const factor = volumeSum > 0 ? w.standardVolumeM3 / volumeSum : null;
    const energyFactor = energyKnown ? (w.energyJ as number) / (energySum as number) : null;
    return {
      ...w,
      factor,
      allocatedStandardVolumeM3: factor === null ? null : factor * sales.standardVolumeM3,
      energyFactor,
      allocatedEnergyJ: energyFactor === null ? null : energyFactor * (sales.energyJ as number),
    };
  });
}
