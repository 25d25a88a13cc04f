import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { MemberHourRecord } from '../../../shared/history/corrections';

export type CorrectionStatus = 'proposed' | 'approved' | 'rejected';
export type ReadingSubstitute = { transmitterId: string; value: number } | { transmitterId: string; hold: true };

/** How an estimate was made, kept with the correction it became. */
export interface EstimateRecord {
  massKg: number;
  uncertaintyPercent: number | null;
  method: string;
  basis: unknown;
}

/** One correction as stored, with the names of who proposed and decided it. */
export interface CorrectionRecord {
  id: string;
  meterRunId: string;
  startMs: number;
  endMs: number;
  kind: 'substitute' | 'adjust';
  massKg: number | null;
  factor: number | null;
  substitute: ReadingSubstitute | null;
  origin: 'manual' | 'estimate';
  estimate: EstimateRecord | null;
  reason: string;
  status: CorrectionStatus;
  proposedBy: { id: string; name: string; email: string };
  proposedAtMs: number;
  decidedBy: { id: string; name: string; email: string } | null;
  decidedAtMs: number | null;
  decisionReason: string | null;
}

/** The quantities of a period summed over its hourly records. */
export interface PeriodQuantities {
  massKg: number;
  volumeM3: number;
  standardVolumeM3: number;
  energyJ: number | null;
}

export type NewCorrection = Omit<
  CorrectionRecord,
  'id' | 'status' | 'proposedBy' | 'proposedAtMs' | 'decidedBy' | 'decidedAtMs' | 'decisionReason'
> & { proposedBy: string };

interface CorrectionRow {
  id: string;
  meter_run_id: string;
  start: Date;
  end: Date;
  kind: CorrectionRecord['kind'];
  mass_kg: number | null;
  factor: number | null;
  substitute: ReadingSubstitute | null;
  origin: CorrectionRecord['origin'];
  estimate: EstimateRecord | null;
  reason: string;
  status: CorrectionStatus;
  proposed_by: string;
  proposed_by_name: string;
  proposed_by_email: string;
  proposed_at: Date;
  decided_by: string | null;
  decided_by_name: string | null;
  decided_by_email: string | null;
  decided_at: Date | null;
  decision_reason: string | null;
}

interface FiguresRow {
  hours: string;
  original_mass_kg: number | null;
  original_volume_m3: number | null;
  original_standard_volume_m3: number | null;
  original_energy_j: number | null;
  current_mass_kg: number | null;
  current_volume_m3: number | null;
  current_standard_volume_m3: number | null;
  current_energy_j: number | null;
}

/** An hourly record as an estimate reads it. */
export interface EstimateSourceHour {
  startMs: number;
  massKg: number;
  coverage: number;
  flags: string[];
}

/** A balance group in which a meter run is a well: an inlet, with exactly one outlet (the sales meter). */
export interface WellGroup {
  id: string;
  name: string;
  allowancePercent: number | null;
  allowanceDailyM3: number | null;
  members: { meterRunId: string; tag: string; side: 'inlet' | 'outlet' }[];
}

const selectCorrection = `
  SELECT c.id::text, c.meter_run_id::text, c.start, c."end", c.kind, c.mass_kg, c.factor, c.substitute, c.origin,
         c.estimate, c.reason, c.status, c.proposed_by::text, p.name AS proposed_by_name, p.email AS proposed_by_email,
         c.proposed_at, c.decided_by::text, d.name AS decided_by_name, d.email AS decided_by_email, c.decided_at,
         c.decision_reason
    FROM corrections c
    JOIN users p ON p.id = c.proposed_by
    LEFT JOIN users d ON d.id = c.decided_by`;

const toRecord = (r: CorrectionRow): CorrectionRecord => ({
  id: r.id,
  meterRunId: r.meter_run_id,
  startMs: r.start.getTime(),
  endMs: r.end.getTime(),
  kind: r.kind,
  massKg: r.mass_kg,
  factor: r.factor,
  substitute: r.substitute,
  origin: r.origin,
  estimate: r.estimate,
  reason: r.reason,
  status: r.status,
  proposedBy: { id: r.proposed_by, name: r.proposed_by_name, email: r.proposed_by_email },
  proposedAtMs: r.proposed_at.getTime(),
  decidedBy:
    r.decided_by === null ? null : { id: r.decided_by, name: r.decided_by_name ?? '', email: r.decided_by_email ?? '' },
  decidedAtMs: r.decided_at === null ? null : r.decided_at.getTime(),
  decisionReason: r.decision_reason,
});

const iso = (ms: number) => new Date(ms).toISOString();

