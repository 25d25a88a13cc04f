/**
 * One field device in the admin's list: its site and MQTT user name, how many readings it has
 * had accepted and rejected, the last rejection's reason, when it was last seen; disable
 * (asked once more) or enable it.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { StateBadge } from '@/components/ui/StateBadge';
import { colors, radius, space } from '@/constants/theme';
import { useSetDeviceDisabled, type Device } from '@/hooks/api/devices';

export function DevicesRow({ device }: { device: Device }) {
  const update = useSetDeviceDisabled();
  const [confirming, setConfirming] = useState(false);
  const testID = `device-row-${device.username}`;

  return (
    <View style={[styles.row, device.disabled && styles.rowDisabled]} testID={testID}>
      <View style={styles.summary}>
        <View style={styles.who}>
          <AppText variant="bodyStrong">{device.name}</AppText>
          <AppText tone="muted" selectable>{`${device.siteCode ?? `site ${device.siteId}`} · ${device.username}`}</AppText>
        </View>
        <View style={styles.facts}>
          <AppText variant="label" testID={`${testID}-status`}>
            {device.disabled ? '⊘ Disabled: cannot sign in' : 'Enabled'}
          </AppText>
          <AppText variant="caption" tone="muted">
            {device.lastSeenAt ? `Last seen ${formatTimestamp(device.lastSeenAt)}` : 'Never seen'}
          </AppText>
        </View>
      </View>
      <AppText variant="caption" tabular testID={`${testID}-counts`}>
        {`${device.acceptedCount.toLocaleString()} readings accepted · ${device.rejectedCount.toLocaleString()} rejected`}
      </AppText>
      {device.lastRejection ? <StateBadge priority="low" variant="inline" label={`Last rejection: ${device.lastRejection}`} /> : null}

      {update.error ? (
        <AppText variant="caption" tone="alarm" role="alert">
          {`▲ ${update.error.message}`}
        </AppText>
      ) : null}

      {confirming ? (
        <View style={styles.editor}>
          <AppText>{`Disable ${device.name}? It is refused the next time it signs in, until enabled again. Its readings stay.`}</AppText>
          <View style={styles.actions}>
            <Button
              label="Disable"
              size="compact"
              variant="primary"
              busy={update.isPending}
              onPress={() => update.mutate({ id: device.id, disabled: true }, { onSuccess: () => setConfirming(false) })}
              testID={`${testID}-disable-confirm`}
            />
            <Button label="Cancel" size="compact" variant="quiet" onPress={() => setConfirming(false)} />
          </View>
        </View>
      ) : (
        <View style={styles.actions}>
          {device.disabled ? (
            <Button label="Enable" size="compact" busy={update.isPending} onPress={() => update.mutate({ id: device.id, disabled: false })} testID={`${testID}-enable`} />
          ) : (
            <Button label="Disable" size="compact" onPress={() => setConfirming(true)} testID={`${testID}-disable`} />
          )}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  row: {
    gap: space.sm,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  rowDisabled: { backgroundColor: colors.surfaceSunken },
  summary: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, justifyContent: 'space-between' },
  who: { flexGrow: 1, flexShrink: 1, minWidth: 180 },
  facts: { alignItems: 'flex-start', minWidth: 160 },
  editor: { gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
