/**
 * The month's reverse and net figures, worked by hand. Conversion factors: NIST SP 811 (2008),
 * Appendix B.8, exact: 1 lb = 0.45359237 kg; 1 ft³ = 0.028316846592 m³, so 1 Mscf = 28.316846592 m³;
 * 1 t = 1000 kg (SI prefix). The month shows six significant figures (monthFormat's precision).
 */
import { monthlyVolumesSchema } from '@/hooks/api/monthlyVolumes';
import { directionHeaders, directionMonthCells, forwardHeader } from './directionFigures';

const lbKg = 0.45359237;
const mscfM3 = 28.316846592;

describe('directionHeaders', () => {
  it('puts the site’s units in the reverse and net headers and says net is forward − reverse (US)', () => {
    expect(directionHeaders('us')).toEqual({
      reverseStandardVolume: 'Reverse volume at base, Mscf',
      reverseMass: 'Reverse mass, lb',
      netStandardVolume: 'Net volume at base (forward − reverse), Mscf',
      netMass: 'Net mass (forward − reverse), lb',
    });
  });

  it('uses m³ and t on an SI site', () => {
    expect(directionHeaders('si')).toMatchObject({
      reverseStandardVolume: 'Reverse volume at base, m³',
      netMass: 'Net mass (forward − reverse), t',
    });
  });
});

describe('directionMonthCells', () => {
  it('shows 12.5 Mscf and 1,000 lb in reverse and a net of 87.5 Mscf and −2 lb to six figures (US)', () => {
    const cells = directionMonthCells(
      {
        reverse: {
          flowTimeS: 36_000,
          massKg: 1000 * lbKg,
          volumeM3: 5,
          standardVolumeM3: 12.5 * mscfM3,
          energyJ: null,
        },
        net: { massKg: -2 * lbKg, volumeM3: 40, standardVolumeM3: 87.5 * mscfM3, energyJ: null },
      },
      'us',
    );
    expect(cells).toEqual({
      reverseStandardVolume: '12.5000',
      reverseMass: '1,000.00',
      netStandardVolume: '87.5000',
      netMass: '-2.00000',
    });
  });

  it('shows 1500 m³ and 1200 kg (1.2 t) in reverse on an SI site', () => {
    const cells = directionMonthCells(
      {
        reverse: { flowTimeS: 7200, massKg: 1200, volumeM3: 20, standardVolumeM3: 1500, energyJ: 5.7e10 },
        net: { massKg: 48_800, volumeM3: 600, standardVolumeM3: 58_500, energyJ: 2.2e12 },
      },
      'si',
    );
    expect(cells).toEqual({
      reverseStandardVolume: '1,500.00',
      reverseMass: '1.20000',
      netStandardVolume: '58,500.0',
      netMass: '48.8000',
    });
  });

  it('shows dashes for a meter run with no reverse flow in a month where another meter run had some', () => {
    expect(directionMonthCells({}, 'si')).toEqual({
      reverseStandardVolume: '—',
      reverseMass: '—',
      netStandardVolume: '—',
      netMass: '—',
    });
  });

  it('shows the site total’s reverse and net as the server sends them, kept through the response schema', () => {
    const month = {
      massKg: 1,
      volumeM3: 1,
      standardVolumeM3: 1,
      energyJ: null,
      coverage: 1,
      flags: [],
      uncertaintyPercent: null,
      status: 'complete',
      correctionsInForce: 0,
      previousMonth: null,
      yearEarlier: null,
      changeFromPreviousMonthPercent: null,
      changeFromYearEarlierPercent: null,
    };
    const parsed = monthlyVolumesSchema.parse({
      site: {
        id: '1',
        code: 'S1',
        name: 'Site',
        timeZone: 'UTC',
        contractHour: 9,
        basePressurePa: 101_325,
        baseTemperatureK: 288.15,
        displayUnits: 'si',
      },
      month: '2026-01',
      start: '2026-01-01T09:00:00Z',
      end: '2026-02-01T09:00:00Z',
      status: 'complete',
      meterRuns: [],
      totals: {
        ...month,
        reverse: { flowTimeS: 3600, massKg: 2000, volumeM3: 3, standardVolumeM3: 2500, energyJ: null },
        net: { massKg: -1000, volumeM3: -2, standardVolumeM3: -2499, energyJ: null },
      },
    });
    expect(directionMonthCells(parsed.totals, 'si')).toEqual({
      reverseStandardVolume: '2,500.00',
      reverseMass: '2.00000',
      netStandardVolume: '-2,499.00',
      netMass: '-1.00000',
    });
  });
});

describe('forwardHeader', () => {
  it('names a forward figure as forward flow: "Mass, t" becomes "Forward mass, t"', () => {
    expect(forwardHeader('Mass, t')).toBe('Forward mass, t');
  });
});
