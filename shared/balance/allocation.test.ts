import { allocateProRata } from './allocation';

/**
 * A pro-rata month worked by hand. Wells A 60 000 m³ (2.40 TJ), B 30 000 m³ (1.26 TJ), C 10 000 m³
 * (0.34 TJ); the sales meter 98 000 m³ (3.92 TJ).
 *   Σ inlets = 100 000 m³ → factors 0.6, 0.3, 0.1 → allocated 58 800, 29 400, 9 800 m³ (Σ 98 000)
 *   Σ energies = 4.00 TJ → energy factors 0.6, 0.315, 0.085 → 2.352, 1.2348, 0.3332 TJ (Σ 3.92)
 */
describe('allocateProRata', () => {
  const wells = [
    { meterRunId: 'A', standardVolumeM3: 60_000, energyJ: 2.4e12 },
    { meterRunId: 'B', standardVolumeM3: 30_000, energyJ: 1.26e12 },
    { meterRunId: 'C', standardVolumeM3: 10_000, energyJ: 0.34e12 },
  ];

  it('shares out the sales volume and energy in proportion to the wells own, as worked by hand', () => {
    const a = allocateProRata({ standardVolumeM3: 98_000, energyJ: 3.92e12 }, wells);
    expect(a.map((w) => w.factor)).toEqual([0.6, 0.3, 0.1].map((x) => expect.closeTo(x, 12)));
    expect(a.map((w) => w.allocatedStandardVolumeM3)).toEqual([58_800, 29_400, 9_800].map((x) => expect.closeTo(x, 6)));
    expect(a.map((w) => w.energyFactor)).toEqual([0.6, 0.315, 0.085].map((x) => expect.closeTo(x, 12)));
    expect(a.map((w) => (w.allocatedEnergyJ as number) / 1e12)).toEqual(
      [2.352, 1.2348, 0.3332].map((x) => expect.closeTo(x, 9)),
    );
    const total = (k: 'allocatedStandardVolumeM3' | 'allocatedEnergyJ') => a.reduce((s, w) => s + (w[k] as number), 0);
    expect(total('allocatedStandardVolumeM3')).toBeCloseTo(98_000, 6);
    expect(total('allocatedEnergyJ') / 1e12).toBeCloseTo(3.92, 9);
  });

  it('gives no factor when the wells measured nothing, and no energy when one has none', () => {
    const none = allocateProRata({ standardVolumeM3: 1, energyJ: null }, [
      { meterRunId: 'A', standardVolumeM3: 0, energyJ: null },
    ]);
    expect(none[0]).toMatchObject({ factor: null, allocatedStandardVolumeM3: null, allocatedEnergyJ: null });
    const noEnergy = allocateProRata({ standardVolumeM3: 98_000, energyJ: 3.92e12 }, [
      wells[0],
      { ...wells[1], energyJ: null },
    ]);
    expect(noEnergy[0].factor).toBeCloseTo(2 / 3, 12);
    expect(noEnergy[0].allocatedEnergyJ).toBeNull();
  });
});
