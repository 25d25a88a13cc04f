/** Devices (admin): MQTT credentials for field devices, one site each; add, disable, enable. */
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ListWithCreateForm } from '@/components/ui/ListWithCreateForm';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { useDevices } from '@/hooks/api/devices';
import { DevicesCreateForm } from './DevicesCreateForm';
import { DevicesRow } from './DevicesRow';

export function DevicesScreen() {
  const devices = useDevices();
  const list = devices.data ?? [];
  const enabled = list.filter((device) => !device.disabled).length;

  return (
    <Screen lead="Field devices (RTUs, loggers, gateways) sign in to Tallyrun’s MQTT broker with a user name and password issued here. A device may publish only under its own site; a disabled device is refused when it next signs in.">
      <ListWithCreateForm
        list={(style) => (
          <Panel
            title={devices.data ? `Devices (${enabled} enabled of ${list.length})` : 'Devices'}
            actions={
              <Button
                label="Refresh"
                size="compact"
                busy={devices.isFetching && !devices.isPending}
                onPress={() => void devices.refetch()}
              />
            }
            style={style}
            testID="device-list"
          >
            <QueryState
              isPending={devices.isPending}
              error={devices.error}
              onRetry={() => void devices.refetch()}
              noun="devices"
            />
            {devices.data && list.length === 0 ? <AppText tone="muted">No devices yet.</AppText> : null}
            {list.map((device) => (
              <DevicesRow key={device.id} device={device} />
            ))}
          </Panel>
        )}
        form={<DevicesCreateForm />}
      />
    </Screen>
  );
}
