import type { HourlyRecord } from '@/hooks/api/totals';
import { recordedOperatingPoint } from './recordedOperatingPoint';

function hour(change: Partial<HourlyRecord>): HourlyRecord {
  return {
    start: '2026-01-01T00:00:00Z',
    end: '2026-01-01T01:00:00Z',
    hours: 1,
    flowTimeS: 3600,
    massKg: 3600,
    volumeM3: 100,
    standardVolumeM3: 4500,
    energyJ: null,
    coverage: 1,
    flags: [],
    uncertaintyPercent: 0.6,
    status: 'complete',
    averageDpPa: 10_000,
    averagePressurePa: 4_000_000,
    averageTemperatureK: 288.15,
    integralValue: null,
    configVersionId: null,
    dpBands: null,
    activeTransmitterTimeS: null,
    computedAt: '2026-01-01T01:05:00Z',
    ...change,
  };
}

describe('recordedOperatingPoint', () => {
  it('takes the lowest, median and highest flowing rate (mass over flow time) of the hours', () => {
    const point = recordedOperatingPoint([
      hour({ massKg: 1800 }),
      hour({ massKg: 7200 }),
      hour({ massKg: 3600, flowTimeS: 1800 }), // 2 kg/s over the half hour it flowed
    ]);
    expect(point).toMatchObject({ hours: 3, minimumKgPerS: 0.5, normalKgPerS: 2, maximumKgPerS: 2 });
  });

  it('takes the mean of the middle two as the median of an even count', () => {
    const point = recordedOperatingPoint([
      hour({ massKg: 3600, averagePressurePa: 1_000_000 }),
      hour({ massKg: 7200, averagePressurePa: 2_000_000 }),
      hour({ massKg: 10_800, averagePressurePa: 3_000_000 }),
      hour({ massKg: 14_400, averagePressurePa: 5_000_000 }),
    ]);
    expect(point?.normalKgPerS).toBe(2.5);
    expect(point?.pressurePa).toBe(2_500_000);
  });

  it('leaves out hours that did not flow or were covered less than 90 %', () => {
    const point = recordedOperatingPoint([
      hour({ massKg: 3600 }),
      hour({ massKg: 0, flowTimeS: 0 }),
      hour({ massKg: 72_000, coverage: 0.89 }),
    ]);
    expect(point).toMatchObject({ hours: 1, minimumKgPerS: 1, maximumKgPerS: 1 });
  });

  it('gives the base density as the hours’ mass over their volume at base conditions', () => {
    const point = recordedOperatingPoint([
      hour({ massKg: 3600, standardVolumeM3: 4500 }),
      hour({ massKg: 7200, standardVolumeM3: 9000 }),
    ]);
    expect(point?.baseDensityKgPerM3).toBeCloseTo(0.8, 12);
  });

  it('gives no pressure, temperature or base density where the records hold none', () => {
    const point = recordedOperatingPoint([
      hour({ averagePressurePa: null, averageTemperatureK: null, standardVolumeM3: 0 }),
    ]);
    expect(point).toMatchObject({ pressurePa: null, temperatureK: null, baseDensityKgPerM3: null });
  });

  it('gives null when no hour flowed', () => {
    expect(recordedOperatingPoint([])).toBeNull();
    expect(recordedOperatingPoint([hour({ flowTimeS: 0 })])).toBeNull();
  });
});
