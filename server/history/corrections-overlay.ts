import type { Pool } from 'pg';
import type { HourlyRecord, Sample } from '../../shared/history/types';
import {
  correctRecord,
  substituteSamples,
  type CorrectionToApply,
  type QuantityRatios,
} from '../../shared/history/corrections';
import { toSI } from '../../shared/units';
import type { ReadingSeries } from './load-context';

/** A reading substitution, its value already in SI (gauge pressure made absolute) or held from before. */
export interface ReadingSubstitution {
  correctionId: string;
  startMs: number;
  endMs: number;
  transmitterId: string;
  measures: 'differential-pressure' | 'static-pressure' | 'temperature';
  value: number | 'hold';
}

/**
 * The approved corrections of one meter run that touch a span of time, as the history worker
 * applies them (issue 9, four-eyes corrections). The worker loads them once per round, lays
 * substituted readings over the stored ones before computing, and applies quantity
 * substitutions and adjustment factors to each record it computed.
 */
export interface CorrectionsInForce {
  /** Approved corrections overlapping the span, oldest approval first. */
  corrections: (CorrectionToApply & { id: string })[];
  /** The reading substitutions among them, in the same order. */
  readings: ReadingSubstitution[];
  /** How long a DP sample and a P or T sample may cover (the meter run's maxGapS and hold limit), ms. */
  dpCoverMs: number;
  holdCoverMs: number;
}

interface CorrectionRow {
  id: string;
  start: Date;
  end: Date;
  kind: 'substitute' | 'adjust';
  mass_kg: number | null;
  factor: number | null;
  substitute: { transmitterId: string; value?: number; hold?: boolean } | null;
  origin: 'manual' | 'estimate';
  estimate: { uncertaintyPercent?: number | null } | null;
  measures: ReadingSubstitution['measures'] | null;
  unit: string | null;
  pressure_reference: 'absolute' | 'gauge' | null;
  atmospheric_pressure_pa: number;
}

interface RatiosRow {
  mass_kg: number | null;
  volume_m3: number | null;
  standard_volume_m3: number | null;
  energy_j: number | null;
  energy_mass_kg: number | null;
}

/** Records with flow looked at for the ratios of a gap: the last day's worth before the correction. */
const RATIO_RECORDS = 24;

/**
 * The ratios (m³/kg, m³ at base/kg, J/kg) of the last records with flow before `beforeMs`, which
 * carry a substituted mass into volume and energy where the record itself has no flow.
 */
async function ratiosBefore(pool: Pool, meterRunId: string, beforeMs: number): Promise<QuantityRatios | null> {
  const { rows } = await pool.query<RatiosRow>(
    `SELECT sum(mass_kg) AS mass_kg, sum(volume_m3) AS volume_m3, sum(standard_volume_m3) AS standard_volume_m3,
            sum(energy_j) AS energy_j, sum(mass_kg) FILTER (WHERE energy_j IS NOT NULL) AS energy_mass_kg
       FROM (SELECT mass_kg, volume_m3, standard_volume_m3, energy_j FROM hourly_records
              WHERE meter_run_id = $1 AND start < to_timestamp($2 / 1000.0) AND mass_kg > 0
                AND NOT ('corrected' = ANY (flags))
              ORDER BY start DESC LIMIT ${RATIO_RECORDS}) AS last_with_flow`,
    [meterRunId, beforeMs],
  );
  const r = rows[0];
  if (!r || !(r.mass_kg && r.mass_kg > 0)) return null;
  return {
    volumeM3PerKg: (r.volume_m3 ?? 0) / r.mass_kg,
    standardVolumeM3PerKg: (r.standard_volume_m3 ?? 0) / r.mass_kg,
    energyJPerKg: r.energy_j !== null && r.energy_mass_kg ? r.energy_j / r.energy_mass_kg : null,
  };
}

