/**
 * The uPlot half of the web chart (Chart.web.tsx): options, hooks and drawing. It is a module of
 * its own so the chart can load it, and uPlot with it, only when a screen first draws a chart
 * (a dynamic import): uPlot stays out of the JavaScript every first visit loads (issue 15 item 4).
 * Min/max bands, hatched zones (e.g. the bottom tenth of a span), reference lines and vertical
 * markers are drawn in greys; the legend under the plot reads out values at the cursor.
 */
import uPlot from 'uplot';

import { formatNumber, formatPlain } from '@/constants/units-display';
import { fontFamily } from '@/constants/theme';
import type { ChartLine, ChartMarker, ChartProps, ChartZone } from './chartTypes';
import { axisText, bandFill, gridLine, referenceLine, seriesStyle, zoneHatch, zoneLabel } from './chartStyle';

const defaultHeight = 220;
const font = `12px ${fontFamily.regular}, system-ui, sans-serif`;
const labelFont = `13px ${fontFamily.medium}, system-ui, sans-serif`;

/** A scale's range with the fixed ends kept and the free ends taken from the data, padded. */
function rangeFor(fixed: [number | null, number | null] | undefined): uPlot.Scale.Range | undefined {
  if (!fixed) return undefined;
  return (_u, dataMin, dataMax) => {
    const low = fixed[0] ?? dataMin ?? 0;
    let high = fixed[1] ?? dataMax ?? 1;
    if (fixed[1] === null && dataMax !== null && dataMax !== undefined) high = dataMax + Math.abs(dataMax - low) * 0.05;
    return high > low ? [low, high] : [low, low + 1];
  };
}

/** Diagonal hatching for a zone, drawn at the canvas' pixel ratio. */
function hatchPattern(ctx: CanvasRenderingContext2D): CanvasPattern | string {
  const size = Math.round(8 * uPlot.pxRatio);
  const tile = document.createElement('canvas');
  tile.width = size;
  tile.height = size;
  const t = tile.getContext('2d');
  if (!t) return bandFill;
  t.strokeStyle = zoneHatch;
  t.lineWidth = uPlot.pxRatio;
  t.beginPath();
  t.moveTo(0, size);
  t.lineTo(size, 0);
  t.stroke();
  return ctx.createPattern(tile, 'repeat') ?? bandFill;
}

