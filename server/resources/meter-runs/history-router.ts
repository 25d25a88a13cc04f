import { Router } from 'express';
import type { Pool } from 'pg';
import { z } from 'zod';
import { DateTime } from 'luxon';
import { requireCapability } from '../../auth/passport';
import { badRequest, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { contractDayBounds, contractDayOf, contractMonthBounds } from '../../../shared/history/contract-day';

const isoTime = z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' });
const dayMs = 86_400_000;

type TotalRow = Record<string, unknown>;
const presentTotal = (r: TotalRow) => ({
  start: (r.start as Date).toISOString(),
  end: (r.end as Date).toISOString(),
  hours: Number(r.hours ?? 1),
  flowTimeS: r.flow_time_s as number,
  massKg: r.mass_kg as number,
  volumeM3: r.volume_m3 as number,
  standardVolumeM3: r.standard_volume_m3 as number,
  energyJ: (r.energy_j as number | null) ?? null,
  coverage: r.coverage as number,
  flags: r.flags as string[],
  uncertaintyPercent: (r.uncertainty_percent as number | null) ?? null,
  status: (r.status as string | undefined) ?? ((r.end as Date).getTime() <= Date.now() ? 'complete' : 'provisional'),
});

const emptyTotal = (startMs: number, endMs: number, hours: number) => ({
  start: new Date(startMs).toISOString(),
  end: new Date(endMs).toISOString(),
  hours,
  flowTimeS: 0,
  massKg: 0,
  volumeM3: 0,
  standardVolumeM3: 0,
  energyJ: null,
  coverage: 0,
  flags: ['missing-data'],
  uncertaintyPercent: null,
  status: endMs <= Date.now() ? 'complete' : 'provisional',
});

/** Totals, downsampled trends and hourly records of a meter run. */
export function meterRunHistoryRouter(pool: Pool) {
  const router = Router();

  async function site(meterRunId: string) {
    const { rows } = await pool.query(
      'SELECT s.time_zone, s.contract_hour FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = $1',
      [meterRunId],
    );
    if (!rows[0]) throw notFound('Meter run');
    return { timeZone: rows[0].time_zone as string, contractHour: rows[0].contract_hour as number };
  }

  router.get('/:id/totals', requireCapability('view'), async (req, res) => {
    if (!/^\d+$/.test(String(req.params.id))) throw notFound('Meter run');
    // from/to: an instant (ISO 8601 with an offset), or a plain date meaning that date's start in the site's zone.
    const when = z.union([isoTime, z.iso.date()], {
      error: 'must be ISO 8601 with an offset or Z, or a date YYYY-MM-DD',
    });
    const q = validate(
      z.object({
        interval: z.enum(['hour', 'day', 'month'], { error: 'must be hour, day or month' }),
        from: when,
        to: when,
      }),
      req.query,
      'query',
    );
    const { timeZone, contractHour } = await site(String(req.params.id));
    const instant = (value: string) =>
      value.length === 10 ? DateTime.fromISO(value, { zone: timeZone }).toMillis() : Date.parse(value);
    const fromMs = instant(q.from);
    const toMs = instant(q.to);
    if (toMs <= fromMs) throw badRequest('to: must be after from', 'to');
    const limits = { hour: 62 * dayMs, day: 3700 * dayMs, month: 3700 * dayMs };
    if (toMs - fromMs > limits[q.interval])
      throw badRequest(`to: at most ${limits[q.interval] / dayMs} days of ${q.interval}ly totals per request`, 'to');
    const table = { hour: 'hourly_records', day: 'daily_totals', month: 'monthly_totals' }[q.interval];
    const { rows } = await pool.query(
      `SELECT * FROM ${table} WHERE meter_run_id = $1 AND start < to_timestamp($3 / 1000.0) AND "end" > to_timestamp($2 / 1000.0) ORDER BY start`,
      [String(req.params.id), fromMs, toMs],
    );
    const found = rows.map(presentTotal);
    if (q.interval === 'hour') return res.json(found);
    // Every contract day (month) in the window appears, with zero and coverage 0 where nothing
    // was recorded. Stored rows carry their own bounds, so the calendar (luxon) is consulted only
    // for the periods that have no row: a year of daily totals stays a few milliseconds.
    const bounds = (startMs: number) => {
      const name = contractDayOf(startMs, timeZone, contractHour);
      return q.interval === 'day'
        ? contractDayBounds(name, timeZone, contractHour)
        : contractMonthBounds(name.slice(0, 7), timeZone, contractHour);
    };
    const out: ReturnType<typeof presentTotal>[] = [];
    let cursor = bounds(fromMs).startMs;
    const fillUntil = (limitMs: number) => {
      for (let guard = 0; cursor < limitMs && guard < 4000; guard++) {
        const b = bounds(cursor);
        out.push(emptyTotal(b.startMs, b.endMs, b.hours) as ReturnType<typeof presentTotal>);
        cursor = b.endMs;
      }
    };
    for (const row of found) {
      const rowStart = Date.parse(row.start);
      fillUntil(rowStart);
      out.push(row);
      cursor = Date.parse(row.end);
    }
    fillUntil(toMs);
    res.json(out);
  });

  /** How many hours of the meter run wait for recomputation (late data, a back-dated change). */
  router.get('/:id/recompute-status', requireCapability('view'), async (req, res) => {
    if (!/^\d+$/.test(String(req.params.id))) throw notFound('Meter run');
    await site(String(req.params.id));
    const { rows } = await pool.query(
      'SELECT count(*)::int AS n, min(start) AS oldest FROM stale_hours WHERE meter_run_id = $1',
      [String(req.params.id)],
    );
    res.json({
      pendingHours: rows[0].n,
      oldestPendingHour: rows[0].oldest ? (rows[0].oldest as Date).toISOString() : null,
    });
  });

  router.get('/:id/hourly-records', requireCapability('view'), async (req, res) => {
    if (!/^\d+$/.test(String(req.params.id))) throw notFound('Meter run');
    const q = validate(z.object({ from: isoTime, to: isoTime }), req.query, 'query');
    await site(String(req.params.id));
    const { rows } = await pool.query(
      `SELECT * FROM hourly_records WHERE meter_run_id = $1 AND start >= $2 AND start < $3 ORDER BY start LIMIT 2000`,
      [String(req.params.id), q.from, q.to],
    );
    res.json(
      rows.map((r) => ({
        ...presentTotal(r),
        averageDpPa: r.average_dp_pa,
        averagePressurePa: r.average_pressure_pa,
        averageTemperatureK: r.average_temperature_k,
        integralValue: r.integral_value,
        configVersionId: r.config_version_id ? String(r.config_version_id) : null,
        dpBands: r.dp_bands,
        activeTransmitterTimeS: r.active_transmitter_time,
        computedAt: (r.computed_at as Date).toISOString(),
      })),
    );
  });

  /**
   * Downsampled trends: per transmitter, min / max / mean of each of `buckets` equal time slices,
   * computed in the database so a month at 1 Hz stays a few hundred points; flow per hour from
   * the hourly records.
   */
  router.get('/:id/trend', requireCapability('view'), async (req, res) => {
    if (!/^\d+$/.test(String(req.params.id))) throw notFound('Meter run');
    const q = validate(
      z.object({ from: isoTime, to: isoTime, buckets: z.coerce.number().int().min(10).max(5000).default(600) }),
      req.query,
      'query',
    );
    const fromMs = Date.parse(q.from);
    const toMs = Date.parse(q.to);
    if (toMs <= fromMs) throw badRequest('to: must be after from', 'to');
    await site(String(req.params.id));
    const transmitters = (
      await pool.query(
        'SELECT id::text, tag, measures, unit, lower_range, upper_range, stack_role FROM transmitters WHERE meter_run_id = $1 ORDER BY id',
        [String(req.params.id)],
      )
    ).rows;
    const series = [];
    for (const t of transmitters) {
      const { rows } = await pool.query(
        `SELECT width_bucket(extract(epoch FROM time) * 1000, $2::float8, $3::float8, $4::int) AS b,
                min(value) AS min, max(value) AS max, avg(value) AS mean, count(*)::int AS n
           FROM readings WHERE transmitter_id = $1 AND time >= to_timestamp($2 / 1000.0) AND time < to_timestamp($3 / 1000.0)
          GROUP BY b ORDER BY b`,
        [t.id, fromMs, toMs, q.buckets],
      );
      const width = (toMs - fromMs) / q.buckets;
      series.push({
        transmitterId: t.id,
        tag: t.tag,
        measures: t.measures,
        unit: t.unit,
        stackRole: t.stack_role,
        lowerRange: t.lower_range,
        upperRange: t.upper_range,
        points: rows.map((r) => ({
          time: new Date(fromMs + (r.b - 1) * width).toISOString(),
          min: r.min,
          max: r.max,
          mean: r.mean,
          count: r.n,
        })),
      });
    }
    const flow = (
      await pool.query(
        `SELECT start, "end", mass_kg, standard_volume_m3, coverage FROM hourly_records WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0) ORDER BY start`,
        [String(req.params.id), fromMs, toMs],
      )
    ).rows.map((r) => {
      const seconds = ((r.end as Date).getTime() - (r.start as Date).getTime()) / 1000;
      return {
        time: (r.start as Date).toISOString(),
        massFlowKgPerS: r.mass_kg / seconds,
        standardVolumeFlowM3PerS: r.standard_volume_m3 / seconds,
        coverage: r.coverage,
      };
    });
    res.json({ from: q.from, to: q.to, buckets: q.buckets, series, flow });
  });

  return router;
}