export function correctionsRepository(sequelize: Sequelize) {
  const select = async <T extends object>(
    sql: string,
    replacements: Record<string, unknown>,
    transaction?: Transaction,
  ) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });

  return {
    /** The site clock of a meter run, or null when it does not exist. */
    async meterRunClock(meterRunId: string) {
      const [row] = await select<{ time_zone: string; contract_hour: number }>(
        `SELECT s.time_zone, s.contract_hour FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.id = :meterRunId`,
        { meterRunId },
      );
      return row ? { timeZone: row.time_zone, contractHour: row.contract_hour } : null;
    },

    /** Whether a configuration version in force during [startMs, endMs) is bi-directional (has a reverse element). */
    async bidirectionalDuring(meterRunId: string, startMs: number, endMs: number): Promise<boolean> {
      const rows = await select<{ found: number }>(
        `SELECT 1 AS found FROM (
           SELECT reverse_element, effective_from,
                  lead(effective_from) OVER (ORDER BY effective_from) AS until
             FROM config_versions WHERE meter_run_id = :meterRunId) v
          WHERE v.reverse_element IS NOT NULL AND v.effective_from < :end AND (v.until IS NULL OR v.until > :start)
          LIMIT 1`,
        { meterRunId, start: iso(startMs), end: iso(endMs) },
      );
      return rows.length > 0;
    },

    /** @returns the meter run a transmitter belongs to, or null when it does not exist */
    async transmitterMeterRun(transmitterId: string): Promise<string | null> {
      const [row] = await select<{ meter_run_id: string }>(
        'SELECT meter_run_id::text FROM transmitters WHERE id = :transmitterId',
        { transmitterId },
      );
      return row?.meter_run_id ?? null;
    },

    /** Whether the transmitter has a usable reading before the instant (a held value needs one). */
    async hasUsableReadingBefore(transmitterId: string, beforeMs: number): Promise<boolean> {
      const rows = await select<{ found: number }>(
        `SELECT 1 AS found FROM readings WHERE transmitter_id = :transmitterId AND time < :before AND quality <> 2 LIMIT 1`,
        { transmitterId, before: iso(beforeMs) },
      );
      return rows.length > 0;
    },

    async insert(c: NewCorrection, transaction: Transaction): Promise<CorrectionRecord> {
      const [row] = await select<{ id: string }>(
        `INSERT INTO corrections (meter_run_id, start, "end", kind, mass_kg, factor, substitute, origin, estimate, reason,
                                  proposed_by)
         VALUES (:meterRunId, :start, :end, :kind, :massKg, :factor, :substitute::jsonb, :origin, :estimate::jsonb,
                 :reason, :proposedBy)
         RETURNING id::text`,
        {
          meterRunId: c.meterRunId,
          start: iso(c.startMs),
          end: iso(c.endMs),
          kind: c.kind,
          massKg: c.massKg,
          factor: c.factor,
          substitute: c.substitute === null ? null : JSON.stringify(c.substitute),
          origin: c.origin,
          estimate: c.estimate === null ? null : JSON.stringify(c.estimate),
          reason: c.reason,
          proposedBy: c.proposedBy,
        },
        transaction,
      );
      const [stored] = await select<CorrectionRow>(`${selectCorrection} WHERE c.id = :id`, { id: row.id }, transaction);
      return toRecord(stored);
    },

    async findById(id: string, transaction?: Transaction): Promise<CorrectionRecord | null> {
      // Inside a transaction the row is locked: two deciders of one correction wait for each other.
      const lock = transaction ? ' FOR UPDATE OF c' : '';
      const [row] = await select<CorrectionRow>(`${selectCorrection} WHERE c.id = :id${lock}`, { id }, transaction);
      return row ? toRecord(row) : null;
    },

    async decide(
      id: string,
      decision: { status: 'approved' | 'rejected'; decidedBy: string; reason: string },
      transaction: Transaction,
    ): Promise<CorrectionRecord> {
      await sequelize.query(
        `UPDATE corrections SET status = :status, decided_by = :decidedBy, decided_at = clock_timestamp(),
                decision_reason = :reason
          WHERE id = :id AND status = 'proposed'`,
        { replacements: { id, ...decision }, transaction },
      );
      const [row] = await select<CorrectionRow>(`${selectCorrection} WHERE c.id = :id`, { id }, transaction);
      return toRecord(row);
    },

    async list(filter: { meterRunId?: string; status?: CorrectionStatus; limit: number }): Promise<CorrectionRecord[]> {
      const rows = await select<CorrectionRow>(
        `${selectCorrection}
          WHERE (CAST(:meterRunId AS bigint) IS NULL OR c.meter_run_id = CAST(:meterRunId AS bigint))
            AND (CAST(:status AS text) IS NULL OR c.status = CAST(:status AS text))
          ORDER BY c.id DESC LIMIT :limit`,
        { meterRunId: filter.meterRunId ?? null, status: filter.status ?? null, limit: filter.limit },
      );
      return rows.map(toRecord);
    },

    /**
     * The period's quantities summed over its hourly records: as first recorded (each record's
     * first version) and as now in force, with the number of records found.
     */
    async periodQuantities(meterRunId: string, startMs: number, endMs: number) {
      const [r] = await select<FiguresRow>(
        `SELECT count(*)::text AS hours,
                sum(coalesce(v.mass_kg, h.mass_kg)) AS original_mass_kg,
                sum(coalesce(v.volume_m3, h.volume_m3)) AS original_volume_m3,
                sum(coalesce(v.standard_volume_m3, h.standard_volume_m3)) AS original_standard_volume_m3,
                sum(CASE WHEN v.start IS NULL THEN h.energy_j ELSE v.energy_j END) AS original_energy_j,
                sum(h.mass_kg) AS current_mass_kg, sum(h.volume_m3) AS current_volume_m3,
                sum(h.standard_volume_m3) AS current_standard_volume_m3, sum(h.energy_j) AS current_energy_j
           FROM hourly_records h
           LEFT JOIN hourly_record_versions v ON v.meter_run_id = h.meter_run_id AND v.start = h.start AND v.version = 1
          WHERE h.meter_run_id = :meterRunId AND h.start >= :start AND h.start < :end`,
        { meterRunId, start: iso(startMs), end: iso(endMs) },
      );
      const quantities = (p: 'original' | 'current'): PeriodQuantities => ({
        massKg: r[`${p}_mass_kg`] ?? 0,
        volumeM3: r[`${p}_volume_m3`] ?? 0,
        standardVolumeM3: r[`${p}_standard_volume_m3`] ?? 0,
        energyJ: r[`${p}_energy_j`],
      });
      return { hours: Number(r.hours), original: quantities('original'), current: quantities('current') };
    },

    /** The meter run's hourly records in [fromMs, toMs), oldest first. */
    async hourlyRecords(meterRunId: string, fromMs: number, toMs: number): Promise<EstimateSourceHour[]> {
      const rows = await select<{ start: Date; mass_kg: number; coverage: number; flags: string[] }>(
        `SELECT start, mass_kg, coverage, flags FROM hourly_records
          WHERE meter_run_id = :meterRunId AND start >= :from AND start < :to ORDER BY start`,
        { meterRunId, from: iso(fromMs), to: iso(toMs) },
      );
      return rows.map((r) => ({ startMs: r.start.getTime(), massKg: r.mass_kg, coverage: r.coverage, flags: r.flags }));
    },

    /**
     * The balance groups in which the meter run is an inlet and which have exactly one outlet
     * (a well behind its sales meter), with their members and allowance.
     */
    async wellGroups(meterRunId: string): Promise<WellGroup[]> {
      const groups = await select<{
        id: string;
        name: string;
        allowance_percent: number | null;
        allowance_daily_m3: number | null;
      }>(
        `SELECT g.id::text, g.name, g.allowance_percent, g.allowance_daily_m3
           FROM balance_groups g
          WHERE EXISTS (SELECT 1 FROM balance_group_members b
                         WHERE b.balance_group_id = g.id AND b.meter_run_id = :meterRunId AND b.side = 'inlet')
            AND (SELECT count(*) FROM balance_group_members b WHERE b.balance_group_id = g.id AND b.side = 'outlet') = 1
          ORDER BY g.id`,
        { meterRunId },
      );
      if (!groups.length) return [];
      const members = await select<{
        balance_group_id: string;
        meter_run_id: string;
        tag: string;
        side: 'inlet' | 'outlet';
      }>(
        `SELECT b.balance_group_id::text, b.meter_run_id::text, m.tag, b.side
           FROM balance_group_members b JOIN meter_runs m ON m.id = b.meter_run_id
          WHERE b.balance_group_id IN (:ids) ORDER BY m.tag, b.meter_run_id`,
        { ids: groups.map((g) => g.id) },
      );
      return groups.map((g) => ({
        id: g.id,
        name: g.name,
        allowancePercent: g.allowance_percent,
        allowanceDailyM3: g.allowance_daily_m3,
        members: members
          .filter((m) => m.balance_group_id === g.id)
          .map((m) => ({ meterRunId: m.meter_run_id, tag: m.tag, side: m.side })),
      }));
    },

    /** The hourly records of the meter runs whose start is in [fromMs, toMs), with the figures an estimate sums. */
    async memberRecords(meterRunIds: string[], fromMs: number, toMs: number): Promise<Map<string, MemberHourRecord[]>> {
      const out = new Map<string, MemberHourRecord[]>(meterRunIds.map((id) => [id, []]));
      if (!meterRunIds.length) return out;
      const rows = await select<{
        meter_run_id: string;
        start: Date;
        end: Date;
        mass_kg: number;
        standard_volume_m3: number;
        coverage: number;
        flags: string[];
        uncertainty_percent: number | null;
      }>(
        `SELECT meter_run_id::text, start, "end", mass_kg, standard_volume_m3, coverage, flags, uncertainty_percent
           FROM hourly_records
          WHERE meter_run_id IN (:ids) AND start >= :from AND start < :to ORDER BY hourly_records.meter_run_id, start`,
        { ids: meterRunIds, from: iso(fromMs), to: iso(toMs) },
      );
      for (const r of rows)
        out.get(r.meter_run_id)?.push({
          startMs: r.start.getTime(),
          endMs: r.end.getTime(),
          massKg: r.mass_kg,
          standardVolumeM3: r.standard_volume_m3,
          coverage: r.coverage,
          flags: r.flags,
          uncertaintyPercent: r.uncertainty_percent,
        });
      return out;
    },
  };
}

export type CorrectionsRepository = ReturnType<typeof correctionsRepository>;
