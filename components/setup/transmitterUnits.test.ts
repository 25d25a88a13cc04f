import { measuresLabel, rangeLabel, unitLabel, unitsFor } from './transmitterUnits';

describe('transmitter units', () => {
  it('ranges a temperature transmitter only in temperature units and a pressure one only in pressure units', () => {
    expect([...unitsFor('temperature')].sort()).toEqual(['K', 'degC', 'degF']);
    expect(unitsFor('differential-pressure')).toContain('inH2O-60F');
    expect(unitsFor('static-pressure')).not.toContain('degC');
  });

  it('names the water temperature of every inch-of-water unit', () => {
    expect(unitLabel['inH2O-4C']).toBe('inH₂O (4 °C)');
    expect(unitLabel['inH2O-60F']).toBe('inH₂O (60 °F)');
    expect(unitLabel['inH2O-68F']).toBe('inH₂O (68 °F)');
  });

  it('has words for every unit a transmitter may be ranged in', () => {
    for (const unit of [...unitsFor('temperature'), ...unitsFor('static-pressure')])
      expect(unitLabel[unit]).toEqual(expect.any(String));
  });

  it('writes a range with its unit, and an unknown unit as its code', () => {
    expect(rangeLabel(0, 250, 'inH2O-60F')).toBe('0 – 250 inH₂O (60 °F)');
    expect(rangeLabel(-40, 120, 'degC')).toBe('-40 – 120 °C');
    expect(rangeLabel(0, 10, 'furlong')).toBe('0 – 10 furlong');
  });

  it('says DP in full once', () => {
    expect(measuresLabel['differential-pressure']).toBe('Differential pressure (DP)');
  });
});
