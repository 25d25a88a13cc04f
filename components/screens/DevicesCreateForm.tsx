/**
 * The admin's form for a new field device: a name and the site it publishes for. The answer
 * holds the device's MQTT user name and password; the password is shown here once and never
 * again (the server keeps only its hash).
 */
import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { CopyButton } from '@/components/ui/CopyButton';
import { Reveal } from '@/components/setup/Reveal';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { colors, radius, space } from '@/constants/theme';
import { ApiError } from '@/hooks/api/client';
import { useCreateDevice } from '@/hooks/api/devices';
import { useSites } from '@/hooks/api/sites';
import { deviceSchema } from '@/shared/schemas/setup';

type Field = 'name' | 'siteId';

export function DevicesCreateForm() {
  const create = useCreateDevice();
  const sites = useSites();
  const [name, setName] = useState('');
  const [siteId, setSiteId] = useState<string>('');
  const [problems, setProblems] = useState<Partial<Record<Field, string>>>({});

  const serverError = create.error instanceof ApiError ? create.error : null;
  const serverField = serverError?.field === 'name' || serverError?.field === 'siteId' ? serverError.field : null;
  const shown: Partial<Record<Field, string>> = { ...problems };
  if (serverError && serverField && !shown[serverField])
    shown[serverField] = serverError.message.replace(`${serverField}: `, '');

  const submit = () => {
    const parsed = deviceSchema.safeParse({ name, siteId });
    if (!parsed.success) {
      const found: Partial<Record<Field, string>> = {};
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0]) as Field;
        found[field] ??= field === 'siteId' ? 'Choose the site this device publishes for.' : issue.message;
      }
      setProblems(found);
      return;
    }
    setProblems({});
    create.mutate(parsed.data, { onSuccess: () => setName('') });
  };

  const created = create.data;
  if (created) {
    const siteCode = created.siteCode ?? sites.data?.find((site) => site.id === created.siteId)?.code ?? '<site code>';
    return (
      <Panel title="Device created" testID="device-created">
        <Reveal when={created}>
          <Notice tone="error" title="Store this password now: it will not be shown again">
            Tallyrun keeps only a hash of it. Put it into the device’s configuration before you leave this page. If it
            is lost, create a new device and disable this one.
          </Notice>
        </Reveal>
        <View style={styles.secret}>
          <AppText variant="label">User name</AppText>
          <AppText style={styles.mono} selectable testID="device-created-username">
            {created.username}
          </AppText>
          <CopyButton text={created.username} what="user name" />
        </View>
        <View style={styles.secret}>
          <AppText variant="label">Password</AppText>
          <AppText style={styles.mono} selectable testID="device-created-password">
            {created.password}
          </AppText>
          <CopyButton text={created.password} what="password" testID="device-created-copy" />
        </View>
        {created.broker ? (
          <View style={styles.secret}>
            <AppText variant="label">Broker</AppText>
            <AppText style={styles.mono} selectable testID="device-created-broker">
              {created.broker.url}
            </AppText>
            <CopyButton text={created.broker.url} what="broker address" />
          </View>
        ) : null}
        <AppText variant="caption" tone="muted">
          {`It may publish readings only under its own site’s topics: tallyrun/${siteCode}/<transmitter tag>, QoS 1, payload {"t": "<ISO 8601>", "v": <value>, "q": "good"}.`}
        </AppText>
        <View style={styles.actions}>
          <Button
            label="I have stored it"
            variant="primary"
            onPress={() => create.reset()}
            testID="device-created-done"
          />
        </View>
      </Panel>
    );
  }

  const siteOptions = (sites.data ?? []).map((site) => ({ value: site.id, label: site.code }));
  return (
    <Panel title="Add a device" testID="device-create">
      {create.error && !serverField ? (
        <Reveal when={create.error}>
          <Notice tone="error" testID="device-create-error">
            {create.error.message}
          </Notice>
        </Reveal>
      ) : null}
      <TextField
        label="Name"
        testID="device-create-name"
        value={name}
        onChangeText={(text) => {
          setName(text);
          setProblems((current) => ({ ...current, name: undefined }));
        }}
        error={shown.name}
        hint="Where it sits, e.g. “Pad 1 RTU”."
        autoComplete="off"
      />
      {sites.data && siteOptions.length === 0 ? (
        <Notice>No sites yet: an engineer adds sites under Set-up first.</Notice>
      ) : (
        <View style={styles.site}>
          <ChoiceGroup
            label="Site it publishes for"
            options={siteOptions}
            value={siteId}
            onChange={(next) => {
              setSiteId(next);
              setProblems((current) => ({ ...current, siteId: undefined }));
            }}
            testIDPrefix="device-create-site"
          />
          {shown.siteId ? (
            <AppText variant="caption" tone="error" testID="device-create-site-error">
              {`⊗ ${shown.siteId}`}
            </AppText>
          ) : null}
        </View>
      )}
      <View style={styles.actions}>
        <Button
          label="Create device"
          variant="primary"
          onPress={submit}
          busy={create.isPending}
          testID="device-create-submit"
        />
      </View>
    </Panel>
  );
}

const styles = StyleSheet.create({
  secret: { gap: space.xs, alignItems: 'flex-start' },
  mono: {
    fontFamily: Platform.OS === 'web' ? 'ui-monospace, SFMono-Regular, Menlo, Consolas, monospace' : undefined,
    fontSize: 16,
    padding: space.sm,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.sm,
    alignSelf: 'stretch',
  },
  site: { gap: space.xs },
  actions: { flexDirection: 'row' },
});