/** @returns the approved corrections of the meter run overlapping [fromMs, toMs) */
export async function loadCorrectionsInForce(
  pool: Pool,
  meterRunId: string,
  fromMs: number,
  toMs: number,
): Promise<CorrectionsInForce> {
  // The shortest gap and hold limit any dated version allows (migration 0007), so that the
  // substituted samples are close enough together whichever version is in force.
  const run = await pool.query<{ max_gap_s: number | null; hold_limit_s: number | null }>(
    `SELECT least(min(v.max_gap_s), m.max_gap_s) AS max_gap_s, least(min(v.hold_limit_s), m.hold_limit_s) AS hold_limit_s
       FROM meter_runs m LEFT JOIN meter_run_setting_versions v ON v.meter_run_id = m.id
      WHERE m.id = $1 GROUP BY m.id`,
    [meterRunId],
  );
  const dpCoverMs = (run.rows[0]?.max_gap_s ?? 60) * 1000;
  const holdCoverMs = (run.rows[0]?.hold_limit_s ?? 60) * 1000;
  const { rows } = await pool.query<CorrectionRow>(
    `SELECT c.id::text, c.start, c."end", c.kind, c.mass_kg, c.factor, c.substitute, c.origin, c.estimate,
            t.measures, t.unit, t.pressure_reference,
            -- the site's atmospheric pressure in force at the correction's start (dated, migration 0007)
            coalesce((SELECT v.atmospheric_pressure_pa FROM site_setting_versions v
                       WHERE v.site_id = s.id AND v.effective_from <= c.start
                       ORDER BY v.effective_from DESC, v.id DESC LIMIT 1), s.atmospheric_pressure_pa) AS atmospheric_pressure_pa
       FROM corrections c
       JOIN meter_runs m ON m.id = c.meter_run_id
       JOIN sites s ON s.id = m.site_id
       LEFT JOIN transmitters t ON t.id = (c.substitute->>'transmitterId')::bigint
      WHERE c.meter_run_id = $1 AND c.status = 'approved'
        AND c.start < to_timestamp($3 / 1000.0) AND c."end" > to_timestamp($2 / 1000.0)
      ORDER BY c.decided_at, c.id`,
    [meterRunId, fromMs, toMs],
  );
  const corrections: CorrectionsInForce['corrections'] = [];
  const readings: ReadingSubstitution[] = [];
  for (const r of rows) {
    const startMs = r.start.getTime();
    const endMs = r.end.getTime();
    corrections.push({
      id: r.id,
      startMs,
      endMs,
      kind: r.kind,
      massKg: r.mass_kg,
      factor: r.factor,
      readings: r.substitute !== null,
      origin: r.origin,
      estimateUncertaintyPercent: r.estimate?.uncertaintyPercent ?? null,
      fallbackRatios: r.mass_kg !== null ? await ratiosBefore(pool, meterRunId, startMs) : null,
    });
    if (r.substitute && r.measures && r.unit) {
      const offset =
        r.measures === 'static-pressure' && r.pressure_reference === 'gauge' ? r.atmospheric_pressure_pa : 0;
      readings.push({
        correctionId: r.id,
        startMs,
        endMs,
        transmitterId: r.substitute.transmitterId,
        measures: r.measures,
        value:
          r.substitute.hold || r.substitute.value === undefined ? 'hold' : toSI(r.substitute.value, r.unit) + offset,
      });
    }
  }
  return { corrections, readings, dpCoverMs, holdCoverMs };
}

/**
 * Replaces stored readings with substituted ones (quality 'substituted') where a correction says
 * so. A DP substitution replaces that transmitter's series; static pressure and temperature are
 * one merged series per meter run, so a substitution of either replaces that whole series inside
 * the period.
 */
export function overlayReadings(series: ReadingSeries, inForce: CorrectionsInForce): ReadingSeries {
  if (!inForce.readings.length) return series;
  let { dp, staticPressure, temperature } = series;
  for (const s of inForce.readings) {
    const lay = (samples: Sample[], coverMs: number, markGapAfter: boolean) =>
      substituteSamples(samples, s.startMs, s.endMs, s.value, { coverMs, markGapAfter });
    if (s.measures === 'differential-pressure') {
      dp = dp.map((d) =>
        d.transmitterId === s.transmitterId ? { ...d, samples: lay(d.samples, inForce.dpCoverMs, true) } : d,
      );
    } else if (s.measures === 'static-pressure') staticPressure = lay(staticPressure, inForce.holdCoverMs, false);
    else if (s.measures === 'temperature') temperature = lay(temperature, inForce.holdCoverMs, false);
  }
  return { ...series, dp, staticPressure, temperature };
}

/**
 * Applies quantity substitutions and adjustment factors to one computed record (startMs/endMs
 * may be part of an hour), flagging it 'corrected' (or 'estimated'); returns it unchanged when
 * nothing applies.
 */
export function applyCorrections(record: HourlyRecord, inForce: CorrectionsInForce): HourlyRecord {
  return correctRecord(record, inForce.corrections);
}
