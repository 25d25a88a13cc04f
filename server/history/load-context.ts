import type { Pool } from 'pg';
import { toSI } from '../../shared/units';
import type { ConfigVersionInput, DirectionSource, DpSeries, Quality, Sample } from '../../shared/history/types';
import { inEffectAt } from '../../shared/history/dated';
import type { AccuracyKind } from '../../shared/uncertainty';
import type { ElementSpec } from '../../shared/flow/flow-types';

const qualityName: Quality[] = ['good', 'uncertain', 'bad', 'substituted'];

/** The meter-run settings in force from `effectiveFromMs` (a meter_run_setting_versions row). */
export interface MeterRunSettings {
  effectiveFromMs: number;
  holdLimitS: number;
  maxGapS: number;
  noFlowCutoffShare: number;
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
}

/** The site settings in force from `effectiveFromMs` (a site_setting_versions row). */
export interface SiteSettings {
  effectiveFromMs: number;
  contractHour: number;
  basePressurePa: number;
  baseTemperatureK: number;
  atmosphericPressurePa: number;
}

/** A transmitter's range and accuracy in force from `effectiveFromMs`, in its own unit. */
export interface TransmitterRange {
  effectiveFromMs: number;
  lowerRange: number;
  upperRange: number;
  accuracyPercentOfSpan: number;
  /** What kind of figure the accuracy is (migration 0023; GUM §4.3.7 converts a ± limit by √3). */
  accuracyKind: AccuracyKind;
}

/**
 * A meter run's context. The plain fields are the latest values (what the set-up shows now, and
 * what the alarm walk and range health use); the history worker computes each part of an hour
 * with the versions in force then (`settingVersions`, `siteVersions`, each transmitter's `ranges`,
 * `configVersions`), each list sorted by effective time and never empty.
 */
export interface MeterRunContext {
  meterRunId: string;
  timeZone: string;
  contractHour: number;
  base: { pressurePa: number; temperatureK: number };
  holdLimitS: number;
  maxGapS: number;
  noFlowCutoffShare: number;
  stackSwitchUpShare: number;
  stackSwitchDownShare: number;
  configVersions: ConfigVersionInput[];
  settingVersions: MeterRunSettings[];
  siteVersions: SiteSettings[];
  transmitters: {
    id: string;
    measures: TransmitterMeasure;
    unit: string;
    pressureReference: 'absolute' | 'gauge';
    lowerRange: number;
    upperRange: number;
    stackRole: 'single' | 'low' | 'high';
    accuracyPercentOfSpan: number;
    ranges: TransmitterRange[];
  }[];
  atmosphericPressurePa: number;
}

/** What a transmitter measures; 'flow-direction' (unit `sign`) says which way a bi-directional run flows (0024). */
export type TransmitterMeasure = 'differential-pressure' | 'static-pressure' | 'temperature' | 'flow-direction';

type ContextTransmitter = MeterRunContext['transmitters'][number];

interface MeterRunRow {
  id: string;
  site_id: string;
  hold_limit_s: number;
  max_gap_s: number;
  no_flow_cutoff_share: number;
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
  reverse_element: ElementSpec | null;
  direction_source: DirectionSource | null;
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
  accuracy_kind: AccuracyKind;
}

interface SettingVersionRow {
  effective_from: Date;
  hold_limit_s: number;
  max_gap_s: number;
  no_flow_cutoff_share: number;
  stack_switch_up_share: number;
  stack_switch_down_share: number;
}

interface SiteVersionRow {
  effective_from: Date;
  contract_hour: number;
  base_pressure_pa: number;
  base_temperature_k: number;
  atmospheric_pressure_pa: number;
}

interface RangeVersionRow {
  transmitter_id: string;
  effective_from: Date;
  lower_range: number;
  upper_range: number;
  accuracy_percent_of_span: number;
  accuracy_kind: AccuracyKind;
}

/** A stored reading: value in the transmitter's unit, quality as its code (0 good … 3 substituted). */
/**
 * A reading as the recompute reads it: the time as epoch milliseconds, computed in the database
 * (`floor` of the exact instant, the same millisecond pg's Date parsing gives) so a month at 1 Hz
 * is not millions of date strings parsed in JavaScript; an array row, not an object per reading.
 */
