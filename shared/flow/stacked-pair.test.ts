import { chooseStackedTransmitter, type StackedPairConfig } from './stacked-pair';

/** A 0–25 kPa low-range and 0–250 kPa high-range pair, switching up at 90 % and down at 80 % (common practice). */
const config: StackedPairConfig = {
  lowUpperRangePa: 25000,
  highUpperRangePa: 250000,
  switchUpShare: 0.9,
  switchDownShare: 0.8,
};
const good = (valuePa: number) => ({ valuePa, quality: 'good' as const });

describe('chooseStackedTransmitter', () => {
  it('uses the low-range transmitter below 90 % of its span', () => {
    const c = chooseStackedTransmitter(good(10000), good(10100), 'low', config);
    expect(c.use).toBe('low');
    expect(c.reason).toBe('low-below-switch-up');
    expect(c.differentialPressurePa).toBe(10000);
  });

  it('switches up above 90 % of the low-range span', () => {
    const c = chooseStackedTransmitter(good(22600), good(22700), 'low', config);
    expect(c).toEqual(expect.objectContaining({ use: 'high', reason: 'switched-up', switched: true }));
    expect(c.message).toMatch(/22500 Pa/);
  });

  it('holds the high-range transmitter in the hysteresis band between 80 % and 90 %', () => {
    const c = chooseStackedTransmitter(good(21000), good(21050), 'high', config);
    expect(c).toEqual(expect.objectContaining({ use: 'high', reason: 'high-above-switch-down', switched: false }));
  });

  it('switches down below 80 % of the low-range span', () => {
    const c = chooseStackedTransmitter(good(19000), good(19500), 'high', config);
    expect(c).toEqual(expect.objectContaining({ use: 'low', reason: 'switched-down', switched: true }));
  });

  it('does not chatter: a reading going up and down through the band switches once each way', () => {
    const path = [20000, 22000, 22600, 23000, 22000, 21000, 20500, 19900, 21000, 22400];
    let previous: 'low' | 'high' | null = null;
    const uses = path.map((dp) => {
      const c = chooseStackedTransmitter(good(dp), good(dp), previous, config);
      previous = c.use;
      return c.use;
    });
    expect(uses).toEqual(['low', 'low', 'high', 'high', 'high', 'high', 'high', 'low', 'low', 'low']);
  });

  it('reports the disagreement in the overlap, absolute and as a percent of the reading in use', () => {
    const c = chooseStackedTransmitter(good(10000), good(10250), 'low', config);
    expect(c.inOverlap).toBe(true);
    expect(c.disagreementPa).toBe(250);
    expect(c.disagreementPercentOfReading).toBeCloseTo(2.5, 12);
  });

  it('uses the high-range transmitter when the low-range one is above its upper range value, with no disagreement', () => {
    const c = chooseStackedTransmitter(good(25400), good(60000), 'low', config);
    expect(c).toEqual(
      expect.objectContaining({ use: 'high', lowOverRange: true, inOverlap: false, disagreementPa: null }),
    );
  });

  it('falls back to the other transmitter when one reading is bad or missing, and says so', () => {
    expect(chooseStackedTransmitter({ valuePa: 5000, quality: 'bad' }, good(5100), 'low', config)).toEqual(
      expect.objectContaining({ use: 'high', reason: 'low-unavailable' }),
    );
    expect(chooseStackedTransmitter(good(5000), { valuePa: null, quality: 'good' }, 'high', config)).toEqual(
      expect.objectContaining({ use: 'low', reason: 'high-unavailable', switched: true }),
    );
    expect(chooseStackedTransmitter(null, null, 'low', config)).toEqual(
      expect.objectContaining({ use: null, reason: 'both-unavailable', differentialPressurePa: null }),
    );
  });

  it('starts on the right transmitter without a previous choice', () => {
    expect(chooseStackedTransmitter(good(5000), good(5000), null, config).use).toBe('low');
    expect(chooseStackedTransmitter(good(24000), good(24000), null, config).use).toBe('high');
  });

  it('rejects switch shares without a hysteresis band, naming them', () => {
    expect(() => chooseStackedTransmitter(good(1), good(1), null, { ...config, switchDownShare: 0.9 })).toThrow(
      /switchDownShare/,
    );
  });
});
