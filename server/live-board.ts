import type { Pool } from 'pg';
import { toSI } from '../shared/units';
import { solveFlowCase } from '../shared/flow/solve-flow-case';
import { chooseStackedTransmitter, type StackedRole } from '../shared/flow/stacked-pair';
import { contractDayBounds, contractDayOf } from '../shared/history/contract-day';
import type { ElementSpec } from '../shared/flow/flow-types';
import type { FluidSpec } from '../shared/fluids';

export interface BoardTransmitter {
  id: string;
  tag: string;
  measures: string;
  unit: string;
  stackRole: string;
  value: number | null;
  time: string | null;
  ageS: number | null;
  shareOfSpan: number | null;
}

export interface BoardRow {
  meterRunId: string;
  tag: string;
  name: string;
  siteCode: string;
  timeZone: string;
  massFlowKgPerS: number | null;
  standardVolumeFlowM3PerS: number | null;
  todayMassKg: number;
  todayStandardVolumeM3: number;
  todayEnergyJ: number | null;
  todayStart: string;
  activeTransmitterId: string | null;
  activeStackRole: StackedRole | 'single' | null;
  dpShareOfSpan: number | null;
  freshnessS: number | null;
  transmitters: BoardTransmitter[];
  warnings: string[];
  /**
   * Which way the meter run flows now (issue 13 §11), beside the rates, which stay positive: by the
   * sign of the active DP, or by the direction input on a bi-directional run that has one; null
   * without a fresh reading or without flow. A one-way run seeing reverse DP shows 'reverse' with zero rates.
   */
  direction: 'forward' | 'reverse' | null;
}

interface MeterRunRow {
  id: string;
  tag: string;
  name: string;
  hold_limit_s: number;
  stack_switch_up_share: number;
  stack_switch_down_share: number;
  site_code: string;
  time_zone: string;
  contract_hour: number;
  base_pressure_pa: number;
  base_temperature_k: number;
  atmospheric_pressure_pa: number;
  /** The configuration in effect now, or null before the first one takes effect. */
  config: {
    element: ElementSpec;
    fluid: FluidSpec;
    /** Present on a bi-directional configuration (migration 0024). */
    reverse_element: ElementSpec | null;
    direction_source: 'dp-sign' | 'direction-input' | null;
  } | null;
}

/** A transmitter and its latest reading (time, value and quality are null before its first reading). */
interface LatestReadingRow {
  id: string;
  meter_run_id: string;
  tag: string;
  measures: string;
  unit: string;
  pressure_reference: 'absolute' | 'gauge';
  lower_range: number;
  upper_range: number;
  stack_role: string;
  time: Date | null;
  value: number | null;
  quality: number | null;
}

/** Sums of the contract day's hourly records so far (energy is null when no record has any). */
interface TodayRow {
  m: number;
  v: number;
  e: number | null;
}

/**
 * The operator's live board: every meter run's live rate (from the latest readings through
 * the flow engine), today's running total (contract day so far), DP as a share of the active
 * transmitter's span and the freshness of the data.
 */
export class LiveBoard {
  /** Stacked-pair choice per meter run, kept between snapshots for the hysteresis. */
  private choices = new Map<string, StackedRole | null>();

  constructor(private readonly pool: Pool) {}

