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

describe('chooseStackedTransmitter on a pair ranged both ways (a bi-directional meter run)', () => {
  /** Low −25…+25 kPa, high −250…+250 kPa: the same switch points apply to the magnitude. */
  const twoWay: StackedPairConfig = { ...config, lowLowerRangePa: -25000 };

  it('switches up on a reverse reading whose magnitude passes 90 % of the low range: |−23 kPa| > 22.5 kPa, keeping the signed DP', () => {
    const c = chooseStackedTransmitter(good(-23000), good(-23100), 'low', twoWay);
    expect(c).toEqual(expect.objectContaining({ use: 'high', reason: 'switched-up', differentialPressurePa: -23100 }));
    expect(c.disagreementPa).toBe(-100); // high − low, signed
  });

  it('stays on the low-range transmitter at |−21 kPa| (84 % of 25 kPa) from start-up', () => {
    const c = chooseStackedTransmitter(good(-21000), good(-21100), null, twoWay);
    expect(c).toEqual(
      expect.objectContaining({ use: 'low', reason: 'low-below-switch-up', differentialPressurePa: -21000 }),
    );
  });

  it('switches down when the high-range magnitude falls below 80 %: |−19 kPa| < 20 kPa', () => {
    const c = chooseStackedTransmitter(good(-18900), good(-19000), 'high', twoWay);
    expect(c).toEqual(expect.objectContaining({ use: 'low', reason: 'switched-down', differentialPressurePa: -18900 }));
  });

  it('treats a reverse reading beyond the low range (−26 kPa) as over range and uses the high-range one', () => {
    const c = chooseStackedTransmitter(good(-26000), good(-26100), 'low', twoWay);
    expect(c.use).toBe('high');
    expect(c.lowOverRange).toBe(true);
  });

  it('judges a reverse reading on its own side of an asymmetric range: −9.5 kPa is 95 % of a −10 kPa lower range value, so it switches up', () => {
    const asymmetric: StackedPairConfig = { ...config, lowLowerRangePa: -10000 };
    // The share 9.5/10 = 0.95 > 0.9; 9.5 kPa would be only 38 % of the forward 25 kPa.
    expect(chooseStackedTransmitter(good(-9500), good(-9600), 'low', asymmetric).use).toBe('high');
    expect(chooseStackedTransmitter(good(-8500), good(-8600), null, asymmetric).use).toBe('low');
  });
});
