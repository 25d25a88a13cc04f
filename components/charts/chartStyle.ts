/**
 * Line styles of chart series by rank, all in greys from the theme: weight and dash tell series
 * apart (ISA-101: no hue for normal values). The same ranks name the styles in the fallback.
 */
import { colors } from '@/constants/theme';

export interface SeriesStyle {
  stroke: string;
  width: number;
  dash?: number[];
  /** How the style is described in words, e.g. in the fallback table. */
  words: string;
}

const styles: readonly SeriesStyle[] = [
  { stroke: colors.text, width: 2, words: 'solid' },
  { stroke: colors.textMuted, width: 2, dash: [8, 4], words: 'dashed' },
  { stroke: colors.text, width: 1.5, dash: [2, 3], words: 'dotted' },
  { stroke: colors.borderStrong, width: 2, dash: [12, 4, 2, 4], words: 'dash-dot' },
];

/**
 * @param rank the series' rank (0 the main line)
 * @returns its stroke, width and dash
 */
export function seriesStyle(rank = 0): SeriesStyle {
  return styles[Math.max(0, rank) % styles.length];
}

/** Behind-the-line fill of a min/max band, and the hatch of a zone. */
export const bandFill = 'rgba(107, 114, 122, 0.22)';
export const zoneHatch = colors.textDisabled;
export const zoneLabel = colors.textMuted;
export const referenceLine = colors.borderStrong;
export const gridLine = colors.divider;
export const axisText = colors.textMuted;
