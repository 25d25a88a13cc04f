/**
 * Range health: how the flow of a period was spread over the bands of the active DP
 * transmitter's span (0–10 %, 10–25 %, 25–50 %, 50–100 %, over range), from the hourly records'
 * band sums. Shares are of flowing time, of mass and of standard volume, and each set adds up to
 * 1. Each band's expanded uncertainty is the mass-weighted mean of the hourly uncertainties over
 * the band's mass (exact for an hour spent in one band); its contribution, share × uncertainty,
 * adds up to the period's mass-weighted uncertainty (fully correlated within the period, as the
 * hourly records assume; shared/history/hour-sums.ts).
 */
import type { DpBandName } from '../history/types';

export const DP_BANDS: readonly { band: DpBandName; fromPercent: number; toPercent: number | null }[] = [
  { band: '0-10', fromPercent: 0, toPercent: 10 },
  { band: '10-25', fromPercent: 10, toPercent: 25 },
  { band: '25-50', fromPercent: 25, toPercent: 50 },
  { band: '50-100', fromPercent: 50, toPercent: 100 },
  { band: 'over', fromPercent: 100, toPercent: null },
];

export interface BandHour {
  flowTimeS: number;
  massKg: number;
  standardVolumeM3: number;
  uncertaintyPercent: number | null;
  dpBands: Partial<Record<DpBandName, { timeS: number; massKg: number }>>;
}

export interface BandShare {
  band: DpBandName;
  fromPercent: number;
  toPercent: number | null;
  flowTimeS: number;
  massKg: number;
  standardVolumeM3: number;
  flowTimeShare: number;
  massShare: number;
  standardVolumeShare: number;
  /** Expanded (k = 2) uncertainty of the flow measured in this band, percent; null without mass. */
  uncertaintyPercent: number | null;
  /** massShare × uncertaintyPercent: the band's part of the period's uncertainty, percent. */
  uncertaintyContributionPercent: number;
}

export interface BandSummary {
  bands: BandShare[];
  flowTimeS: number;
  massKg: number;
  standardVolumeM3: number;
  /** Mass-weighted expanded uncertainty of the period, percent (= Σ contributions); null without mass. */
  uncertaintyPercent: number | null;
}

/**
 * @param hours hourly band sums (an hour's band times add up to its flow time)
 * @returns per band: time, mass, standard volume, their shares, uncertainty and its contribution
 */
export function bandShares(hours: readonly BandHour[]): BandSummary {
  const sums = new Map(
    DP_BANDS.map((b) => [b.band, { timeS: 0, massKg: 0, volumeM3: 0, massTimesU: 0, massWithU: 0 }]),
  );
  for (const [i, h] of hours.entries()) {
    if (!(h.flowTimeS >= 0) || !(h.massKg >= 0))
      throw new Error(`bandShares: hours.${i} needs flowTimeS and massKg ≥ 0`);
    // Standard volume per kg is fixed by the base density of the hour's configuration.
    const volumePerKg = h.massKg > 0 ? h.standardVolumeM3 / h.massKg : 0;
    for (const b of DP_BANDS) {
      const part = h.dpBands[b.band];
      if (!part) continue;
      const s = sums.get(b.band)!;
      s.timeS += part.timeS;
      s.massKg += part.massKg;
      s.volumeM3 += part.massKg * volumePerKg;
      if (h.uncertaintyPercent !== null && part.massKg > 0) {
        s.massTimesU += part.massKg * h.uncertaintyPercent;
        s.massWithU += part.massKg;
      }
    }
  }
  const all = [...sums.values()];
  const flowTimeS = all.reduce((a, s) => a + s.timeS, 0);
  const massKg = all.reduce((a, s) => a + s.massKg, 0);
  const standardVolumeM3 = all.reduce((a, s) => a + s.volumeM3, 0);
  const massWithU = all.reduce((a, s) => a + s.massWithU, 0);
  const share = (x: number, total: number) => (total > 0 ? x / total : 0);
  const bands = DP_BANDS.map((b) => {
    const s = sums.get(b.band)!;
    const uncertaintyPercent = s.massWithU > 0 ? s.massTimesU / s.massWithU : null;
    return {
      ...b,
      flowTimeS: s.timeS,
      massKg: s.massKg,
      standardVolumeM3: s.volumeM3,
      flowTimeShare: share(s.timeS, flowTimeS),
      massShare: share(s.massKg, massKg),
      standardVolumeShare: share(s.volumeM3, standardVolumeM3),
      uncertaintyPercent,
      uncertaintyContributionPercent:
        uncertaintyPercent === null ? 0 : share(s.massWithU, massWithU) * uncertaintyPercent,
    };
  });
  return {
    bands,
    flowTimeS,
    massKg,
    standardVolumeM3,
    uncertaintyPercent: massWithU > 0 ? bands.reduce((a, b) => a + b.uncertaintyContributionPercent, 0) : null,
  };
}
