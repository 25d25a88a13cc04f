/**
 * One field device in the admin's list: its site and MQTT user name, how many readings it has
 * had accepted and rejected, the last rejection's reason, when it was last seen; why its readings
 * were refused (on request); disable (asked once more) or enable it.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { DisableEnableActions } from '@/components/ui/DisableEnableActions';
import { StateBadge } from '@/components/ui/StateBadge';
import { colors, radius, space } from '@/constants/theme';
import { useSetDeviceDisabled, type Device } from '@/hooks/api/devices';

import { DeviceRejectionsPanel } from './DeviceRejectionsPanel';

export function DevicesRow({ device }: { device: Device }) {
  const update = useSetDeviceDisabled();
  const [confirming, setConfirming] = useState(false);
  const [showRefusals, setShowRefusals] = useState(false);
  const testID = `device-row-${device.username}`;

  return (
    <View style={[styles.row, device.disabled && styles.rowDisabled]} testID={testID}>
      <View style={styles.summary}>
        <View style={styles.who}>
          <AppText variant="bodyStrong">{device.name}</AppText>
          <AppText
            tone="muted"
            selectable
          >{`${device.siteCode ?? `site ${device.siteId}`} · ${device.username}`}</AppText>
          {device.broker ? (
            <AppText variant="caption" tone="muted" selectable testID={`${testID}-broker`}>
              {`Publishes to ${device.broker.url}`}
            </AppText>
          ) : null}
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
      {device.lastRejection ? (
        <StateBadge priority="low" variant="inline" label={`Last rejection: ${device.lastRejection}`} />
      ) : null}
      {device.rejectedCount > 0 ? (
        <View style={styles.refusals}>
          <Button
            label={showRefusals ? 'Hide refusals' : 'Why refused'}
            size="compact"
            variant="quiet"
            onPress={() => setShowRefusals((shown) => !shown)}
            testID={`${testID}-refusals-toggle`}
          />
        </View>
      ) : null}
      {showRefusals ? <DeviceRejectionsPanel deviceId={device.id} testID={`${testID}-refusals`} /> : null}

      {update.error ? (
        <AppText variant="caption" tone="error" role="alert">
          {`⊗ ${update.error.message}`}
        </AppText>
      ) : null}

      <DisableEnableActions
        disabled={device.disabled}
        confirming={confirming}
        question={`Disable ${device.name}? It is refused the next time it signs in, until enabled again. Its readings stay.`}
        busy={update.isPending}
        onAskToDisable={() => setConfirming(true)}
        onConfirmDisable={() =>
          update.mutate({ id: device.id, disabled: true }, { onSuccess: () => setConfirming(false) })
        }
        onCancel={() => setConfirming(false)}
        onEnable={() => update.mutate({ id: device.id, disabled: false })}
        testIDs={{ disable: `${testID}-disable`, confirm: `${testID}-disable-confirm`, enable: `${testID}-enable` }}
      />
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
  refusals: { flexDirection: 'row' },
});