interface LabelBox {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

/**
 * Writes a label at the left or right edge of the plot, whichever is free; on a narrow chart
 * where both would collide with a label already written (or not fit), the label is left out:
 * the note above the chart says what the hatching and the dashed lines are.
 */
function placeLabel(u: uPlot, placed: LabelBox[], text: string, y: number, prefer: 'left' | 'right', below: boolean) {
  const { ctx, bbox } = u;
  const px = uPlot.pxRatio;
  const width = ctx.measureText(text).width;
  const height = 12 * px;
  if (width > bbox.width - 8 * px) return;
  const y0 = below ? y + 2 * px : y - 2 * px - height;
  for (const side of prefer === 'left' ? (['left', 'right'] as const) : (['right', 'left'] as const)) {
    const x0 = side === 'left' ? bbox.left + 4 * px : bbox.left + bbox.width - 4 * px - width;
    const box = { x0, x1: x0 + width, y0, y1: y0 + height };
    if (placed.some((p) => box.x0 < p.x1 && p.x0 < box.x1 && box.y0 < p.y1 && p.y0 < box.y1)) continue;
    placed.push(box);
    ctx.fillStyle = zoneLabel;
    ctx.textAlign = 'left';
    ctx.textBaseline = 'top';
    ctx.fillText(text, x0, y0);
    return;
  }
}

function drawZones(u: uPlot, zones: readonly ChartZone[], lines: readonly ChartLine[]) {
  const { ctx, bbox } = u;
  const px = uPlot.pxRatio;
  const placed: LabelBox[] = [];
  ctx.save();
  ctx.beginPath();
  ctx.rect(bbox.left, bbox.top, bbox.width, bbox.height);
  ctx.clip();
  ctx.font = `${Math.round(11 * px)}px ${fontFamily.medium}, system-ui, sans-serif`;
  const tops: number[] = [];
  zones.forEach((zone) => {
    const y0 = u.valToPos(zone.from, zone.scale, true);
    const y1 = u.valToPos(zone.to, zone.scale, true);
    const top = Math.min(y0, y1);
    tops.push(top);
    ctx.fillStyle = hatchPattern(ctx);
    ctx.fillRect(bbox.left, top, bbox.width, Math.abs(y1 - y0));
    ctx.strokeStyle = zoneHatch;
    ctx.lineWidth = px;
    ctx.setLineDash([]);
    ctx.beginPath();
    ctx.moveTo(bbox.left, top);
    ctx.lineTo(bbox.left + bbox.width, top);
    ctx.stroke();
  });
  lines.forEach((line) => {
    const y = u.valToPos(line.value, line.scale, true);
    ctx.strokeStyle = referenceLine;
    ctx.lineWidth = px;
    ctx.setLineDash([6 * px, 4 * px]);
    ctx.beginPath();
    ctx.moveTo(bbox.left, y);
    ctx.lineTo(bbox.left + bbox.width, y);
    ctx.stroke();
  });
  // Labels after all the drawing, so none is hatched over; lines first (they are fewer).
  lines.forEach((line) => placeLabel(u, placed, line.label, u.valToPos(line.value, line.scale, true), 'right', false));
  zones.forEach((zone, i) => {
    const height = Math.abs(u.valToPos(zone.from, zone.scale, true) - u.valToPos(zone.to, zone.scale, true));
    // Inside a zone tall enough to hold the words, else just above it.
    placeLabel(u, placed, zone.label, tops[i], 'left', height >= 16 * px);
  });
  ctx.restore();
}

function drawMarkers(u: uPlot, markers: readonly ChartMarker[]) {
  const { ctx, bbox } = u;
  const px = uPlot.pxRatio;
  const rowHeight = 13 * px;
  const placed: LabelBox[] = [];
  ctx.save();
  ctx.font = `${Math.round(11 * px)}px ${fontFamily.medium}, system-ui, sans-serif`;
  ctx.textBaseline = 'top';
  ctx.textAlign = 'left';
  markers.forEach((marker) => {
    const x = u.valToPos(marker.x, 'x', true);
    if (x < bbox.left - px || x > bbox.left + bbox.width + px) return;
    ctx.strokeStyle = referenceLine;
    ctx.lineWidth = px;
    ctx.setLineDash([3 * px, 3 * px]);
    ctx.beginPath();
    ctx.moveTo(x, bbox.top);
    ctx.lineTo(x, bbox.top + bbox.height);
    ctx.stroke();
    // Centred on the line, kept inside the plot, and moved down a row when it would touch
    // the label of a marker close by.
    const width = ctx.measureText(marker.label).width;
    const x0 = Math.min(Math.max(x - width / 2, bbox.left + 2 * px), bbox.left + bbox.width - width - 2 * px);
    for (let row = 0; row < 3; row++) {
      const y0 = bbox.top + 2 * px + row * rowHeight;
      const box = { x0: x0 - 2 * px, x1: x0 + width + 2 * px, y0, y1: y0 + rowHeight };
      if (placed.some((p) => box.x0 < p.x1 && p.x0 < box.x1 && box.y0 < p.y1 && p.y0 < box.y1)) continue;
      placed.push(box);
      ctx.fillStyle = zoneLabel;
      ctx.fillText(marker.label, x0, y0);
      break;
    }
  });
  ctx.restore();
}

/** Tick labels as plain numbers ("50", not "50.0"); uPlot leaves null where it skips a tick. */
function tickLabels(_u: uPlot, splits: (number | null)[]): string[] {
  return splits.map((v) => (v === null || v === undefined ? '' : formatPlain(v)));
}

/** On a log axis, only the 1, 2 and 5 of each decade are written, so labels do not crowd. */
function logTickLabels(_u: uPlot, splits: (number | null)[]): string[] {
  return splits.map((v) => {
    if (v === null || v === undefined || !(v > 0)) return '';
    const leading = Math.round(v / Math.pow(10, Math.floor(Math.log10(v) + 1e-9)));
    return leading === 1 || leading === 2 || leading === 5 ? formatPlain(v) : '';
  });
}

let measureContext: CanvasRenderingContext2D | null = null;

/**
 * A value axis as wide as its longest tick number (measured in the axis font) plus the tick and
 * gap, never less than `least` px: a fixed width let "1,200" run into the rotated axis title on a
 * phone. uPlot calls this again once the values are known; from the third pass the width is kept,
 * so the layout settles.
 */
function valueAxisSize(least: number) {
  return (u: uPlot, values: string[] | null, axisIndex: number, cycle: number): number => {
    const axis = u.axes[axisIndex] as uPlot.Axis & { _size?: number };
    if (cycle > 1 && axis._size) return axis._size;
    measureContext ??= document.createElement('canvas').getContext('2d');
    if (!measureContext) return least;
    measureContext.font = font;
    const widest = Math.max(0, ...(values ?? []).map((v) => measureContext?.measureText(String(v ?? '')).width ?? 0));
    const tick = axis.ticks?.show === false ? 0 : (axis.ticks?.size ?? 10);
    return Math.max(least, Math.ceil(tick + (axis.gap ?? 5) + widest + 4));
  };
}

/** Time axis labels on the site's clock, 24-hour, with the date where the day changes. */
function timeFormatting(timeZone: string | undefined) {
  const local = (ts: number) => (timeZone ? uPlot.tzDate(new Date(ts * 1e3), timeZone) : new Date(ts * 1e3));
  const hourMinute = uPlot.fmtDate('{HH}:{mm}');
  const dayMonth = uPlot.fmtDate('{D} {MMM}');
  const full = uPlot.fmtDate('{D} {MMM} {YYYY} {HH}:{mm}');
  const axis = (_u: uPlot, splits: number[], _axis: number, _space: number, increment: number) =>
    splits.map((ts, i) => {
      const date = local(ts);
      if (increment >= 86_400) return dayMonth(date);
      const previous = i > 0 ? local(splits[i - 1]) : null;
      return !previous || previous.getDate() !== date.getDate()
        ? `${hourMinute(date)}\n${dayMonth(date)}`
        : hourMinute(date);
    });
  const legend = (_u: uPlot, ts: number | null) => (ts === null || ts === undefined ? '—' : full(local(ts)));
  return { axis, legend };
}

/** Builds uPlot's options and aligned data from the chart's props. */
function build(
  props: ChartProps,
  width: number,
): { options: uPlot.Options; data: uPlot.AlignedData; hiddenLegend: number[] } {
  const { x, axes, series, zones = [], lines = [], markers = [] } = props;
  const isTime = x.kind === 'time';
  const time = timeFormatting(x.timeZone);
  const uSeries: uPlot.Series[] = [
    isTime ? { label: x.label, value: time.legend } : { label: x.label, value: (_u, v) => formatNumber(v) },
  ];
  const data: (number | null)[][] = [x.values];
  const bands: uPlot.Band[] = [];
  const hiddenLegend: number[] = [];
  for (const s of series) {
    const style = seriesStyle(s.rank);
    const format = (v: number | null | undefined) => formatNumber(v, s.significant);
    let value = (_u: uPlot, v: number | null) => format(v);
    if (s.band) {
      const maxIndex = uSeries.length;
      // The band's edges stay out of the legend; the line's own entry reads "mean (min–max)".
      uSeries.push({ label: `${s.label} max`, scale: s.scale, stroke: bandFill, width: 1, points: { show: false } });
      uSeries.push({ label: `${s.label} min`, scale: s.scale, stroke: bandFill, width: 1, points: { show: false } });
      data.push(s.band.max, s.band.min);
      bands.push({ series: [maxIndex, maxIndex + 1], fill: bandFill });
      hiddenLegend.push(maxIndex, maxIndex + 1);
      value = (u: uPlot, v: number | null) => {
        const index = u.cursor.idx;
        if (v === null || v === undefined || index === null || index === undefined) return format(v);
        return `${format(v)} (${format(u.data[maxIndex + 1][index])}–${format(u.data[maxIndex][index])})`;
      };
    }
    uSeries.push({
      label: s.label,
      scale: s.scale,
      stroke: style.stroke,
      width: style.width,
      dash: style.dash,
      value,
      paths: s.stepped ? uPlot.paths.stepped?.({ align: 1 }) : undefined,
      spanGaps: false,
    });
    data.push(s.values);
  }

  const xRange = x.range;
  const fixedX = xRange ? { range: (): uPlot.Range.MinMax => xRange } : {};
  const scales: uPlot.Scales = {
    x: isTime
      ? { time: true, ...fixedX }
      : x.kind === 'log'
        ? { time: false, distr: 3, log: 10, ...fixedX }
        : { time: false, ...fixedX },
  };
  for (const axis of axes) scales[axis.scale] = { auto: true, range: rangeFor(axis.range) };

  // On a phone the axes give up some room so the plot keeps most of the width.
  const narrow = width < 520;
  const axisBase = {
    stroke: axisText,
    font,
    labelFont,
    ticks: { stroke: gridLine, width: 1 },
    ...(narrow ? { labelSize: 18, labelGap: 0 } : {}),
  };
  const uAxes: uPlot.Axis[] = [
    {
      ...axisBase,
      scale: 'x',
      grid: { stroke: gridLine, width: 1 },
      label: isTime ? undefined : x.label,
      ...(isTime
        ? { values: time.axis, size: 44 }
        : x.kind === 'log'
          ? // Every split is kept (uPlot's own log filter keeps only the decades); the labels pick 1, 2 and 5.
            { values: logTickLabels, filter: (_u: uPlot, splits: number[]) => splits }
          : { values: tickLabels }),
    },
    ...axes.map((axis, i): uPlot.Axis => ({
      ...axisBase,
      scale: axis.scale,
      side: axis.side === 'left' ? 3 : 1,
      label: axis.label,
      grid: { show: i === 0, stroke: gridLine, width: 1 },
      size: valueAxisSize(narrow ? 32 : 56),
      values: tickLabels,
    })),
  ];

  const options: uPlot.Options = {
    width,
    height: props.height ?? defaultHeight,
    series: uSeries,
    bands,
    scales,
    axes: uAxes,
    legend: { show: true },
    cursor: props.syncKey ? { sync: { key: props.syncKey } } : {},
    tzDate: isTime && x.timeZone ? (ts) => uPlot.tzDate(new Date(ts * 1e3), x.timeZone as string) : undefined,
    hooks: {
      drawAxes: [(u) => drawZones(u, zones, lines)],
      draw: [(u) => drawMarkers(u, markers)],
    },
  };
  return { options, data: data as uPlot.AlignedData, hiddenLegend };
}

/**
 * Draws the chart into `element` at its current width and follows the element as it resizes
 * (ResizeObserver); returns the clean-up that stops following and destroys the plot.
 */
export function drawChart(element: HTMLElement, chart: ChartProps): () => void {
  const { options, data, hiddenLegend } = build(chart, Math.max(element.clientWidth, 200));
  const plot = new uPlot(options, data, element);
  const legendRows = plot.root.querySelectorAll<HTMLElement>('.u-legend .u-series');
  for (const index of hiddenLegend) legendRows[index]?.style.setProperty('display', 'none');
  const observer = new ResizeObserver((entries) => {
    const width = Math.floor(entries[0]?.contentRect.width ?? 0);
    if (width > 0 && width !== plot.width) plot.setSize({ width, height: plot.height });
  });
  observer.observe(element);
  return () => {
    observer.disconnect();
    plot.destroy();
  };
}
