import type { QueryKey } from '@tanstack/react-query';

import { alarmLimitKeys } from './alarmLimits';
import { alarmKeys } from './alarms';
import { auditEventKeys } from './auditEvents';
import { authKeys } from './auth';
import { ApiError } from './client';
import { deviceKeys } from './devices';
import { healthKeys, isHealthy } from './health';
import { importKeys } from './imports';
import { liveKeys } from './live';
import { mailKeys } from './mail';
import { meterRunKeys } from './meterRuns';
import { createQueryClient } from './queryClient';
import { rangeHealthKeys } from './rangeHealth';
import { siteKeys } from './sites';
import { totalKeys } from './totals';
import { transmitterKeys } from './transmitters';
import { trendKeys } from './trends';
import { userKeys } from './users';

describe('createQueryClient', () => {
  const defaults = createQueryClient().getDefaultOptions();
  const retry = defaults.queries?.retry as (failureCount: number, error: unknown) => boolean;

  it('keeps fetched data fresh for 30 seconds and never retries a mutation', () => {
    expect(defaults.queries?.staleTime).toBe(30_000);
    expect(defaults.mutations?.retry).toBe(false);
  });

  it('does not retry a refusal (4xx), which would come back the same', () => {
    for (const status of [400, 401, 403, 404, 409, 429]) expect(retry(0, new ApiError(status, 'x', 'x'))).toBe(false);
  });

  it('retries a server error or a dropped connection twice', () => {
    for (const error of [new ApiError(503, 'x', 'x'), new ApiError(0, 'network_error', 'x'), new Error('x')]) {
      expect(retry(0, error)).toBe(true);
      expect(retry(1, error)).toBe(true);
      expect(retry(2, error)).toBe(false);
    }
  });
});

describe('the query keys of every resource', () => {
  const request = { meterRunId: '1', from: 'a', to: 'b', uncertaintyLimitPercent: 1 };
  const resources: [readonly unknown[], QueryKey[]][] = [
    [alarmLimitKeys.all, [alarmLimitKeys.meterRun('1')]],
    [alarmKeys.all, [alarmKeys.list({ state: 'open' }), alarmKeys.counts(), alarmKeys.newest(), alarmKeys.events('1')]],
    [auditEventKeys.all, [auditEventKeys.list(100)]],
    [authKeys.all, [authKeys.me()]],
    [deviceKeys.all, [deviceKeys.list()]],
    [healthKeys.all, []],
    [importKeys.all, [importKeys.list(), importKeys.detail('1')]],
    [liveKeys.all, [liveKeys.board()]],
    [mailKeys.all, [mailKeys.list()]],
    [meterRunKeys.all, [meterRunKeys.list(), meterRunKeys.detail('1'), meterRunKeys.configVersions('1')]],
    [rangeHealthKeys.all, [rangeHealthKeys.report(request)]],
    [siteKeys.all, [siteKeys.list(), siteKeys.detail('1')]],
    [totalKeys.all, [totalKeys.totals('1', 'day', 'a', 'b'), totalKeys.hourlyRecords('1', 'a', 'b')]],
    [transmitterKeys.all, [transmitterKeys.list(), transmitterKeys.list('1')]],
    [trendKeys.all, [trendKeys.window('1', 'a', 'b', 600)]],
    [userKeys.all, [userKeys.list()]],
  ];

  it('starts every key with its resource’s root, so invalidating the root reaches it', () => {
    for (const [root, keys] of resources) for (const key of keys) expect(key.slice(0, root.length)).toEqual([...root]);
  });

  it('gives each resource a root of its own, so invalidating one never refetches another', () => {
    const roots = resources.map(([root]) => JSON.stringify(root));
    expect(new Set(roots).size).toBe(roots.length);
  });
});

describe('isHealthy', () => {
  it('is healthy only when the server, the database and the broker are all up', () => {
    expect(isHealthy({ status: 'ok', database: 'up', broker: 'up' })).toBe(true);
    expect(isHealthy({ status: 'ok', database: 'down', broker: 'up' })).toBe(false);
    expect(isHealthy({ status: 'ok', database: 'up', broker: 'down' })).toBe(false);
    expect(isHealthy({ status: 'degraded', database: 'up', broker: 'up' })).toBe(false);
  });
});
