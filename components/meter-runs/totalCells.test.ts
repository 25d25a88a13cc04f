/**
 * Expected values: NIST SP 811 (2008), Appendix B.8, exact: 1 lb = 0.45359237 kg; 1 ft³ =
 * 0.028316846592 m³; 1 Btu_IT = 1055.05585262 J.
 */
import { unitsFor } from '@/constants/units-display';
import type { Total } from '@/hooks/api/totals';
import { totalCells } from './totalCells';

const total: Total = {
  start: '2026-01-01T09:00:00-07:00',
  end: '2026-01-02T09:00:00-07:00',
  hours: 24,
  flowTimeS: 86_400,
  massKg: 453.59237 * 1000,
  volumeM3: 100,
  standardVolumeM3: 28.316846592 * 1000,
  energyJ: 1055.05585262 * 1e6 * 2500,
  coverage: 0.9876,
  flags: [],
  uncertaintyPercent: 0.512,
  status: 'complete',
};

describe('totalCells', () => {
  it('shows a US site’s total in lb, Mscf and MMBtu: 453 592.37 kg is 1,000,000 lb', () => {
    expect(totalCells(total, unitsFor('us'))).toMatchObject({
      mass: '1,000,000',
      volume: '1,000',
      energy: '2,500',
    });
  });

  it('shows an SI site’s total in t, m³ and GJ', () => {
    expect(
      totalCells({ ...total, massKg: 12_345, standardVolumeM3: 1234.5678, energyJ: 2.5e9 }, unitsFor('si')),
    ).toMatchObject({
      mass: '12.35',
      volume: '1,235',
      energy: '2.500',
    });
  });

  it('shows coverage and uncertainty as bare percents (the unit is in the header) and the status in words', () => {
    expect(totalCells(total, unitsFor('si'))).toMatchObject({
      coverage: '98.8',
      uncertainty: '±0.51',
      status: 'complete',
    });
  });

  it('shows a dash for energy or uncertainty the server does not have, and an unknown status as it came', () => {
    expect(
      totalCells({ ...total, energyJ: null, uncertaintyPercent: null, status: 'amended' }, unitsFor('si')),
    ).toMatchObject({
      energy: '—',
      uncertainty: '—',
      status: 'amended',
    });
  });
});
