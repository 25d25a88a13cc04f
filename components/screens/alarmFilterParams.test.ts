import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { describeFilters, filtersFromParams } from './alarmFilterParams';

describe('filtersFromParams', () => {
  it('shows open alarms of any priority everywhere when the address asks for nothing', () => {
    expect(filtersFromParams({})).toEqual({
      state: 'open',
      priority: undefined,
      siteId: undefined,
      meterRunId: undefined,
    });
  });

  it('takes a known state, priority, site and meter run from the address', () => {
    expect(filtersFromParams({ state: 'unacknowledged', priority: 'high', siteId: '3', meterRunId: '12' })).toEqual({
      state: 'unacknowledged',
      priority: 'high',
      siteId: '3',
      meterRunId: '12',
    });
  });

  it('drops anything unknown: a made-up state or priority, an id that is not digits', () => {
    expect(filtersFromParams({ state: 'panic', priority: 'urgent', siteId: '3; drop', meterRunId: '-1' })).toEqual({
      state: 'open',
      priority: undefined,
      siteId: undefined,
      meterRunId: undefined,
    });
  });
});

describe('describeFilters', () => {
  const sites = [{ id: '3', code: 'NORTH' }] as Site[];
  const meterRuns = [{ id: '12', tag: 'MR-12' }] as MeterRun[];

  it('says what the list shows in one line', () => {
    expect(describeFilters({ state: 'open' }, sites, meterRuns)).toBe('Open · any priority · all sites');
    expect(
      describeFilters({ state: 'shelved', priority: 'high', siteId: '3', meterRunId: '12' }, sites, meterRuns),
    ).toBe('Shelved · ▲ high · NORTH · MR-12');
  });

  it('names a site or meter run it has not loaded by its id', () => {
    expect(describeFilters({ state: 'all', siteId: '9', meterRunId: '40' }, sites, meterRuns)).toBe(
      'All states · any priority · site 9 · meter run 40',
    );
  });
});
