import { unitsFor } from '@/constants/units-display';
import { compareFirstAndCurrent, type RecordHistory, type RecordVersion } from './recordVersions';

const version = (over: Partial<RecordVersion>): RecordVersion => ({
  version: 1,
  cause: 'initial',
  causeReference: null,
  start: '2026-03-01T06:00:00.000Z',
  end: '2026-03-02T06:00:00.000Z',
  massKg: 0,
  volumeM3: 0,
  standardVolumeM3: 0,
  energyJ: null,
  coverage: 1,
  flags: [],
  uncertaintyPercent: null,
  computedAt: '2026-03-02T06:05:00.000Z',
  supersededAt: null,
  ...over,
});

const history = (first: Partial<RecordVersion>, current: Partial<RecordVersion>): RecordHistory => {
  const a = version(first);
  const b = version({ version: 2, cause: 'configuration-version', ...current });
  return {
    first: a,
    current: b,
    versions: [a, b],
    difference: { massKg: b.massKg - a.massKg, volumeM3: 0, standardVolumeM3: 0, energyJ: null },
  };
};

describe('compareFirstAndCurrent', () => {
  it('shows first, current, the difference and its share of the first in the site units (SI: tonnes)', () => {
    const [mass] = compareFirstAndCurrent(history({ massKg: 12_000 }, { massKg: 12_600 }), unitsFor('si'));
    // 12 000 kg = 12 t; 12 600 kg = 12.6 t; +0.6 t is +5 % of 12 t.
    expect(mass).toEqual({
      key: 'mass',
      label: 'Mass, t',
      first: '12.0000',
      current: '12.6000',
      difference: '+0.6000',
      percent: '+5.00 %',
    });
  });

  it('converts to US units with the exact pound (NIST SP 811: 1 lb = 0.453 592 37 kg)', () => {
    const [mass] = compareFirstAndCurrent(history({ massKg: 453.59237 }, { massKg: 408.233133 }), unitsFor('us'));
    // 1 000 lb down to 900 lb: −100 lb, −10 %.
    expect([mass.first, mass.current, mass.difference, mass.percent]).toEqual([
      '1,000.00',
      '900.000',
      '-100.0',
      '-10.0 %',
    ]);
  });

  it('shows dashes for energy when either version has none, and no percentage of a zero first figure', () => {
    const rows = compareFirstAndCurrent(history({ massKg: 0 }, { massKg: 5 }), unitsFor('si'));
    expect(rows.find((r) => r.key === 'energy')).toMatchObject({ first: '—', difference: '—', percent: '—' });
    expect(rows.find((r) => r.key === 'mass')?.percent).toBe('—');
  });
});
