import { QueryClient } from '@tanstack/react-query';

import { setUserInList, userKeys, type User } from './users';

const user = (id: string, name: string): User => ({
  id,
  email: `${id}@example.com`,
  name,
  role: 'operator',
  disabled: false,
  createdAt: '2026-01-01T00:00:00Z',
});

describe('setUserInList', () => {
  it('replaces a changed user in place and adds a new one at the end', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(userKeys.list(), [user('1', 'Ann'), user('2', 'Bo')]);
    setUserInList(queryClient, { ...user('1', 'Ann'), disabled: true });
    setUserInList(queryClient, user('3', 'Cy'));
    expect(queryClient.getQueryData<User[]>(userKeys.list())?.map((u) => [u.id, u.disabled])).toEqual([
      ['1', true],
      ['2', false],
      ['3', false],
    ]);
  });

  it('leaves an uncached list alone', () => {
    const queryClient = new QueryClient();
    setUserInList(queryClient, user('1', 'Ann'));
    expect(queryClient.getQueryData(userKeys.list())).toBeUndefined();
  });
});
