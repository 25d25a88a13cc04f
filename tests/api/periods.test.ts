import { client, createMeterRun, engineRate, settled, signIn, until, type Client } from '../support/api';

/**
 * Period close and reopen through the real server (issue 10 §5): CSV import → hourly records and
 * totals → close → a late CSV for the closed month → reopen. The expected masses are worked by
 * hand from the engine's constant rate (as tests/api/config-history.test.ts does): with a constant
 * input every whole hour is rate × 3600 s, so the contract day is rate × 3600 s × its hours.
 */
let engineer: Client;
let accountant: Client;
let admin: Client;
beforeAll(async () => {
  engineer = client(await signIn('engineer@demo.tallyrun'));
  accountant = client(await signIn('accountant@demo.tallyrun'));
  admin = client(await signIn('admin@demo.tallyrun'));
});

const hourMs = 3_600_000;
const relative = (a: number, b: number) => Math.abs(a / b - 1);
const month = '2026-08';
const day = Date.parse('2026-08-10T00:00:00Z');

describe('closing and reopening a contract month', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  let rate: number;

  /** Readings of 25 kPa, 2 MPa and 300 K every 10 minutes over [fromMs, toMs). */
  const importHours = async (fromMs: number, toMs: number) => {
    const lines = ['time,tag,value,quality'];
    for (let t = fromMs; t < toMs; t += 10 * 60_000) {
      const iso = new Date(t).toISOString();
      lines.push(`${iso},${f.dp.tag},25,good`, `${iso},${f.pt.tag},2,good`, `${iso},${f.tt.tag},300,good`);
    }
    const started = await engineer.upload('/api/imports', 'readings.csv', lines.join('\n') + '\n');
    expect(started.status).toBe(202);
    await until('the import to finish', async () => {
      const r = await engineer.get(`/api/imports/${started.body.id}`);
      return r.body.status !== 'running' ? r.body : null;
    });
    return started.body.id as string;
  };
  /** The contract day 10 August and the month August, as the totals API gives them. */
  const totals = async (interval: 'day' | 'month') => {
    const list = (
      await engineer.get(
        `/api/meter-runs/${f.meterRun.id}/totals?interval=${interval}&from=2026-08-01T00:00:00Z&to=2026-09-01T00:00:00Z`,
      )
    ).body as { start: string; massKg: number; hours: number; status: string; version: number }[];
    const start = interval === 'day' ? '2026-08-10T00:00:00.000Z' : '2026-08-01T00:00:00.000Z';
    const found = list.find((t) => t.start === start);
    if (!found) throw new Error(`no ${interval} total starting ${start}: ${JSON.stringify(list.slice(0, 3))}`);
    return found;
  };
  const period = async () => (await accountant.get(`/api/periods/${month}?siteId=${f.site.id}`)).body;

  beforeAll(async () => {
    f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0, maxGapS: 900 });
    rate = await engineRate(engineer, f.element, f.fluid, 25_000, 2e6, 300);
    await importHours(day, day + 6 * hourMs);
    await settled(engineer, f.meterRun.id);
  });

  it('lists an open month with what is not final, and refuses to close it without confirm, naming what is missing', async () => {
    const open = await period();
    expect(open).toMatchObject({ siteId: f.site.id, month, status: 'open', closedAt: null, closedBy: null });
    expect(open.start).toBe('2026-08-01T00:00:00.000Z');
    expect(open.end).toBe('2026-09-01T00:00:00.000Z');
    expect(open.pending).toEqual({ hours: [], imports: [] });
    // 31 days of hours, 7 recorded: 00:00–06:00 and the 06:00 hour, which the last DP sample (05:50)
    // still feeds for the largest gap, 900 s, until 06:05. A reading queues every hour it feeds
    // (issue 13, item 7); before, only its own hour was queued and the 06:00 hour stayed unrecorded.
    expect(open.incomplete.final).toBe(false);
    expect(open.incomplete.hours).toEqual([
      {
        meterRunId: f.meterRun.id,
        tag: f.meterRun.tag,
        missingHours: 31 * 24 - 7,
        provisionalRecords: 0,
        queuedHours: 0,
      },
    ]);

    const refused = await accountant.post(`/api/periods/${month}/close`, { siteId: f.site.id });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'period_incomplete', field: 'confirm' });
    expect(refused.body.error.message).toContain(`${f.meterRun.tag}: 737 hours missing`);
    expect((await period()).status).toBe('open');
  });

  it('refuses a month that has not ended, an unknown site and a malformed month', async () => {
    const running = await accountant.post('/api/periods/2099-01/close', { siteId: f.site.id, confirm: true });
    expect(running.status).toBe(409);
    expect(running.body.error).toMatchObject({ code: 'period_running', field: 'month' });
    const unknown = await accountant.post(`/api/periods/${month}/close`, { siteId: '999999999', confirm: true });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.field).toBe('siteId');
    const malformed = await accountant.get(`/api/periods/2026-13?siteId=${f.site.id}`);
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.field).toBe('month');
  });

  let closedDay: { massKg: number; version: number };
  let closedMonth: { massKg: number; version: number };

  it('closes with confirm: the totals read closed, keep their figures and version, and a second close is 409', async () => {
    const before = { day: await totals('day'), month: await totals('month') };
    // 00:00–06:00 in full and 300 s of the 06:00 hour (the 05:50 sample stands until 06:05).
    expect(relative(before.day.massKg, rate * (3600 * 6 + 300))).toBeLessThan(1e-9);

    const closed = await accountant.post(`/api/periods/${month}/close`, {
      siteId: f.site.id,
      confirm: true,
      reason: 'August volumes reviewed',
    });
    expect(closed.status).toBe(200);
    expect(closed.body).toMatchObject({ status: 'closed', closedBy: { email: 'accountant@demo.tallyrun' } });
    expect(Date.parse(closed.body.closedAt)).toBeGreaterThan(Date.now() - 60_000);

    const after = { day: await totals('day'), month: await totals('month') };
    for (const k of ['day', 'month'] as const) {
      expect(after[k].status).toBe('closed');
      expect(after[k].massKg).toBe(before[k].massKg);
      expect(after[k].version).toBe(before[k].version);
    }
    closedDay = after.day;
    closedMonth = after.month;

    const again = await accountant.post(`/api/periods/${month}/close`, { siteId: f.site.id, confirm: true });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'period_closed', field: 'month' });
  });

  it('stores a late CSV for the closed month but leaves every closed total unchanged and lists it as pending', async () => {
    const importId = await importHours(day + 6 * hourMs, day + 8 * hourMs);
    await settled(engineer, f.meterRun.id);
    const d = await totals('day');
    const m = await totals('month');
    expect(d).toMatchObject({ massKg: closedDay.massKg, version: closedDay.version, status: 'closed' });
    expect(m).toMatchObject({ massKg: closedMonth.massKg, version: closedMonth.version, status: 'closed' });
    const hours = (
      await engineer.get(
        `/api/meter-runs/${f.meterRun.id}/hourly-records?from=${new Date(day).toISOString()}&to=${new Date(day + 24 * hourMs).toISOString()}`,
      )
    ).body as unknown[];
    // The seven records computed before the close (00:00–06:00, and 06:00 fed until 06:05), unchanged.
    expect(hours).toHaveLength(7);

    const p = await period();
    expect(p.status).toBe('closed');
    expect(p.pending.imports.map((i: { id: string }) => i.id)).toEqual([importId]);
    expect(p.pending.hours).toHaveLength(1);
    expect(p.pending.hours[0]).toMatchObject({ meterRunId: f.meterRun.id, tag: f.meterRun.tag });
    expect(p.pending.hours[0].starts).toEqual(
      expect.arrayContaining([new Date(day + 6 * hourMs).toISOString(), new Date(day + 7 * hourMs).toISOString()]),
    );
  });

  it('refuses configuration versions, dated settings and corrections in the closed month with 409 naming it', async () => {
    const inAugust = '2026-08-20T00:00:00Z';
    const version = await engineer.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
      effectiveFrom: inAugust,
      element: { ...f.element, boreDiameterM: 0.12 },
      fluid: f.fluid,
      reason: 'Plate swap found late',
    });
    expect(version.status).toBe(409);
    expect(version.body.error).toMatchObject({ code: 'period_closed', field: 'effectiveFrom' });
    expect(version.body.error.message).toContain(month);

    const rerange = await engineer.patch(`/api/transmitters/${f.dp.id}`, {
      upperRange: 60,
      effectiveFrom: inAugust,
      reason: 'Re-ranged',
    });
    expect(rerange.status).toBe(409);
    expect(rerange.body.error).toMatchObject({ code: 'period_closed', field: 'effectiveFrom' });

    const settings = await engineer.patch(`/api/meter-runs/${f.meterRun.id}`, {
      holdLimitS: 1800,
      effectiveFrom: inAugust,
      reason: 'Shorter hold',
    });
    expect(settings.status).toBe(409);
    expect(settings.body.error.code).toBe('period_closed');

    const site = await engineer.patch(`/api/sites/${f.site.id}`, {
      basePressurePa: 101560,
      effectiveFrom: inAugust,
      reason: 'Contract base',
    });
    expect(site.status).toBe(409);
    expect(site.body.error.code).toBe('period_closed');

    const correction = await engineer.post('/api/corrections', {
      meterRunId: f.meterRun.id,
      start: new Date(day).toISOString(),
      end: new Date(day + hourMs).toISOString(),
      kind: 'adjust',
      factor: 1.01,
      reason: 'Drift',
    });
    expect(correction.status).toBe(409);
    expect(correction.body.error.code).toBe('period_closed');
    expect(correction.body.error.message).toContain(month);
  });

  it('reopens (admin, with a reason) and recomputes the month with what was pending', async () => {
    const noReason = await admin.post(`/api/periods/${month}/reopen`, { siteId: f.site.id });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.field).toBe('reason');

    const reopened = await admin.post(`/api/periods/${month}/reopen`, {
      siteId: f.site.id,
      reason: 'Late field data for 10 August',
    });
    expect(reopened.status).toBe(200);
    expect(reopened.body).toMatchObject({ status: 'open', closedAt: null, closedBy: null });
    expect(reopened.body.pending).toEqual({ hours: [], imports: [] });

    await until('the reopened month to be recomputed', async () => {
      const d = await totals('day');
      return d.massKg > closedDay.massKg * 1.1 ? d : null;
    });
    await settled(engineer, f.meterRun.id);
    const d = await totals('day');
    const m = await totals('month');
    // 00:00–08:00 in full, and the last DP sample (07:50) stays in force for the largest gap,
    // 900 s, so until 08:05: 300 s of the 08:00 hour (the reopen recomputes every hour of the month).
    const flowTimeS = 8 * 3600 + 300;
    expect(relative(d.massKg, rate * flowTimeS)).toBeLessThan(1e-9);
    expect(relative(m.massKg, rate * flowTimeS)).toBeLessThan(1e-9);
    // No longer closed. The reopen recomputed every hour of the month from the hour before the
    // first reading on, so 10 August now has all 24 records (zero flow after 08:05): complete.
    expect(d.status).toBe('complete');
    expect(m.status).not.toBe('closed');

    const again = await admin.post(`/api/periods/${month}/reopen`, { siteId: f.site.id, reason: 'again' });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'period_not_closed', field: 'month' });
  });

  it('puts the close and the reopen in the audit trail with their reasons', async () => {
    const events = (await admin.get(`/api/audit-events?kind=period&entityId=${f.site.id}:${month}`)).body as {
      action: string;
      reason: string | null;
    }[];
    const byAction = Object.fromEntries(events.map((e) => [e.action, e.reason]));
    expect(byAction).toEqual({
      'period.close': 'August volumes reviewed',
      'period.reopen': 'Late field data for 10 August',
    });
  });
});
