import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';
import { holdHours, periodIsClosed } from '../../history/closed-periods';

/**
 * Period close through the real app and database, at the edges the API test does not reach: the
 * month's bounds on a site's contract calendar, the database's refusal to edit the close history,
 * and a total's status changing to 'closed' and back without a new record version.
 *
 * Bounds worked by hand: a site in America/Denver with contract hour 9. In July Denver keeps
 * mountain daylight time, UTC−6 (IANA tz database), so contract day 1 July starts at 09:00 MDT =
 * 15:00 UTC, and contract month July 2026 is [2026-07-01T15:00Z, 2026-08-01T15:00Z).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let f: Awaited<ReturnType<typeof alarmFixture>>;
let accountant: string;
let admin: string;
const month = '2026-07';
const startMs = Date.parse('2026-07-01T15:00:00Z');
const endMs = Date.parse('2026-08-01T15:00:00Z');
const hourMs = 3_600_000;

beforeAll(async () => {
  t = await testApp();
  accountant = (await t.signedIn('accountant')).token;
  admin = (await t.signedIn('admin')).token;
  f = await alarmFixture(t, (await t.signedIn('engineer')).token, { timeZone: 'America/Denver', contractHour: 9 });
  // A complete contract day of July, as the worker would have stored it (no readings needed here).
  await t.services.pool.query(
    `INSERT INTO daily_totals (meter_run_id, contract_day, start, "end", hours, flow_time_s, mass_kg, volume_m3,
       standard_volume_m3, coverage, status)
     VALUES ($1, '2026-07-10', '2026-07-10T15:00:00Z', '2026-07-11T15:00:00Z', 24, 86400, 1000, 10, 900, 1, 'complete')`,
    [f.meterRunId],
  );
});
afterAll(() => t.close());

const post = (path: string, token: string, body: object) =>
  t.http().post(path).set('Authorization', `Bearer ${token}`).send(body);
const dayTotal = async () =>
  (
    await t.services.pool.query<{ status: string; version: number; status_before_close: string | null }>(
      `SELECT status, version, status_before_close FROM daily_totals WHERE meter_run_id = $1 AND contract_day = '2026-07-10'`,
      [f.meterRunId],
    )
  ).rows[0];
const dayVersions = async () =>
  (
    await t.services.pool.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM period_total_versions WHERE meter_run_id = $1 AND kind = 'day'`,
      [f.meterRunId],
    )
  ).rows[0].n;

describe('period close', () => {
  it('closes the month on the site’s contract calendar, and periodIsClosed answers for exactly its hours', async () => {
    const closed = await post(`/api/periods/${month}/close`, accountant, { siteId: f.siteId, confirm: true });
    expect(closed.status).toBe(200);
    expect(closed.body).toMatchObject({
      status: 'closed',
      start: new Date(startMs).toISOString(),
      end: new Date(endMs).toISOString(),
    });
    const closedAt = (from: number) => periodIsClosed(t.services.pool, f.meterRunId, from, from + hourMs);
    expect(await closedAt(startMs - hourMs)).toBe(false);
    expect(await closedAt(startMs)).toBe(true);
    expect(await closedAt(endMs - hourMs)).toBe(true);
    expect(await closedAt(endMs)).toBe(false);
  });

  it('marks a complete total closed without a new version of it', async () => {
    expect(await dayTotal()).toEqual({ status: 'closed', version: 1, status_before_close: 'complete' });
    expect(await dayVersions()).toBe(0);
  });

  it('keeps the history of closes append-only for the app’s own connection', async () => {
    await expect(t.services.pool.query("UPDATE period_closes SET reason = 'edited'")).rejects.toThrow();
    await expect(t.services.pool.query('DELETE FROM period_closes')).rejects.toThrow();
  });

  it('holds hours a reading queued in the closed month, but not the hourly sweep’s', async () => {
    const late = startMs + 5 * hourMs;
    const swept = startMs + 6 * hourMs;
    await holdHours(
      t.services.pool,
      f.meterRunId,
      [late, swept],
      new Map([
        [late, { cause: 'late-readings', reference: null }],
        [swept, { cause: 'scheduled', reference: null }],
      ]),
    );
    const view = await t
      .http()
      .get(`/api/periods/${month}?siteId=${f.siteId}`)
      .set('Authorization', `Bearer ${accountant}`);
    expect(view.body.pending.hours).toEqual([
      { meterRunId: f.meterRunId, tag: f.tag, hours: 1, starts: [new Date(late).toISOString()] },
    ]);
  });

  it('reopens only for the admin with a reason; the total takes back its status, still without a new version', async () => {
    const byAccountant = await post(`/api/periods/${month}/reopen`, accountant, { siteId: f.siteId, reason: 'x' });
    expect(byAccountant.status).toBe(403);
    const reopened = await post(`/api/periods/${month}/reopen`, admin, { siteId: f.siteId, reason: 'Late data' });
    expect(reopened.status).toBe(200);
    expect(reopened.body).toMatchObject({ status: 'open', pending: { hours: [], imports: [] } });
    expect(await dayTotal()).toEqual({ status: 'complete', version: 1, status_before_close: null });
    expect(await dayVersions()).toBe(0);
    expect(await periodIsClosed(t.services.pool, f.meterRunId, startMs, endMs)).toBe(false);
  });
});
