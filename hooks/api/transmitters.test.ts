import { QueryClient } from '@tanstack/react-query';

import { liveKeys } from './live';
import { refreshAfterTransmitterChange, transmitterKeys, type Transmitter } from './transmitters';

const transmitter: Transmitter = {
  id: '5',
  meterRunId: '12',
  tag: 'DP-12A',
  measures: 'differential-pressure',
  unit: 'inH2O-60F',
  pressureReference: 'absolute',
  lowerRange: 0,
  upperRange: 250,
  stackRole: 'high',
  accuracyPercentOfSpan: 0.075,
  calibrationDue: null,
};

describe('refreshAfterTransmitterChange', () => {
  it('shows the transmitter at once in its meter run’s list and the list of all, then marks both and the board stale', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(transmitterKeys.list('12'), []);
    queryClient.setQueryData(transmitterKeys.list(), [{ ...transmitter, upperRange: 100 }]);
    queryClient.setQueryData(liveKeys.board(), { rows: [], receivedAtMs: 0 });

    refreshAfterTransmitterChange(queryClient, transmitter);

    expect(queryClient.getQueryData(transmitterKeys.list('12'))).toEqual([transmitter]);
    expect(queryClient.getQueryData(transmitterKeys.list())).toEqual([transmitter]);
    expect(queryClient.getQueryState(transmitterKeys.list('12'))?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(liveKeys.board())?.isInvalidated).toBe(true);
  });
});
