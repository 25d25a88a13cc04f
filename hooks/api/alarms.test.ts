import { QueryClient } from '@tanstack/react-query';

import { alarmKeys, refreshAlarms, setAlarmInLists, type Alarm, type AlarmFilters } from './alarms';
import { liveKeys } from './live';

function alarm(id: string, state: Alarm['state']): Alarm {
  return {
    id,
    meterRunId: '1',
    meterRunTag: 'MR-1',
    siteId: '1',
    transmitterId: null,
    transmitterTag: null,
    condition: 'dp-low-in-range',
    priority: 'low',
    state,
    conditionActive: true,
    onsetAt: null,
    raisedAt: null,
    clearedAt: null,
    acknowledgedAt: null,
    acknowledgedBy: null,
    shelvedUntil: null,
    shelveReason: null,
    activations: 1,
    message: 'DP low in range',
  };
}

const open: AlarmFilters = { state: 'open' };
const unacknowledged: AlarmFilters = { state: 'unacknowledged', siteId: '1' };

describe('alarmKeys', () => {
  it('keeps every alarm query under the alarms root', () => {
    for (const key of [alarmKeys.list(open), alarmKeys.counts(), alarmKeys.newest(), alarmKeys.events('9')])
      expect(key[0]).toBe(alarmKeys.all[0]);
  });

  it('gives different filters different lists', () => {
    expect(alarmKeys.list(open)).not.toEqual(alarmKeys.list(unacknowledged));
  });
});

describe('setAlarmInLists', () => {
  it('puts the changed alarm into every cached list that holds it, and into no other query', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(alarmKeys.list(open), [alarm('1', 'active-unacknowledged'), alarm('2', 'normal')]);
    queryClient.setQueryData(alarmKeys.list(unacknowledged), [alarm('1', 'active-unacknowledged')]);
    queryClient.setQueryData(alarmKeys.newest(), alarm('1', 'active-unacknowledged'));

    setAlarmInLists(queryClient, alarm('1', 'active-acknowledged'));

    expect(queryClient.getQueryData<Alarm[]>(alarmKeys.list(open))?.map((a) => a.state)).toEqual([
      'active-acknowledged',
      'normal',
    ]);
    expect(queryClient.getQueryData<Alarm[]>(alarmKeys.list(unacknowledged))?.[0].state).toBe('active-acknowledged');
    expect(queryClient.getQueryData<Alarm>(alarmKeys.newest())?.state).toBe('active-unacknowledged');
  });

  it('does not add an alarm to a list that does not hold it', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(alarmKeys.list(open), [alarm('2', 'normal')]);
    setAlarmInLists(queryClient, alarm('1', 'active-acknowledged'));
    expect(queryClient.getQueryData<Alarm[]>(alarmKeys.list(open))?.map((a) => a.id)).toEqual(['2']);
  });
});

describe('refreshAlarms', () => {
  it('marks lists, counts, the newest alarm and logs stale, and nothing outside alarms', async () => {
    const queryClient = new QueryClient();
    const keys = [alarmKeys.list(open), alarmKeys.counts(), alarmKeys.newest(), alarmKeys.events('1')];
    for (const key of keys) queryClient.setQueryData(key, []);
    queryClient.setQueryData(liveKeys.board(), { rows: [], receivedAtMs: 0 });

    await refreshAlarms(queryClient);

    for (const key of keys) expect(queryClient.getQueryState(key)?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(liveKeys.board())?.isInvalidated).toBe(false);
  });
});
