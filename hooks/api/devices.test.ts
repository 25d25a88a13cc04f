import { QueryClient } from '@tanstack/react-query';

import { deviceKeys, setDeviceInList, type Device } from './devices';

const device = (id: string, change: Partial<Device> = {}): Device => ({
  id,
  siteId: '3',
  siteCode: 'NORTH',
  name: `RTU ${id}`,
  username: `rtu-${id}`,
  disabled: false,
  acceptedCount: 0,
  rejectedCount: 0,
  lastRejection: null,
  lastSeenAt: null,
  createdAt: '2026-01-01T00:00:00Z',
  ...change,
});

describe('setDeviceInList', () => {
  it('keeps the cached site code when the changed device comes without one (PATCH answers without it)', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(deviceKeys.list(), [device('1')]);
    setDeviceInList(queryClient, device('1', { disabled: true, siteCode: undefined }));
    expect(queryClient.getQueryData<Device[]>(deviceKeys.list())).toEqual([device('1', { disabled: true })]);
  });

  it('adds a new device at the end and leaves an uncached list alone', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(deviceKeys.list(), [device('1')]);
    setDeviceInList(queryClient, device('2'));
    expect(queryClient.getQueryData<Device[]>(deviceKeys.list())?.map((d) => d.id)).toEqual(['1', '2']);
    const empty = new QueryClient();
    setDeviceInList(empty, device('2'));
    expect(empty.getQueryData(deviceKeys.list())).toBeUndefined();
  });
});
