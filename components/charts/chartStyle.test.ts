import { colors } from '@/constants/theme';
import { seriesStyle } from './chartStyle';

describe('seriesStyle', () => {
  it('tells series apart by weight and dash, in greys of the theme only (ISA-101: no hue for normal values)', () => {
    const styles = [0, 1, 2, 3].map((rank) => seriesStyle(rank));
    expect(styles.map((s) => s.words)).toEqual(['solid', 'dashed', 'dotted', 'dash-dot']);
    const greys = [colors.text, colors.textMuted, colors.borderStrong];
    for (const style of styles) expect(greys).toContain(style.stroke);
  });

  it('starts again after four ranks, and draws a negative rank as the main line', () => {
    expect(seriesStyle(4)).toBe(seriesStyle(0));
    expect(seriesStyle(-1)).toBe(seriesStyle(0));
    expect(seriesStyle()).toBe(seriesStyle(0));
  });
});
