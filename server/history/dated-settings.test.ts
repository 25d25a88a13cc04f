import { testApp } from '../test-support/app';
import { alarmFixture, MIN, repeat } from '../alarms/alarm-test-fixture';
import { hourStartsBetween } from '../../shared/history/contract-day';

/**
 * Dated settings through the real app, worker and database (issue 9 §2, §4). A UTC site,
 * contract hour 0, six hours of one-minute readings two days ago at a constant 20 kPa on a
 * 0–50 kPa DP transmitter (40 % of span), 2 MPa, 300 K. Expected figures are the stored ones
 * before a change (a setting dated later must not touch them) or sums of parts that must equal
 * the whole (records are additive: compute-hour.property.test.ts).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: string;
let f: Awaited<ReturnType<typeof alarmFixture>>;
const dayMs = 86_400_000;
const hourMs = 3_600_000;
const DAY = Math.floor(Date.now() / dayMs) * dayMs - 2 * dayMs;
const iso = (ms: number) => new Date(ms).toISOString();
const relative = (a: number, b: number) => Math.abs(a / b - 1);

interface StoredRecord {
  start: Date;
  end: Date;
  mass_kg: number;
  flow_time_s: number;
  integral_value: number | null;
  integral_multiplier_value: number | null;
  uncertainty_percent: number | null;
  version: number;
  flags: string[];
}

const records = async (fromMs: number, toMs: number) =>
  (
    await t.services.pool.query<StoredRecord>(
      `SELECT start, "end", mass_kg, flow_time_s, integral_value, integral_multiplier_value, uncertainty_percent, version, flags
         FROM hourly_records WHERE meter_run_id = $1 AND start >= $2 AND start < $3 ORDER BY start`,
      [f.meterRunId, iso(fromMs), iso(toMs)],
    )
  ).rows;

const queued = async () =>
  (
    await t.services.pool.query<{ start: Date; cause: string; cause_reference: string | null }>(
      'SELECT start, cause, cause_reference FROM stale_hours WHERE meter_run_id = $1 ORDER BY start',
      [f.meterRunId],
    )
  ).rows;

const patch = (path: string, body: Record<string, unknown>) =>
  t.http().patch(path).set('Authorization', `Bearer ${engineer}`).send(body);

beforeAll(async () => {
  t = await testApp();
  engineer = (await t.signedIn('engineer')).token;
  f = await alarmFixture(t, engineer);
  await f.writeMinutes(DAY, repeat(6 * 60, 0.4), { dpValue: () => 20 });
  await t.services.history.settle(120_000);
}, 180_000);
afterAll(() => t.close());

describe('dated settings', () => {
  it('leaves the records of two days ago unchanged when a re-range dated now is followed by a recompute of those hours', async () => {
    const before = await records(DAY, DAY + 6 * hourMs);
    expect(before).toHaveLength(6);
    expect(before.every((r) => r.mass_kg > 0 && r.flow_time_s === 3600)).toBe(true);
    // Re-ranged to 21–50 kPa with a coarser accuracy: applied to the past, 20 kPa would read as no flow.
    const res = await patch(`/api/transmitters/${f.dp.id}`, {
      lowerRange: 21,
      accuracyPercentOfSpan: 0.2,
      reason: 'Re-ranged at the calibration visit',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ lowerRange: 21, accuracyPercentOfSpan: 0.2 });
    // The recompute it queued starts at the hour containing now, not in the past.
    const waiting = await queued();
    expect(waiting.every((q) => q.start.getTime() >= DAY + 2 * dayMs)).toBe(true);
    await t.services.history.recompute(
      f.meterRunId,
      Array.from({ length: 6 }, (_, k) => DAY + k * hourMs),
    );
    expect(await records(DAY, DAY + 6 * hourMs)).toEqual(before);
    await t.services.history.settle(120_000);
    expect(await records(DAY, DAY + 6 * hourMs)).toEqual(before);
  });

  it('refuses a setting dated before the meter run’s history or more than a day ahead, naming effectiveFrom', async () => {
    for (const effectiveFrom of ['2019-12-31T23:00:00Z', iso(Date.now() + 2 * dayMs)]) {
      const res = await patch(`/api/meter-runs/${f.meterRunId}`, { holdLimitS: 120, effectiveFrom });
      expect(res.status).toBe(400);
      expect(res.body.error).toMatchObject({ field: 'effectiveFrom' });
    }
    const nothingDated = await patch(`/api/meter-runs/${f.meterRunId}`, {
      name: 'renamed',
      effectiveFrom: iso(DAY),
    });
    expect(nothingDated.status).toBe(400);
    expect(nothingDated.body.error).toMatchObject({ field: 'effectiveFrom' });
  });

  it('queues exactly the hours from a back-dated largest-gap change on, and splits the hour it falls in into two records that add up to the whole hour', async () => {
    await t.services.history.settle(120_000);
    const before = await records(DAY, DAY + 6 * hourMs);
    const at = DAY + 3 * hourMs + 30 * MIN;
    const res = await patch(`/api/meter-runs/${f.meterRunId}`, {
      maxGapS: 600,
      effectiveFrom: iso(at),
      reason: 'Gap limit raised for the slower poll (back-dated)',
    });
    expect(res.status).toBe(200);
    expect(res.body.maxGapS).toBe(600);
    const waiting = await queued();
    const expected = hourStartsBetween(DAY + 3 * hourMs, Date.now(), 'UTC');
    expect(waiting.map((q) => q.start.getTime())).toEqual(expected);
    expect(waiting[0]).toMatchObject({ cause: 'configuration-version' });
    expect(waiting[0].cause_reference).toMatch(/^meter-run-settings:\d+$/);

    await t.services.history.settle(120_000);
    const after = await records(DAY, DAY + 6 * hourMs);
    expect(after.map((r) => r.start.getTime())).toEqual([
      DAY,
      DAY + hourMs,
      DAY + 2 * hourMs,
      DAY + 3 * hourMs,
      at,
      DAY + 4 * hourMs,
      DAY + 5 * hourMs,
    ]);
    // Hours before the change are untouched; the split hour's first record keeps its start with a shorter end.
    expect(after.slice(0, 3)).toEqual(before.slice(0, 3));
    expect(after[3].end.getTime()).toBe(at);
    expect(after[3].version).toBe(before[3].version + 1);
    expect(after[4].end.getTime()).toBe(DAY + 4 * hourMs);
    // Every sample is a minute apart, so the larger gap changes nothing: the parts add up to the hour.
    expect(relative(after[3].mass_kg + after[4].mass_kg, before[3].mass_kg)).toBeLessThan(1e-12);
    expect(after[3].flow_time_s + after[4].flow_time_s).toBe(3600);
    expect(after.some((r) => r.flags.includes('config-changed'))).toBe(false);
    // The day still rolls up to all its mass (the last sample's gap reaches into 06:00), counting the split hour once.
    const wholeDay = await records(DAY, DAY + dayMs);
    const day = await t.services.pool.query<{ mass_kg: number; hours: number; coverage: number }>(
      'SELECT mass_kg, hours, coverage FROM daily_totals WHERE meter_run_id = $1 AND contract_day = $2',
      [f.meterRunId, iso(DAY).slice(0, 10)],
    );
    expect(day.rows[0].hours).toBe(24);
    expect(
      relative(
        day.rows[0].mass_kg,
        wholeDay.reduce((sum, r) => sum + r.mass_kg, 0),
      ),
    ).toBeLessThan(1e-12);
  });

  it('stores an integral multiplier value on every record with flow such that IMV × IV × flow time is the mass within 1e-12', async () => {
    const stored = await records(DAY, DAY + 6 * hourMs);
    expect(stored.length).toBeGreaterThan(0);
    for (const r of stored) {
      expect(r.integral_multiplier_value).not.toBeNull();
      const recomputed = (r.integral_multiplier_value as number) * (r.integral_value as number) * r.flow_time_s;
      expect(relative(recomputed, r.mass_kg)).toBeLessThan(1e-12);
    }
    // The API lists it beside the integral value.
    const listed = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/hourly-records?from=${iso(DAY)}&to=${iso(DAY + 6 * hourMs)}`)
      .set('Authorization', `Bearer ${engineer}`);
    expect(listed.status).toBe(200);
    expect(listed.body[0].integralMultiplierValue).toBe(stored[0].integral_multiplier_value);
  });

  it('keeps a record that is no longer a part of its hour as a version when the hour is recomputed, leaving no orphan', async () => {
    const hour = DAY + 5 * hourMs;
    await t.services.pool.query(
      `INSERT INTO hourly_records (meter_run_id, start, "end", flow_time_s, mass_kg, volume_m3, standard_volume_m3, coverage, as_of)
       VALUES ($1, $2, $3, 60, 1, 1, 1, 1, $3)`,
      [f.meterRunId, iso(hour + 15 * MIN), iso(hour + hourMs)],
    );
    await t.services.history.recompute(f.meterRunId, [hour]);
    const left = await records(hour, hour + hourMs);
    expect(left.map((r) => r.start.getTime())).toEqual([hour]);
    const kept = await t.services.pool.query<{ mass_kg: number }>(
      'SELECT mass_kg FROM hourly_record_versions WHERE meter_run_id = $1 AND start = $2',
      [f.meterRunId, iso(hour + 15 * MIN)],
    );
    expect(kept.rows).toEqual([{ mass_kg: 1 }]);
  });

  it('starts a new contract hour at the next contract-day start, making the day that spans the change 30 hours long', async () => {
    // Contract hour 0 → 6, dated at noon two days ago: that day keeps 00:00–24:00; the next day
    // starts at 00:00 (old hour) and runs to 06:00 the day after (new hour): 30 h.
    const res = await patch(`/api/sites/${f.siteId}`, {
      contractHour: 6,
      effectiveFrom: iso(DAY + 12 * hourMs),
      reason: 'Contract hour moved to 06:00',
    });
    expect(res.status).toBe(200);
    expect(res.body.contractHour).toBe(6);
    await t.services.history.settle(120_000);
    const days = await t.services.pool.query<{ contract_day: string; start: Date; end: Date; hours: number }>(
      `SELECT to_char(contract_day, 'YYYY-MM-DD') AS contract_day, start, "end", hours FROM daily_totals
        WHERE meter_run_id = $1 ORDER BY contract_day`,
      [f.meterRunId],
    );
    const byDay = new Map(days.rows.map((d) => [d.contract_day, d]));
    expect(byDay.get(iso(DAY).slice(0, 10))).toMatchObject({
      start: new Date(DAY),
      end: new Date(DAY + dayMs),
      hours: 24,
    });
    expect(byDay.get(iso(DAY + dayMs).slice(0, 10))).toMatchObject({
      start: new Date(DAY + dayMs),
      end: new Date(DAY + 2 * dayMs + 6 * hourMs),
      hours: 30,
    });
  });

  it('lists every dated setting in the configuration history with who, why and the field-by-field difference', async () => {
    const res = await t
      .http()
      .get(`/api/meter-runs/${f.meterRunId}/setting-versions`)
      .set('Authorization', `Bearer ${engineer}`);
    expect(res.status).toBe(200);
    type Entry = { kind: string; subject: { tag: string | null }; reason: string; changes: unknown[]; first: boolean };
    const of = (kind: string, tag?: string) =>
      (res.body as Entry[]).filter((e) => e.kind === kind && (tag === undefined || e.subject.tag === tag));
    const run = of('meter-run');
    expect(run).toHaveLength(2);
    expect(run[0]).toMatchObject({ first: true, changes: [] });
    expect(run[1]).toMatchObject({
      effectiveFrom: iso(DAY + 3 * hourMs + 30 * MIN),
      reason: 'Gap limit raised for the slower poll (back-dated)',
      createdBy: { name: 'Test engineer' },
      changes: [{ path: 'maxGapS', before: 300, after: 600 }],
    });
    expect(of('transmitter', f.dp.tag)[1]).toMatchObject({
      reason: 'Re-ranged at the calibration visit',
      changes: [
        { path: 'accuracyPercentOfSpan', before: 0.075, after: 0.2 },
        { path: 'lowerRange', before: 0, after: 21 },
      ],
    });
    expect(of('site')[1]).toMatchObject({ changes: [{ path: 'contractHour', before: 0, after: 6 }] });
    // The audit trail has the old and new values and the reason.
    const audit = await t.services.pool.query<{
      before: { maxGapS: number };
      after: { maxGapS: number };
      reason: string;
    }>(
      `SELECT before, after, reason FROM audit_events WHERE action = 'meter-run.update' AND entity_id = $1 ORDER BY id`,
      [f.meterRunId],
    );
    expect(audit.rows.at(-1)).toMatchObject({
      before: { maxGapS: 300 },
      after: { maxGapS: 600 },
      reason: 'Gap limit raised for the slower poll (back-dated)',
    });
  });

  it('gives a transmitter written without versions (as the demo seed writes them) its old range from the start of history before its first re-range', async () => {
    const tag = `${f.tag}-SEEDED`;
    const inserted = await t.services.pool.query<{ id: string }>(
      `INSERT INTO transmitters (meter_run_id, tag, measures, unit, lower_range, upper_range)
       VALUES ($1, $2, 'temperature', 'K', 200, 400) RETURNING id::text`,
      [f.meterRunId, tag],
    );
    const res = await patch(`/api/transmitters/${inserted.rows[0].id}`, { upperRange: 450, reason: 'Re-ranged' });
    expect(res.status).toBe(200);
    const versions = await t.services.pool.query<{ effective_from: Date; upper_range: number }>(
      'SELECT effective_from, upper_range FROM transmitter_range_versions WHERE transmitter_id = $1 ORDER BY id',
      [inserted.rows[0].id],
    );
    expect(versions.rows).toHaveLength(2);
    expect(versions.rows[0]).toEqual({ effective_from: new Date('2000-01-01T00:00:00Z'), upper_range: 400 });
    expect(versions.rows[1].upper_range).toBe(450);
  });
});