type ReadingRow = [timeMs: number, value: number, quality: number];

/**
 * Everything about a meter run that its hourly computation needs, except the readings. A meter
 * run, site or transmitter written without versions (before migration 0007, or by the demo seed's
 * SQL) gets one from its current columns, in force from the beginning.
 */
export async function loadMeterRunContext(pool: Pool, meterRunId: string): Promise<MeterRunContext | null> {
  const run = await pool.query<MeterRunRow>(
    `SELECT m.id::text, m.site_id::text, m.hold_limit_s, m.max_gap_s, m.no_flow_cutoff_share, m.stack_switch_up_share,
            m.stack_switch_down_share, s.time_zone, s.contract_hour, s.base_pressure_pa, s.base_temperature_k,
            s.atmospheric_pressure_pa
       FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = $1`,
    [meterRunId],
  );
  const r = run.rows[0];
  if (!r) return null;
  const versions = await pool.query<ConfigVersionRow>(
    `SELECT id::text, effective_from, element, fluid, reverse_element, direction_source
       FROM config_versions WHERE meter_run_id = $1 ORDER BY effective_from`,
    [meterRunId],
  );
  const transmitters = await pool.query<TransmitterRow>(
    `SELECT id::text, measures, unit, pressure_reference, lower_range, upper_range, stack_role, accuracy_percent_of_span,
            accuracy_kind
       FROM transmitters WHERE meter_run_id = $1 ORDER BY transmitters.id`,
    [meterRunId],
  );
  const settings = await pool.query<SettingVersionRow>(
    `SELECT effective_from, hold_limit_s, max_gap_s, no_flow_cutoff_share, stack_switch_up_share, stack_switch_down_share
       FROM meter_run_setting_versions WHERE meter_run_id = $1 ORDER BY effective_from, id`,
    [meterRunId],
  );
  const siteSettings = await pool.query<SiteVersionRow>(
    `SELECT effective_from, contract_hour, base_pressure_pa, base_temperature_k, atmospheric_pressure_pa
       FROM site_setting_versions WHERE site_id = $1 ORDER BY effective_from, id`,
    [r.site_id],
  );
  const ranges = await pool.query<RangeVersionRow>(
    `SELECT v.transmitter_id::text, v.effective_from, v.lower_range, v.upper_range, v.accuracy_percent_of_span,
            v.accuracy_kind
       FROM transmitter_range_versions v JOIN transmitters t ON t.id = v.transmitter_id
      WHERE t.meter_run_id = $1 ORDER BY v.effective_from, v.id`,
    [meterRunId],
  );
  const settingVersions: MeterRunSettings[] = settings.rows.map((v) => ({
    effectiveFromMs: v.effective_from.getTime(),
    holdLimitS: v.hold_limit_s,
    maxGapS: v.max_gap_s,
    noFlowCutoffShare: v.no_flow_cutoff_share,
    stackSwitchUpShare: v.stack_switch_up_share,
    stackSwitchDownShare: v.stack_switch_down_share,
  }));
  if (!settingVersions.length)
    settingVersions.push({
      effectiveFromMs: -Infinity,
      holdLimitS: r.hold_limit_s,
      maxGapS: r.max_gap_s,
      noFlowCutoffShare: r.no_flow_cutoff_share,
      stackSwitchUpShare: r.stack_switch_up_share,
      stackSwitchDownShare: r.stack_switch_down_share,
    });
  const siteVersions: SiteSettings[] = siteSettings.rows.map((v) => ({
    effectiveFromMs: v.effective_from.getTime(),
    contractHour: v.contract_hour,
    basePressurePa: v.base_pressure_pa,
    baseTemperatureK: v.base_temperature_k,
    atmosphericPressurePa: v.atmospheric_pressure_pa,
  }));
  if (!siteVersions.length)
    siteVersions.push({
      effectiveFromMs: -Infinity,
      contractHour: r.contract_hour,
      basePressurePa: r.base_pressure_pa,
      baseTemperatureK: r.base_temperature_k,
      atmosphericPressurePa: r.atmospheric_pressure_pa,
    });
  return {
    meterRunId,
    timeZone: r.time_zone,
    contractHour: r.contract_hour,
    base: { pressurePa: r.base_pressure_pa, temperatureK: r.base_temperature_k },
    holdLimitS: r.hold_limit_s,
    maxGapS: r.max_gap_s,
    noFlowCutoffShare: r.no_flow_cutoff_share,
    stackSwitchUpShare: r.stack_switch_up_share,
    stackSwitchDownShare: r.stack_switch_down_share,
    atmosphericPressurePa: r.atmospheric_pressure_pa,
    configVersions: versions.rows.map((v) => ({
      id: v.id,
      effectiveFromMs: v.effective_from.getTime(),
      element: v.element,
      fluid: v.fluid,
      // Bi-directional from this version on: the reverse constants and how the direction is known.
      ...(v.reverse_element
        ? { reverseElement: v.reverse_element, directionSource: v.direction_source ?? 'dp-sign' }
        : {}),
    })),
    settingVersions,
    siteVersions,
    transmitters: transmitters.rows.map((t) => {
      const own: TransmitterRange[] = ranges.rows
        .filter((v) => v.transmitter_id === t.id)
        .map((v) => ({
          effectiveFromMs: v.effective_from.getTime(),
          lowerRange: v.lower_range,
          upperRange: v.upper_range,
          accuracyPercentOfSpan: v.accuracy_percent_of_span,
          accuracyKind: v.accuracy_kind,
        }));
      return {
        id: t.id,
        measures: t.measures,
        unit: t.unit,
        pressureReference: t.pressure_reference,
        lowerRange: t.lower_range,
        upperRange: t.upper_range,
        stackRole: t.stack_role,
        accuracyPercentOfSpan: t.accuracy_percent_of_span,
        ranges: own.length
          ? own
          : [
              {
                effectiveFromMs: -Infinity,
                lowerRange: t.lower_range,
                upperRange: t.upper_range,
                accuracyPercentOfSpan: t.accuracy_percent_of_span,
                accuracyKind: t.accuracy_kind,
              },
            ],
      };
    }),
  };
}

