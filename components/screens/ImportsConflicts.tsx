/**
 * Conflicting readings: a reading re-sent (by a device or in a file) for a time that already had
 * one, with another value or quality. The first stays stored; each conflict is listed here with
 * both values until an engineer resolves it, with a reason (a different figure is brought in by a
 * correction). Values are shown in full, as stored: the difference may be in the last digits.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { QueryState } from '@/components/ui/QueryState';
import { ReasonDialog } from '@/components/ui/ReasonDialog';
import { colors, radius, space } from '@/constants/theme';
import { ApiError } from '@/hooks/api/client';
import { useOpenReadingConflicts, useResolveReadingConflict, type ReadingConflict } from '@/hooks/api/readingConflicts';

/** "device:12" → "device 12", "import:7" → "import 7", a path name as it is. */
const sourceText = (source: string) => source.replace(':', ' ');

const reading = (value: number, quality: string, unit: string) =>
  `${String(value)} ${unit}${quality === 'good' ? '' : ` (${quality})`}`;

export function ImportsConflicts() {
  const conflicts = useOpenReadingConflicts();
  const resolve = useResolveReadingConflict();
  const [resolvingId, setResolvingId] = useState<string | null>(null);

  const error = resolve.error instanceof ApiError ? resolve.error : null;
  const confirm = (item: ReadingConflict, resolution: string) =>
    resolve.mutate({ conflictId: item.id, resolution }, { onSuccess: () => setResolvingId(null) });

  return (
    <View style={styles.list} testID="reading-conflicts">
      <QueryState
        isPending={conflicts.isPending}
        error={conflicts.error}
        onRetry={() => void conflicts.refetch()}
        noun="conflicting readings"
      />
      {conflicts.data && conflicts.data.length === 0 ? (
        <AppText tone="muted" testID="reading-conflicts-none">
          No conflicting readings are open.
        </AppText>
      ) : null}
      {conflicts.data?.map((item) => (
        <View key={item.id} style={styles.row} testID={`reading-conflict-${item.id}`}>
          <View style={styles.top}>
            <AppText variant="bodyStrong" style={styles.tag}>
              {item.transmitterTag}
            </AppText>
            <AppText variant="caption" tone="muted" tabular>
              {formatTimestamp(item.time)}
            </AppText>
          </View>
          <AppText variant="caption" tabular testID={`reading-conflict-${item.id}-stored`}>
            {`Kept: ${reading(item.storedValue, item.storedQuality, item.unit)} from ${sourceText(item.storedSource)}`}
          </AppText>
          <AppText variant="caption" tabular testID={`reading-conflict-${item.id}-offered`}>
            {`Re-sent: ${reading(item.offeredValue, item.offeredQuality, item.unit)} from ${sourceText(item.offeredSource)}, ${formatTimestamp(item.offeredArrivedAt)}`}
          </AppText>
          {resolvingId === item.id ? (
            <ReasonDialog
              title={`Resolve the conflict on ${item.transmitterTag}`}
              explanation="The kept reading stays stored. Say why the conflict is settled; to use the re-sent value instead, propose a correction first and name it here."
              ariaLabel={`Resolve the conflict on ${item.transmitterTag}`}
              testIDPrefix="reading-conflict-resolve"
              missingReason="Give the reason the conflict is settled."
              reasonError={error?.field === 'resolution' ? error.message : undefined}
              otherError={error && error.field !== 'resolution' ? error.message : undefined}
              confirmLabel="Resolve"
              busy={resolve.isPending}
              onConfirm={(reason) => confirm(item, reason)}
              onCancel={() => {
                setResolvingId(null);
                resolve.reset();
              }}
            />
          ) : (
            <View style={styles.actions}>
              <Button
                label="Resolve…"
                size="compact"
                onPress={() => {
                  resolve.reset();
                  setResolvingId(item.id);
                }}
                testID={`reading-conflict-${item.id}-resolve`}
              />
            </View>
          )}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xs },
  row: {
    gap: space.xxs,
    padding: space.sm,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
    backgroundColor: colors.surfaceRaised,
  },
  top: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'baseline' },
  tag: { flexShrink: 1 },
  actions: { flexDirection: 'row', marginTop: space.xxs },
});
