import { QueryClient } from '@tanstack/react-query';

import { liveKeys } from './live';
import { refreshAfterSiteChange, siteKeys, type Site } from './sites';

const site: Site = {
  id: '3',
  code: 'NORTH',
  name: 'North station',
  timeZone: 'America/Denver',
  contractHour: 9,
  basePressurePa: 101_325,
  baseTemperatureK: 288.15,
  atmosphericPressurePa: 83_400,
  displayUnits: 'us',
};

describe('refreshAfterSiteChange', () => {
  it('shows the site at once in the list and its detail, then marks sites and the live board stale', () => {
    const queryClient = new QueryClient();
    queryClient.setQueryData(siteKeys.list(), [{ ...site, name: 'Old name' }]);
    queryClient.setQueryData(liveKeys.board(), { rows: [], receivedAtMs: 0 });

    refreshAfterSiteChange(queryClient, site);

    expect(queryClient.getQueryData(siteKeys.list())).toEqual([site]);
    expect(queryClient.getQueryData(siteKeys.detail('3'))).toEqual(site);
    expect(queryClient.getQueryState(siteKeys.list())?.isInvalidated).toBe(true);
    expect(queryClient.getQueryState(liveKeys.board())?.isInvalidated).toBe(true);
  });
});
