/**
 * The props of the chart (Chart.web.tsx draws it with uPlot; Chart.tsx is the plain fallback
 * elsewhere). Series are told apart by line style and weight, not hue: ISA-101 keeps colour for
 * abnormal states (TRADE.md §7), so a normal trend is drawn in greys.
 */

/** A y axis and the scale its series use. */
export interface ChartAxis {
  scale: string;
  /** Axis title with its unit, e.g. "DP, inH2O (60 °F)". */
  label: string;
  side: 'left' | 'right';
  /** Fixed range; null on either end lets the data decide that end. */
  range?: [number | null, number | null];
}

export interface ChartSeries {
  label: string;
  /** One value per x; null leaves a gap. */
  values: (number | null)[];
  scale: string;
  /** 0 is the darkest solid line; higher ranks are lighter, dashed or dotted. */
  rank?: number;
  /** Draw as steps held from each x to the next (hourly figures). */
  stepped?: boolean;
  /** Minimum and maximum of each x's bucket, drawn as a grey band behind the line. */
  band?: { min: (number | null)[]; max: (number | null)[] };
  /** Digits shown in the legend (default 4 significant figures). */
  significant?: number;
}

/** A horizontal zone, e.g. the bottom tenth of a transmitter's span, hatched and labelled. */
export interface ChartZone {
  scale: string;
  from: number;
  to: number;
  label: string;
}

/** A horizontal reference line, e.g. a span's upper range value or an uncertainty limit. */
export interface ChartLine {
  scale: string;
  value: number;
  label: string;
}

/** A vertical marker at an x value, e.g. the minimum, normal and maximum flow. */
export interface ChartMarker {
  x: number;
  label: string;
}

export interface ChartProps {
  /** What the chart shows, for the accessible name and the fallback. */
  title: string;
  x: {
    values: number[];
    /** time: epoch seconds, shown in `timeZone`; log: a logarithmic numeric axis. */
    kind: 'time' | 'linear' | 'log';
    label: string;
    timeZone?: string;
    /** Fixed x range (the chosen time window, so charts of one window line up; a plot's own ends). */
    range?: [number, number];
  };
  axes: ChartAxis[];
  series: ChartSeries[];
  zones?: ChartZone[];
  lines?: ChartLine[];
  markers?: ChartMarker[];
  /** Plot height in px (default 220). */
  height?: number;
  /** Charts with the same key move their cursors together. */
  syncKey?: string;
  /** Shown instead of an empty plot. */
  emptyText?: string;
  testID?: string;
}