  async snapshot(nowMs = Date.now()): Promise<BoardRow[]> {
    const { rows: runs } = await this.pool.query<MeterRunRow>(
      `SELECT m.id::text, m.tag, m.name, m.hold_limit_s, m.stack_switch_up_share, m.stack_switch_down_share,
              s.code AS site_code, s.time_zone, s.contract_hour, s.base_pressure_pa, s.base_temperature_k, s.atmospheric_pressure_pa,
              (SELECT row_to_json(c) FROM (SELECT element, fluid, reverse_element, direction_source FROM config_versions cv WHERE cv.meter_run_id = m.id AND cv.effective_from <= now()
                 ORDER BY effective_from DESC LIMIT 1) c) AS config
         FROM meter_runs m JOIN sites s ON s.id = m.site_id ORDER BY s.code, m.tag`,
    );
    const { rows: latest } = await this.pool.query<LatestReadingRow>(
      `SELECT t.id::text, t.meter_run_id::text, t.tag, t.measures, t.unit, t.pressure_reference, t.lower_range, t.upper_range, t.stack_role,
              r.time, r.value, r.quality
         FROM transmitters t
         LEFT JOIN LATERAL (SELECT time, value, quality FROM readings WHERE transmitter_id = t.id ORDER BY time DESC LIMIT 1) r ON true
        ORDER BY t.id`,
    );
    const board: BoardRow[] = [];
    for (const run of runs) {
      const ts = latest.filter((t) => t.meter_run_id === run.id);
      const day = contractDayOf(nowMs, run.time_zone, run.contract_hour);
      const bounds = contractDayBounds(day, run.time_zone, run.contract_hour);
      const today = (
        await this.pool.query<TodayRow>(
          `SELECT coalesce(sum(mass_kg), 0) AS m, coalesce(sum(standard_volume_m3), 0) AS v, sum(energy_j) AS e
           FROM hourly_records WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0)`,
          [run.id, bounds.startMs, bounds.endMs],
        )
      ).rows[0];
      const fresh = (t: (typeof ts)[number]) =>
        t.time && nowMs - t.time.getTime() <= run.hold_limit_s * 1000 && t.quality !== 2;
      // Only fresh transmitters are converted, and a fresh one has a reading.
      const si = (t: (typeof ts)[number]) =>
        toSI(t.value ?? 0, t.unit) +
        (t.measures === 'static-pressure' && t.pressure_reference === 'gauge' ? run.atmospheric_pressure_pa : 0);
      const dps = ts.filter((t) => t.measures === 'differential-pressure');
      const p = ts.find((t) => t.measures === 'static-pressure' && fresh(t));
      const temp = ts.find((t) => t.measures === 'temperature' && fresh(t));
      const warnings: string[] = [];
      let active: (typeof ts)[number] | undefined;
      let activeRole: StackedRole | 'single' | null = null;
      const low = dps.find((t) => t.stack_role === 'low');
      const high = dps.find((t) => t.stack_role === 'high');
      if (low && high) {
        const reading = (t: typeof low) => (fresh(t) ? { valuePa: si(t), quality: 'good' as const } : null);
        const choice = chooseStackedTransmitter(reading(low), reading(high), this.choices.get(run.id) ?? null, {
          lowLowerRangePa: toSI(low.lower_range, low.unit),
          lowUpperRangePa: toSI(low.upper_range, low.unit),
          highUpperRangePa: toSI(high.upper_range, high.unit),
          switchUpShare: run.stack_switch_up_share,
          switchDownShare: run.stack_switch_down_share,
        });
        this.choices.set(run.id, choice.use);
        active = choice.use === 'low' ? low : choice.use === 'high' ? high : undefined;
        activeRole = choice.use;
      } else if (dps[0] && fresh(dps[0])) {
        active = dps[0];
        activeRole = 'single';
      }
      let massFlow: number | null = null;
      let standardFlow: number | null = null;
      // A direction input reads a sign, no SI unit: > 0 forward, < 0 reverse, 0 no flow.
      const directionInput = ts.find((t) => t.measures === 'flow-direction' && fresh(t));
      const byInput = run.config?.reverse_element && run.config.direction_source === 'direction-input';
      const signedDpPa = active && fresh(active) ? si(active) : null;
      const sign = byInput ? (directionInput?.value ?? null) : signedDpPa;
      const direction = sign === null || sign === 0 || signedDpPa === 0 ? null : sign > 0 ? 'forward' : 'reverse';
      if (active && p && temp && run.config) {
        // Reverse flow is flow only on a bi-directional run, with its reverse constants and |Δp|.
        const element = direction === 'reverse' ? run.config.reverse_element : run.config.element;
        const dpPa = element && direction !== null ? Math.abs(si(active)) : 0;
        if (element && dpPa > 0) {
          try {
            const result = solveFlowCase({
              element,
              fluid: run.config.fluid,
              conditions: { differentialPressurePa: dpPa, staticPressurePa: si(p), temperatureK: si(temp) },
              base: { pressurePa: run.base_pressure_pa, temperatureK: run.base_temperature_k },
            });
            massFlow = result.massFlowKgPerS;
            standardFlow = result.standardVolumeFlowM3PerS;
          } catch (err) {
            warnings.push(err instanceof Error ? err.message : String(err));
          }
        } else {
          massFlow = 0;
          standardFlow = 0;
        }
      } else {
        if (!p) warnings.push('no fresh static pressure');
        if (!temp) warnings.push('no fresh temperature');
        if (!active) warnings.push('no fresh differential pressure');
      }
      const share = (t: (typeof ts)[number]) =>
        t.value !== null ? (t.value - t.lower_range) / (t.upper_range - t.lower_range) : null;
      const newest = Math.max(...ts.map((t) => (t.time ? t.time.getTime() : 0)));
      board.push({
        meterRunId: run.id,
        tag: run.tag,
        name: run.name,
        siteCode: run.site_code,
        timeZone: run.time_zone,
        massFlowKgPerS: massFlow,
        standardVolumeFlowM3PerS: standardFlow,
        todayMassKg: today.m,
        todayStandardVolumeM3: today.v,
        todayEnergyJ: today.e,
        todayStart: new Date(bounds.startMs).toISOString(),
        activeTransmitterId: active ? active.id : null,
        activeStackRole: activeRole,
        dpShareOfSpan: active ? share(active) : null,
        freshnessS: newest > 0 ? (nowMs - newest) / 1000 : null,
        transmitters: ts.map((t) => ({
          id: t.id,
          tag: t.tag,
          measures: t.measures,
          unit: t.unit,
          stackRole: t.stack_role,
          value: t.value ?? null,
          time: t.time ? t.time.toISOString() : null,
          ageS: t.time ? (nowMs - t.time.getTime()) / 1000 : null,
          shareOfSpan: share(t),
        })),
        warnings,
        direction,
      });
    }
    return board;
  }
}
