/** Users (admin): who can sign in, with which role; add, re-role, disable and enable. */
import { AppText } from '@/components/ui/AppText';
import { ListWithCreateForm } from '@/components/ui/ListWithCreateForm';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { useUsers } from '@/hooks/api/users';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { CreateUserForm } from './users/CreateUserForm';
import { UserRow } from './users/UserRow';

export function UsersScreen() {
  const me = useSignedInUser();
  const users = useUsers();
  const list = users.data ?? [];
  const active = list.filter((user) => !user.disabled).length;

  return (
    <Screen lead="Everyone who can sign in, and their role. Roles decide which areas and actions each person gets; disabling someone keeps their history in the audit log.">
      <ListWithCreateForm
        list={(style) => (
          <Panel
            title={users.data ? `People (${active} active of ${list.length})` : 'People'}
            style={style}
            testID="user-list"
          >
            <QueryState
              isPending={users.isPending}
              error={users.error}
              onRetry={() => void users.refetch()}
              noun="users"
            />
            {users.data && list.length === 0 ? <AppText tone="muted">No users yet.</AppText> : null}
            {list.map((user) => (
              <UserRow key={user.id} user={user} isSelf={user.id === me.id || user.email === me.email} />
            ))}
          </Panel>
        )}
        form={<CreateUserForm />}
      />
    </Screen>
  );
}
