import { bandShares } from './band-shares';

/**
 * A constructed day whose bands are known by hand: 24 hours of which 6 h flowed in 0–10 %,
 * 10 h in 25–50 %, 6 h in 50–100 %, 1 h over range and 1 h without flow.
 * Masses per hour: 100 kg (0–10 %), 400 kg (25–50 %), 800 kg (50–100 %), 1000 kg (over).
 */
const hour = (band: string, massKg: number, u: number | null) => ({
  flowTimeS: massKg > 0 ? 3600 : 0,
  massKg,
  standardVolumeM3: massKg * 1.25, // base density 0.8 kg/m³
  uncertaintyPercent: u,
  dpBands: massKg > 0 ? { [band]: { timeS: 3600, massKg } } : {},
});
const day = [
  ...Array.from({ length: 6 }, () => hour('0-10', 100, 2)),
  ...Array.from({ length: 10 }, () => hour('25-50', 400, 0.8)),
  ...Array.from({ length: 6 }, () => hour('50-100', 800, 0.7)),
  hour('over', 1000, 0.7),
  hour('0-10', 0, null),
];

describe('bandShares', () => {
  const s = bandShares(day);
  const band = (b: string) => s.bands.find((x) => x.band === b)!;

  it('gives flow-time shares 6/23, 0, 10/23, 6/23, 1/23 that add up to 1', () => {
    expect(s.flowTimeS).toBe(23 * 3600);
    expect(band('0-10').flowTimeShare).toBeCloseTo(6 / 23, 14);
    expect(band('10-25').flowTimeShare).toBe(0);
    expect(band('25-50').flowTimeShare).toBeCloseTo(10 / 23, 14);
    expect(band('50-100').flowTimeShare).toBeCloseTo(6 / 23, 14);
    expect(band('over').flowTimeShare).toBeCloseTo(1 / 23, 14);
    expect(s.bands.reduce((a, b) => a + b.flowTimeShare, 0)).toBeCloseTo(1, 14);
  });

  it('gives mass and volume shares 600/10400, 4000/10400, 4800/10400, 1000/10400 that add up to 1', () => {
    // total mass = 6·100 + 10·400 + 6·800 + 1000 = 10 400 kg
    expect(s.massKg).toBe(10_400);
    expect(band('0-10').massShare).toBeCloseTo(600 / 10_400, 14);
    expect(band('25-50').massShare).toBeCloseTo(4000 / 10_400, 14);
    expect(band('50-100').standardVolumeShare).toBeCloseTo(4800 / 10_400, 14);
    expect(s.standardVolumeM3).toBeCloseTo(13_000, 9);
    expect(s.bands.reduce((a, b) => a + b.massShare, 0)).toBeCloseTo(1, 14);
    expect(s.bands.reduce((a, b) => a + b.standardVolumeShare, 0)).toBeCloseTo(1, 14);
  });

  it('gives each band its uncertainty and contributions that add up to the mass-weighted period figure', () => {
    expect(band('0-10').uncertaintyPercent).toBe(2);
    expect(band('10-25').uncertaintyPercent).toBeNull();
    // (600·2 + 4000·0.8 + 4800·0.7 + 1000·0.7) / 10 400 = 8460 / 10 400
    expect(s.uncertaintyPercent).toBeCloseTo(8460 / 10_400, 14);
    expect(band('0-10').uncertaintyContributionPercent).toBeCloseTo(1200 / 10_400, 14);
  });

  it('gives zero shares, not NaN, for a period without flow', () => {
    const none = bandShares([hour('0-10', 0, null)]);
    expect(none.bands.every((b) => b.flowTimeShare === 0 && b.massShare === 0)).toBe(true);
    expect(none.uncertaintyPercent).toBeNull();
  });
});