export interface ReadingSeries {
  dp: DpSeries[];
  staticPressure: Sample[];
  temperature: Sample[];
  /** The direction input's samples (unit `sign`: > 0 forward, < 0 reverse, 0 no flow), unconverted. */
  direction: Sample[];
}

/**
 * The readings of a meter run in [fromMs, toMs), converted to SI (gauge pressures made
 * absolute with the site's atmospheric pressure in force at each reading's time), plus the latest reading of each transmitter
 * before fromMs, which covers the start of the window.
 */
export async function loadReadings(
  pool: Pool,
  ctx: MeterRunContext,
  fromMs: number,
  toMs: number,
): Promise<ReadingSeries> {
  const series: ReadingSeries = { dp: [], staticPressure: [], temperature: [], direction: [] };
  for (const t of ctx.transmitters) {
    const { rows } = await pool.query<ReadingRow>({
      text: `SELECT floor(extract(epoch FROM time) * 1000)::float8, value, quality FROM (
         (SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time < to_timestamp($2 / 1000.0) ORDER BY time DESC LIMIT 1)
         UNION ALL
         (SELECT time, value, quality FROM readings WHERE transmitter_id = $1 AND time >= to_timestamp($2 / 1000.0) AND time < to_timestamp($3 / 1000.0) ORDER BY time)) AS r`,
      values: [t.id, fromMs, toMs],
      rowMode: 'array',
    });
    const gauge = t.measures === 'static-pressure' && t.pressureReference === 'gauge';
    const offsetAt = (timeMs: number) => (gauge ? inEffectAt(ctx.siteVersions, timeMs).atmosphericPressurePa : 0);
    // A direction input's unit (`sign`) has no SI conversion: its value is only its sign.
    const toValue = (value: number) => (t.measures === 'flow-direction' ? value : toSI(value, t.unit));
    const samples: Sample[] = rows.map(([timeMs, value, quality]) => ({
      timeMs,
      value: toValue(value) + offsetAt(timeMs),
      quality: qualityName[quality],
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
    } else if (t.measures === 'flow-direction') {
      series.direction = mergeSorted(series.direction, samples);
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
