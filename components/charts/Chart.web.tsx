/**
 * A chart drawn with uPlot (web only: uPlot draws on a canvas in the DOM). It fills the width of
 * its container and follows it as it resizes, and is destroyed on unmount. The drawing lives in
 * ./plot, loaded with uPlot the first time a chart is drawn, so neither is part of the JavaScript
 * a first visit loads (issue 15 item 4); the box is there at once, the canvas a moment later.
 */
import 'uplot/dist/uPlot.min.css';
import './chart.css';

import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import type { ChartProps } from './chartTypes';

export function Chart(props: ChartProps) {
  const container = useRef<HTMLDivElement | null>(null);
  const empty = props.x.values.length === 0;

  const { title, x, axes, series, zones, lines, markers, height, syncKey } = props;
  // A load that failed (the network dropped) says so instead of leaving a blank box.
  const [loadFailed, setLoadFailed] = useState(false);
  // Rebuilt only when what it draws changes (a parent's re-render passes a new props object
  // even when its parts are the same memoised values).
  useEffect(() => {
    const element = container.current;
    if (!element || empty) return undefined;
    const chart = { title, x, axes, series, zones, lines, markers, height, syncKey };
    let unmounted = false;
    let cleanUp: (() => void) | null = null;
    import('./plot').then(
      ({ drawChart }) => {
        if (!unmounted) cleanUp = drawChart(element, chart);
      },
      () => {
        if (!unmounted) setLoadFailed(true);
      },
    );
    return () => {
      unmounted = true;
      cleanUp?.();
    };
  }, [title, x, axes, series, zones, lines, markers, height, syncKey, empty]);

  if (empty) {
    return (
      <View style={styles.empty} testID={props.testID}>
        <AppText tone="muted">{props.emptyText ?? 'Nothing to draw in this window.'}</AppText>
      </View>
    );
  }
  if (loadFailed) {
    return (
      <View style={styles.empty} testID={props.testID}>
        <AppText tone="muted">The chart could not be loaded. Reload the page to try again.</AppText>
      </View>
    );
  }
  return (
    <div
      ref={container}
      role="figure"
      aria-label={props.title}
      data-testid={props.testID}
      style={{ width: '100%', minWidth: 0 }}
    />
  );
}

const styles = StyleSheet.create({
  empty: { paddingVertical: 24 },
});
