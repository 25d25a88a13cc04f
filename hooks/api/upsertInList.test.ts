import { QueryClient } from '@tanstack/react-query';

import { upsertInList } from './upsertInList';

const key = ['sites', 'list'] as const;

describe('upsertInList', () => {
  it('replaces the cached item with the same id, in place', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(key, [
      { id: '1', name: 'North' },
      { id: '2', name: 'South' },
    ]);
    upsertInList(queryClient, key, { id: '1', name: 'North station' });
    expect(queryClient.getQueryData(key)).toEqual([
      { id: '1', name: 'North station' },
      { id: '2', name: 'South' },
    ]);
  });

  it('adds a new item at the end of the cached list', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(key, [{ id: '1', name: 'North' }]);
    upsertInList(queryClient, key, { id: '3', name: 'East' });
    expect(queryClient.getQueryData(key)).toEqual([
      { id: '1', name: 'North' },
      { id: '3', name: 'East' },
    ]);
  });

  it('leaves a list that is not cached alone, creating nothing', () => {
    const queryClient = new QueryClient();
    upsertInList(queryClient, key, { id: '3', name: 'East' });
    expect(queryClient.getQueryData(key)).toBeUndefined();
  });
});
