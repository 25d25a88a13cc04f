/**
 * A bi-directional meter run's reverse and net cells, worked by hand. Conversion factors: NIST SP
 * 811 (2008), Appendix B.8, exact: 1 lb = 0.45359237 kg; 1 ft³ = 0.028316846592 m³ (so 1 Mscf =
 * 28.316846592 m³); 1 Btu_IT = 1055.05585262 J (so 1 MMBtu = 1.05505585262 × 10⁹ J); 1 t = 1000 kg,
 * 1 GJ = 10⁹ J (SI prefixes). Minutes and hours: 60 s and 3600 s by definition.
 */
import { unitsFor } from '@/constants/units-display';
import { directionCells } from './totalCells';

const lbKg = 0.45359237;
const mscfM3 = 28.316846592;
const mmbtuJ = 1055.05585262e6;

describe('directionCells', () => {
  it('shows an hour’s 30 minutes of reverse flow, 100 lb and 2 Mscf, and its net of 9,000 lb, on a US site', () => {
    const cells = directionCells(
      {
        reverse: {
          flowTimeS: 1800,
          massKg: 100 * lbKg,
          volumeM3: 1,
          standardVolumeM3: 2 * mscfM3,
          energyJ: 5 * mmbtuJ,
        },
        net: { massKg: 9000 * lbKg, volumeM3: 10, standardVolumeM3: 180 * mscfM3, energyJ: 450 * mmbtuJ },
      },
      unitsFor('us'),
      'min',
    );
    // 1800 s / 60 = 30 min, three significant figures; 100 lb and 2 Mscf to four; 9000 lb has no decimals left.
    expect(cells).toEqual({
      reverseFlowTime: '30.0',
      reverseMass: '100.0',
      reverseVolume: '2.000',
      reverseEnergy: '5.000',
      netMass: '9,000',
      netVolume: '180.0',
      netEnergy: '450.0',
    });
  });

  it('gives a day’s reverse flow time in hours on an SI site: 5400 s is 1.50 h, 2500 kg is 2.500 t, 3.6 × 10⁹ J is 3.600 GJ', () => {
    const cells = directionCells(
      {
        reverse: { flowTimeS: 5400, massKg: 2500, volumeM3: 3, standardVolumeM3: 1234.4, energyJ: 3.6e9 },
        net: { massKg: 7500, volumeM3: 9, standardVolumeM3: 3703.2, energyJ: 10.8e9 },
      },
      unitsFor('si'),
      'h',
    );
    expect(cells).toMatchObject({
      reverseFlowTime: '1.50',
      reverseMass: '2.500',
      reverseVolume: '1,234',
      reverseEnergy: '3.600',
      netMass: '7.500',
      netVolume: '3,703',
      netEnergy: '10.80',
    });
  });

  it('keeps the minus sign of a net below zero (more reverse than forward): −500 kg is −0.5000 t', () => {
    const cells = directionCells(
      {
        reverse: { flowTimeS: 3600, massKg: 1500, volumeM3: 2, standardVolumeM3: 2000, energyJ: null },
        net: { massKg: -500, volumeM3: -1, standardVolumeM3: -600, energyJ: null },
      },
      unitsFor('si'),
      'h',
    );
    expect(cells.netMass).toBe('-0.5000');
    expect(cells.netVolume).toBe('-600.0');
  });

  it('shows a dash for energy when the server has none (a fluid without a heating value)', () => {
    const cells = directionCells(
      {
        reverse: { flowTimeS: 60, massKg: 1000, volumeM3: 1, standardVolumeM3: 1000, energyJ: null },
        net: { massKg: 0, volumeM3: 0, standardVolumeM3: 0, energyJ: null },
      },
      unitsFor('si'),
      'min',
    );
    expect(cells).toMatchObject({ reverseFlowTime: '1.00', reverseEnergy: '—', netMass: '0', netEnergy: '—' });
  });

  it('shows dashes in every cell of a period from before the meter run was bi-directional (no reverse part, or null)', () => {
    const dashes = {
      reverseFlowTime: '—',
      reverseMass: '—',
      reverseVolume: '—',
      reverseEnergy: '—',
      netMass: '—',
      netVolume: '—',
      netEnergy: '—',
    };
    expect(directionCells({}, unitsFor('us'), 'h')).toEqual(dashes);
    expect(directionCells({ reverse: null, net: null }, unitsFor('si'), 'min')).toEqual(dashes);
  });
});
