/**
 * One user in the admin's list, with the changes an admin makes: role, a new password (the rule is
 * shown, and the server's reason when it refuses one), and disable or enable (disabling asks once more).
 * A new password, a new role or disabling signs the user out everywhere. An admin cannot change their own account here, so the last admin
 * cannot lock everyone out by accident.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { DisableEnableActions } from '@/components/ui/DisableEnableActions';
import { TextField } from '@/components/ui/TextField';
import { roleLabel, roles, type Role } from '@/constants/roles';
import { colors, radius, space } from '@/constants/theme';
import { useUpdateUser, type User, type UserChange } from '@/hooks/api/users';
import { passwordLength, passwordMinLength, passwordRule } from '@/shared/auth/password-rule';

const roleOptions = roles.map((role) => ({ value: role, label: roleLabel[role] }));

interface UserRowProps {
  user: User;
  isSelf: boolean;
}

export function UserRow({ user, isSelf }: UserRowProps) {
  const update = useUpdateUser();
  const [mode, setMode] = useState<'view' | 'role' | 'password' | 'confirm-disable'>('view');
  const [role, setRole] = useState<Role>(user.role);
  const [password, setPassword] = useState('');

  const apply = (change: UserChange) => update.mutate({ id: user.id, change }, { onSuccess: () => setMode('view') });

  return (
    <View style={[styles.row, user.disabled && styles.rowDisabled]} testID={`user-row-${user.email}`}>
      <View style={styles.summary}>
        <View style={styles.who}>
          <AppText variant="bodyStrong">{isSelf ? `${user.name} (you)` : user.name}</AppText>
          <AppText tone="muted" selectable>
            {user.email}
          </AppText>
        </View>
        <View style={styles.facts}>
          <AppText variant="label">{roleLabel[user.role]}</AppText>
          <AppText variant="caption" tone="muted" testID={`user-status-${user.email}`}>
            {user.disabled ? '⊘ Disabled: cannot sign in' : 'Active'}
          </AppText>
          <AppText variant="caption" tone="muted">{`Added ${formatTimestamp(user.createdAt)}`}</AppText>
        </View>
      </View>

      {update.error && mode !== 'password' ? (
        <AppText variant="caption" tone="error" role="alert">
          {`⊗ ${update.error.message}`}
        </AppText>
      ) : null}

      {isSelf ? null : mode === 'password' ? (
        <View style={styles.editor}>
          <TextField
            label={`New password for ${user.name}`}
            testID={`user-password-${user.email}`}
            value={password}
            onChangeText={(value) => {
              setPassword(value);
              if (update.error) update.reset();
            }}
            // The server prefixes its reason with the field's name, which the label already shows.
            error={update.error ? update.error.message.replace('password: ', '') : undefined}
            hint={`${passwordRule} Saving signs ${user.name} out everywhere.`}
            secureTextEntry
            autoComplete="new-password"
          />
          <View style={styles.actions}>
            <Button
              label="Save password"
              size="compact"
              variant="primary"
              busy={update.isPending}
              disabled={passwordLength(password) < passwordMinLength}
              onPress={() => apply({ password })}
              testID={`user-password-save-${user.email}`}
            />
            <Button label="Cancel" size="compact" variant="quiet" onPress={() => setMode('view')} />
          </View>
        </View>
      ) : mode === 'role' ? (
        <View style={styles.editor}>
          <ChoiceGroup
            label={`Role for ${user.name}`}
            options={roleOptions}
            value={role}
            onChange={setRole}
            testIDPrefix={`user-role-${user.email}`}
          />
          <View style={styles.actions}>
            <Button
              label="Save role"
              size="compact"
              variant="primary"
              busy={update.isPending}
              disabled={role === user.role}
              onPress={() => apply({ role })}
            />
            <Button label="Cancel" size="compact" variant="quiet" onPress={() => setMode('view')} />
          </View>
        </View>
      ) : (
        <DisableEnableActions
          disabled={user.disabled}
          confirming={mode === 'confirm-disable'}
          question={`Disable ${user.name}? They are signed out and cannot sign in until enabled again. Their records stay.`}
          busy={update.isPending}
          onAskToDisable={() => setMode('confirm-disable')}
          onConfirmDisable={() => apply({ disabled: true })}
          onCancel={() => setMode('view')}
          onEnable={() => apply({ disabled: false })}
          testIDs={{
            disable: `user-disable-${user.email}`,
            confirm: `user-disable-confirm-${user.email}`,
            enable: `user-enable-${user.email}`,
          }}
        >
          <Button
            label="Change role"
            size="compact"
            onPress={() => {
              setRole(user.role);
              setMode('role');
            }}
            testID={`user-change-role-${user.email}`}
          />
          <Button
            label="Set password"
            size="compact"
            onPress={() => {
              setPassword('');
              update.reset();
              setMode('password');
            }}
            testID={`user-set-password-${user.email}`}
          />
        </DisableEnableActions>
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
  facts: { alignItems: 'flex-start', minWidth: 140 },
  editor: { gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
