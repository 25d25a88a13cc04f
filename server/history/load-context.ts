import type { Pool } from 'pg';
import { toSI } from '../../shared/units';
import type { ConfigVersionInput, DpSeries, Quality, Sample } from '../../shared/history/types';

const qualityName: Quality[] = ['good', 'uncertain', 'bad', 'substituted'];

export interface MeterRunContext {
  meterRunId: string;
  timeZone: string;
  contractHour: number;
  base: { pressurePa: number; temperatureK: number };
  holdLimitS: number;
  maxGapS: number;
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
  configVersions: ConfigVersionInput[];
  transmitters: {
    id: string;
    measures: 'differential-pressure' | 'static-pressure' | 'temperature';
    unit: string;
    pressureReference: 'absolute' | 'gauge';
    lowerRange: number;
    upperRange: number;
    stackRole: 'single' | 'low' | 'high';
    accuracyPercentOfSpan: number;
  }[];
  atmosphericPressurePa: number;
}

type ContextTransmitter = MeterRunContext['transmitters'][number];

interface MeterRunRow {
  id: string;
  hold_limit_s: number;
  max_gap_s: number;
  stack_switch_up_share: number;
  stack_switch_down_share: number;
  time_zone: string;
  contract_hour: number;
  base_pressure_pa: number;
  base_temperature_k: number;
  atmospheric_pressure_pa: number;
}

interface ConfigVersionRow {
  id: string;
  effective_from: Date;
  element: ConfigVersionInput['element'];
  fluid: ConfigVersionInput['fluid'];
}

interface TransmitterRow {
  id: string;
  measures: ContextTransmitter['measures'];
  unit: string;
  pressure_reference: ContextTransmitter['pressureReference'];
  lower_range: number;
  upper_range: number;
  stack_role: ContextTransmitter['stackRole'];
  accuracy_percent_of_span: number;
}

/** A stored reading: value in the transmitter's unit, quality as its code (0 good … 3 substituted). */
interface ReadingRow {
  time: Date;
  value: number;
  quality: number;
}

/** Everything about a meter run that its hourly computation needs, except the readings. */
export async function loadMeterRunContext(pool: Pool, meterRunId: string): Promise<MeterRunContext | null> {
  const run = await pool.query<MeterRunRow>(
    `SELECT m.id::text, m.hold_limit_s, m.max_gap_s, m.stack_switch_up_share, m.stack_switch_down_share,
            s.time_zone, s.contract_hour, s.base_pressure_pa, s.base_temperature_k, s.atmospheric_pressure_pa
       FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = $1`,
    [meterRunId],
  );
  const r = run.rows[0];
  if (!r) return null;
  const versions = await pool.query<ConfigVersionRow>(
    'SELECT id::text, effective_from, element, fluid FROM config_versions WHERE meter_run_id = $1 ORDER BY effective_from',
    [meterRunId],
  );
  const transmitters = await pool.query<TransmitterRow>(
    `SELECT id::text, measures, unit, pressure_reference, lower_range, upper_range, stack_role, accuracy_percent_of_span
       FROM transmitters WHERE meter_run_id = $1 ORDER BY transmitters.id`,
    [meterRunId],
  );
  return {
    meterRunId,
    timeZone: r.time_zone,
    contractHour: r.contract_hour,
    base: { pressurePa: r.base_pressure_pa, temperatureK: r.base_temperature_k },
    holdLimitS: r.hold_limit_s,
    maxGapS: r.max_gap_s,
    stackSwitchUpShare: r.stack_switch_up_share,
    stackSwitchDownShare: r.stack_switch_down_share,
    atmosphericPressurePa: r.atmospheric_pressure_pa,
    configVersions: versions.rows.map((v) => ({
      id: v.id,
      effectiveFromMs: v.effective_from.getTime(),
      element: v.element,
      fluid: v.fluid,
    })),
    transmitters: transmitters.rows.map((t) => ({
      id: t.id,
      measures: t.measures,
      unit: t.unit,
      pressureReference: t.pressure_reference,
      lowerRange: t.lower_range,
      upperRange: t.upper_range,
      stackRole: t.stack_role,
      accuracyPercentOfSpan: t.accuracy_percent_of_span,
    })),
  };
}

export interface ReadingSeries {
  dp: DpSeries[];
  staticPressure: Sample[];
  temperature: Sample[];
}

/**
 * The readings of a meter run in [fromMs, toMs), converted to SI (gauge pressures made
 * absolute with the site's atmospheric pressure), plus the latest reading of each transmitter
 * before fromMs, which covers the start of the window.
 */
export async function loadReadings(
  pool: Pool,
  ctx: MeterRunContext,
  fromMs: number,
  toMs: number,
): Promise<ReadingSeries> {
  const series: ReadingSeries = { dp: [], staticPressure: [], temperature: [] };
  for (const t of ctx.transmitters) {
    const { rows } = await pool.query<ReadingRow>(
      `(SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time < to_timestamp($2 / 1000.0) ORDER BY time DESC LIMIT 1)
       UNION ALL
       (SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time >= to_timestamp($2 / 1000.0) AND time < to_timestamp($3 / 1000.0) ORDER BY time)`,
      [t.id, fromMs, toMs],
    );
    const offset = t.measures === 'static-pressure' && t.pressureReference === 'gauge' ? ctx.atmosphericPressurePa : 0;
    const samples: Sample[] = rows.map((row) => ({
      timeMs: row.time.getTime(),
      value: toSI(row.value, t.unit) + offset,
      quality: qualityName[row.quality],
    }));
    samples.sort((a, b) => a.timeMs - b.timeMs);
    if (t.measures === 'differential-pressure') {
      series.dp.push({
        transmitterId: t.id,
        stackRole: t.stackRole,
        lowerRangePa: toSI(t.lowerRange, t.unit),
        upperRangePa: toSI(t.upperRange, t.unit),
        accuracyPercentOfSpan: t.accuracyPercentOfSpan,
        samples,
      });
    } else if (t.measures === 'static-pressure') {
      series.staticPressure = mergeSorted(series.staticPressure, samples);
    } else {
      series.temperature = mergeSorted(series.temperature, samples);
    }
  }
  return series;
}

function mergeSorted(a: Sample[], b: Sample[]): Sample[] {
  if (!a.length) return b;
  return [...a, ...b].sort((x, y) => x.timeMs - y.timeMs);
}
