import { describeAuditFilters, kindChoices, matchingActors, periodWindow } from './auditFilterParams';

describe('periodWindow', () => {
  const nowMs = Date.parse('2026-03-10T12:00:00Z');

  it('gives no window for all time and the last 24 hours up to now for the 24 h preset', () => {
    expect(periodWindow({ preset: 'all' }, nowMs)).toEqual({});
    expect(periodWindow({ preset: '24h' }, nowMs)).toEqual({
      from: '2026-03-09T12:00:00.000Z',
      to: '2026-03-10T12:00:00.000Z',
    });
    expect(periodWindow({ preset: '7d' }, nowMs).from).toBe('2026-03-03T12:00:00.000Z');
  });

  it('reads typed dates as whole days on the viewer calendar, the to date included', () => {
    const window = periodWindow({ preset: 'custom', fromDate: '2026-03-01', toDate: '2026-03-02' }, nowMs);
    expect(window.error).toBeUndefined();
    expect(new Date(window.from!).getTime()).toBe(new Date(2026, 2, 1).getTime());
    expect(new Date(window.to!).getTime()).toBe(new Date(2026, 2, 3).getTime());
  });

  it('names the date at fault: not a date, not a real day, or to before from', () => {
    expect(periodWindow({ preset: 'custom', fromDate: '1 March', toDate: '2026-03-02' }, nowMs).error?.field).toBe(
      'fromDate',
    );
    expect(periodWindow({ preset: 'custom', fromDate: '2026-03-01', toDate: '2026-02-30' }, nowMs).error?.field).toBe(
      'toDate',
    );
    expect(periodWindow({ preset: 'custom', fromDate: '2026-03-05', toDate: '2026-03-01' }, nowMs).error).toEqual({
      field: 'toDate',
      message: 'To: on or after the from date',
    });
  });
});

describe('matchingActors', () => {
  const actors = [{ email: 'Ana@site.test' }, { email: 'bo@site.test' }, { email: 'cy@other.test' }];

  it('matches typed text anywhere in the email, any case, and nothing for empty text', () => {
    expect(matchingActors(actors, 'ana')).toEqual([{ email: 'Ana@site.test' }]);
    expect(matchingActors(actors, 'SITE')).toHaveLength(2);
    expect(matchingActors(actors, '  ')).toEqual([]);
    expect(matchingActors(actors, 'test', 2)).toHaveLength(2);
  });
});

describe('describeAuditFilters', () => {
  it('says what is shown in one line, naming the meter run and user when known', () => {
    expect(describeAuditFilters({}, { preset: 'all' }, {})).toBe('all meter runs · any kind · anyone · all time');
    expect(
      describeAuditFilters(
        { meterRunId: '4', kind: 'configuration', userId: '9' },
        { preset: '7d' },
        { meterRunTag: 'KFG-101', userEmail: 'ana@site.test' },
      ),
    ).toBe('KFG-101 · Configuration · ana@site.test · last 7 days');
  });

  it('offers any kind first, then every kind', () => {
    expect(kindChoices[0]).toEqual({ value: '', label: 'Any kind' });
    expect(kindChoices.map((c) => c.value)).toContain('export');
  });
});
