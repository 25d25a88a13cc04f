/** The admin's form for a new user: name, email, role and a first password. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Reveal } from '@/components/setup/Reveal';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { roleLabel, roles, roleSummary, type Role } from '@/constants/roles';
import { space } from '@/constants/theme';
import { ApiError } from '@/hooks/api/client';
import { useCreateUser, type NewUser } from '@/hooks/api/users';
import { passwordRule } from '@/shared/auth/password-rule';
import { localProblems } from './newUserProblems';

type Field = keyof NewUser;
const fields: readonly Field[] = ['name', 'email', 'role', 'password'];
const roleOptions = roles.map((role) => ({ value: role, label: roleLabel[role] }));

export function CreateUserForm() {
  const create = useCreateUser();
  const [draft, setDraft] = useState<NewUser>({ name: '', email: '', role: 'operator', password: '' });
  const [problems, setProblems] = useState<Partial<Record<Field, string>>>({});
  const [added, setAdded] = useState<string | null>(null);

  const serverError = create.error instanceof ApiError ? create.error : null;
  const serverField =
    serverError?.field && (fields as readonly string[]).includes(serverError.field)
      ? (serverError.field as Field)
      : null;
  const shown: Partial<Record<Field, string>> = { ...problems };
  // The server prefixes a field's message with the field's name, which the form already shows.
  if (serverError && serverField && !shown[serverField])
    shown[serverField] = serverError.message.replace(`${serverField}: `, '');

  const edit = (field: Field) => (value: string) => {
    setDraft((current) => ({ ...current, [field]: value }));
    setProblems((current) => ({ ...current, [field]: undefined }));
    setAdded(null);
    if (create.error) create.reset();
  };

  const submit = () => {
    const user = { ...draft, name: draft.name.trim(), email: draft.email.trim() };
    const found = localProblems(user);
    setProblems(found);
    if (Object.values(found).some(Boolean) || create.isPending) return;
    create.mutate(user, {
      onSuccess: (created) => {
        setAdded(`${created.name} (${created.email}) can now sign in as ${roleLabel[created.role].toLowerCase()}.`);
        setDraft({ name: '', email: '', role: draft.role, password: '' });
      },
    });
  };

  return (
    <Panel title="Add a user" testID="user-create">
      {added ? (
        <Reveal when={added}>
          <Notice testID="user-create-done">{added}</Notice>
        </Reveal>
      ) : null}
      {create.error && !serverField ? (
        <Reveal when={create.error}>
          <Notice tone="error" testID="user-create-error">
            {create.error.message}
          </Notice>
        </Reveal>
      ) : null}
      <TextField
        label="Name"
        testID="user-create-name"
        value={draft.name}
        onChangeText={edit('name')}
        error={shown.name}
        autoComplete="off"
      />
      <TextField
        label="Email"
        testID="user-create-email"
        value={draft.email}
        onChangeText={edit('email')}
        error={shown.email}
        autoCapitalize="none"
        autoCorrect={false}
        autoComplete="off"
        inputMode="email"
      />
      <View style={styles.role}>
        <ChoiceGroup
          label="Role"
          options={roleOptions}
          value={draft.role}
          onChange={(role: Role) => edit('role')(role)}
          testIDPrefix="user-create-role"
        />
        <AppText variant="caption" tone="muted">
          {roleSummary[draft.role]}
        </AppText>
        {shown.role ? (
          <AppText variant="caption" tone="error">
            {`⊗ ${shown.role}`}
          </AppText>
        ) : null}
      </View>
      <TextField
        label="First password"
        testID="user-create-password"
        value={draft.password}
        onChangeText={edit('password')}
        error={shown.password}
        hint={`${passwordRule} Give it to them by a separate channel.`}
        secureTextEntry
        autoComplete="new-password"
        onSubmitEditing={submit}
      />
      <View style={styles.actions}>
        <Button
          testID="user-create-submit"
          label="Add user"
          variant="primary"
          onPress={submit}
          busy={create.isPending}
        />
      </View>
    </Panel>
  );
}

const styles = StyleSheet.create({
  role: { gap: space.xs },
  actions: { flexDirection: 'row' },
});
