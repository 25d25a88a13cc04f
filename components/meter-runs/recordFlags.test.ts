import { HOUR_FLAG_ORDER } from '@/shared/history/hour-sums';
import { recordFlag } from './recordFlags';

describe('recordFlag', () => {
  it('has words, a shape and a meaning for every flag an hourly record can carry', () => {
    for (const flag of HOUR_FLAG_ORDER) {
      const words = recordFlag(flag);
      expect(words.label).not.toBe(flag);
      expect(words.shape).not.toBe('•');
      expect(words.meaning.length).toBeGreaterThan(10);
    }
  });

  it('draws only flags that make a figure less trustworthy or incomplete as abnormal', () => {
    const attention = HOUR_FLAG_ORDER.filter((flag) => recordFlag(flag).level === 'attention');
    expect([...attention].sort()).toEqual(
      [
        'bad-quality',
        'calculation-error',
        'low-in-range',
        'missing-data',
        'outside-calibration-range',
        'outside-standard-limits',
        'over-range',
        'reverse-flow',
      ].sort(),
    );
  });

  it('puts low in range at 10 % of span', () => {
    expect(recordFlag('low-in-range').meaning).toMatch(/10 % of the span/);
  });

  it('shows a flag it does not know as it came, as a note', () => {
    expect(recordFlag('meter-upside-down')).toEqual({
      label: 'meter-upside-down',
      shape: '•',
      level: 'note',
      meaning: 'meter-upside-down',
    });
  });
});
