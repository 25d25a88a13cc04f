/**
 * Says whether the board is following the live stream, and as of when it is drawn. A lost
 * stream is an abnormal state of the display itself: shape, words and colour.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { StateBadge } from '@/components/ui/StateBadge';
import { space } from '@/constants/theme';
import type { LiveConnection } from '@/hooks/api/live';
import { formatClock } from '@/shared/format/time';

interface LiveConnectionLineProps {
  connection: LiveConnection;
  receivedAtMs: number | undefined;
  nowMs: number;
}

/** The viewer's clock with its zone named (the board spans sites; shared/format/time.ts). */
const clock = (ms: number) => formatClock(ms, undefined, { seconds: true });

export function LiveConnectionLine({ connection, receivedAtMs, nowMs }: LiveConnectionLineProps) {
  const asOf = receivedAtMs ? `Board as of ${clock(receivedAtMs)}` : 'No board received yet';
  let state;
  if (connection.status === 'live') {
    state = (
      <AppText variant="label" testID="live-connection-live">
        ● Live: updates as readings arrive
      </AppText>
    );
  } else if (connection.status === 'connecting') {
    state = (
      <AppText variant="label" tone="muted">
        ○ Connecting to the live stream…
      </AppText>
    );
  } else if (connection.status === 'unsupported') {
    state = (
      <AppText variant="label" tone="muted">
        ○ Re-read every 15 s (this device cannot hold the live stream open)
      </AppText>
    );
  } else {
    const inS = Math.max(0, Math.ceil((connection.retryAtMs - nowMs) / 1000));
    state = (
      <StateBadge
        priority="medium"
        testID="live-connection-lost"
        label={`Live stream lost (${connection.reason}); ${inS > 0 ? `retrying in ${inS} s` : 'retrying now'}. Figures may be out of date.`}
      />
    );
  }
  return (
    <View style={styles.line} role="status" aria-live="polite">
      {state}
      <AppText variant="caption" tone="muted" tabular>
        {asOf}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  line: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.md,
    justifyContent: 'space-between',
  },
});
