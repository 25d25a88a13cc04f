import { QueryClient } from '@tanstack/react-query';

import { liveKeys } from './live';
import { meterRunKeys, refreshAfterMeterRunChange, type MeterRun } from './meterRuns';
import { siteKeys } from './sites';

const run: MeterRun = {
  id: '12',
  siteId: '3',
  tag: 'MR-12',
  name: 'Meter run 12',
  holdLimitS: 120,
  maxGapS: 600,
  stackSwitchUpShare: 0.9,
  stackSwitchDownShare: 0.8,
  line: {},
};

describe('refreshAfterMeterRunChange', () => {
  it('shows the meter run at once in its detail, its site’s list and the list of all meter runs', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(meterRunKeys.list('3'), []);
    queryClient.setQueryData(meterRunKeys.list(), [{ ...run, name: 'Old name' }]);

    refreshAfterMeterRunChange(queryClient, run);

    expect(queryClient.getQueryData(meterRunKeys.detail('12'))).toEqual(run);
    expect(queryClient.getQueryData(meterRunKeys.list('3'))).toEqual([run]);
    expect(queryClient.getQueryData(meterRunKeys.list())).toEqual([run]);
  });

  it('marks every meter run query and the live board stale, and leaves sites alone', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(meterRunKeys.configVersions('12'), []);
    queryClient.setQueryData(liveKeys.board(), { rows: [], receivedAtMs: 0 });
    queryClient.setQueryData(siteKeys.list(), []);

    refreshAfterMeterRunChange(queryClient, run);

    expect(queryClient.getQueryState(meterRunKeys.configVersions('12'))?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(meterRunKeys.detail('12'))?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(liveKeys.board())?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(siteKeys.list())?.isInvalidated).toBe(false);
  });

  it('keeps each site’s list apart from the list of all meter runs', () => {
    expect(meterRunKeys.list('3')).not.toEqual(meterRunKeys.list());
    expect(meterRunKeys.list(undefined)).toEqual(meterRunKeys.list());
  });
});
