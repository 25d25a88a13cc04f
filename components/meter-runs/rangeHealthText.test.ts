import { unitsFor } from '@/constants/units-display';
import { rangeHealthTextInSiteUnits } from './rangeHealthText';

/** Checks by hand: 1 in = 25.4 mm exactly and 1 lb = 0.45359237 kg exactly (NIST SP 811 B.8). */
describe('rangeHealthTextInSiteUnits', () => {
  const us = unitsFor('us');
  it('writes a pipe diameter in inches on a US site (49.2188 mm / 25.4 = 1.9378 in)', () => {
    const text = 'pipe diameter D = 49.2188 mm is outside 50 mm ≤ D ≤ 1200 mm of ISO 5167-5:2016 §6.1';
    expect(rangeHealthTextInSiteUnits(text, us, 'us')).toBe(
      'pipe diameter D = 1.938 in is outside 1.969 in ≤ D ≤ 47.24 in of ISO 5167-5:2016 §6.1',
    );
  });

  it('writes a mass flow in lb/h and a DP unit code as its label on a US site', () => {
    // 0.1 kg/s × 3600 s/h / 0.45359237 kg/lb = 793.66 lb/h.
    const text = 'the highest flow (0.1 kg/s) gives 260 inH2O-60F.';
    expect(rangeHealthTextInSiteUnits(text, us, 'us')).toBe('the highest flow (793.7 lb/h) gives 260 inH2O (60 °F).');
  });

  it('leaves mm in mm and writes t/h on an SI site (0.1 kg/s = 0.36 t/h)', () => {
    expect(rangeHealthTextInSiteUnits('D = 49.2188 mm; 0.1 kg/s', unitsFor('si'), 'si')).toBe(
      'D = 49.22 mm; 0.3600 t/h',
    );
  });

  it('returns a sentence with no figure as it was', () => {
    expect(rangeHealthTextInSiteUnits('No change needed.', us, 'us')).toBe('No change needed.');
  });
});
