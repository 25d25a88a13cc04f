/** Devices (admin): MQTT credentials for field devices, one site each; add, disable, enable. */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { space } from '@/constants/theme';
import { useDevices } from '@/hooks/api/devices';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { DevicesCreateForm } from './DevicesCreateForm';
import { DevicesRow } from './DevicesRow';

export function DevicesScreen() {
  const devices = useDevices();
  const wide = useBreakpoint() === 'wide';
  const list = devices.data ?? [];
  const enabled = list.filter((device) => !device.disabled).length;

  const listPanel = (
    <Panel
      title={devices.data ? `Devices (${enabled} enabled of ${list.length})` : 'Devices'}
      actions={<Button label="Refresh" size="compact" busy={devices.isFetching && !devices.isPending} onPress={() => void devices.refetch()} />}
      style={wide && styles.listWide}
      testID="device-list"
    >
      <QueryState isPending={devices.isPending} error={devices.error} onRetry={() => void devices.refetch()} noun="devices" />
      {devices.data && list.length === 0 ? <AppText tone="muted">No devices yet.</AppText> : null}
      {list.map((device) => (
        <DevicesRow key={device.id} device={device} />
      ))}
    </Panel>
  );

  return (
    <Screen lead="Field devices (RTUs, loggers, gateways) sign in to Tallyrun’s MQTT broker with a user name and password issued here. A device may publish only under its own site; a disabled device is refused when it next signs in.">
      {wide ? (
        <View style={styles.columns}>
          {listPanel}
          <View style={styles.formWide}>
            <DevicesCreateForm />
          </View>
        </View>
      ) : (
        <>
          <DevicesCreateForm />
          {listPanel}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  listWide: { flex: 3 },
  formWide: { flex: 2, minWidth: 320 },
});
