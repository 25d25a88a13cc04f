/**
 * Why a device's readings were refused (issue 12 §12): how many of each kind since counting
 * began, and the latest few refusals with their topic and the reading's place in its message.
 */
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { QueryState } from '@/components/ui/QueryState';
import { colors, space } from '@/constants/theme';
import { useDeviceRejections } from '@/hooks/api/devices';

/** How many of the latest refusals the list shows; the server keeps more (its log size). */
const shownLatest = 5;

/** Plain words for the kinds the server counts by; a field name stands for itself. */
const kindWords: Record<string, string> = {
  'other-site': 'topic of another site',
  topic: 'topic not tallyrun/<site>/<tag>',
  'unknown-transmitter': 'unknown transmitter',
  payload: 'payload unreadable',
  time: 'time',
  value: 'value',
  reading: 'reading',
};

export function DeviceRejectionsPanel({ deviceId, testID }: { deviceId: string; testID: string }) {
  const query = useDeviceRejections(deviceId, true);
  if (!query.data)
    return (
      <QueryState
        isPending={query.isPending}
        error={query.error}
        onRetry={() => void query.refetch()}
        noun="refusals"
      />
    );
  const { countsByReason, latest, logSize } = query.data;
  if (countsByReason.length === 0)
    return (
      <AppText variant="caption" tone="muted" testID={`${testID}-none`}>
        No reading of this device has been refused.
      </AppText>
    );
  return (
    <View style={styles.panel} testID={testID}>
      <AppText variant="label">Refused, by reason</AppText>
      {countsByReason.map((c) => (
        <AppText key={c.kind} variant="caption" tabular testID={`${testID}-count-${c.kind}`}>
          {`${c.count.toLocaleString()} × ${kindWords[c.kind] ?? c.kind} (since ${formatTimestamp(c.since)})`}
        </AppText>
      ))}
      <AppText variant="label">{`Latest ${Math.min(shownLatest, latest.length)} of the last ${logSize} kept`}</AppText>
      {latest.slice(0, shownLatest).map((r, i) => (
        <View key={`${r.at}-${i}`} style={styles.entry}>
          <AppText variant="caption" tone="muted">
            {`${formatTimestamp(r.at)} · ${r.topic}${r.readingIndex === null ? '' : ` · reading #${r.readingIndex + 1}`}`}
          </AppText>
          <AppText variant="caption" selectable>
            {r.reason}
          </AppText>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.xs, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.divider },
  entry: { gap: 2 },
});
