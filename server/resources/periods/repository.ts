import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

/** A site with what its contract calendar needs. */
export interface SiteCalendarRecord {
  id: string;
  code: string;
  timeZone: string;
  contractHour: number;
  /** Dated contract hours, oldest first. */
  contractHours: { effectiveFromMs: number; contractHour: number }[];
}

/** One close or reopen of a site's contract month. */
export interface PeriodActionRecord {
  id: string;
  siteId: string;
  month: string;
  action: 'close' | 'reopen';
  startMs: number;
  endMs: number;
  reason: string | null;
  actedAt: Date;
  actedBy: { id: string; email: string | null };
}

export interface MeterRunRef {
  id: string;
  tag: string;
  timeZone: string;
}

/** Per meter run: what its records of the month cover, and how many of them are provisional. */
export interface HourCoverageRecord {
  meterRunId: string;
  coveredS: number;
  provisionalRecords: number;
  queuedHours: number;
}

export interface ProposedCorrectionRecord {
  id: string;
  meterRunId: string;
  startMs: number;
  endMs: number;
}

export interface OpenAlarmRecord {
  id: string;
  meterRunId: string;
  condition: string;
  state: string;
  message: string;
}

export interface HeldHourRecord {
  meterRunId: string;
  startMs: number;
  cause: string;
  causeReference: string | null;
}

export interface PendingImportRecord {
  id: string;
  kind: string;
  filename: string;
  createdAt: Date;
}

type Bounds = { startMs: number; endMs: number };

interface ActionRow {
  id: string;
  site_id: string;
  month: string;
  action: 'close' | 'reopen';
  start_at: Date;
  end_at: Date;
  reason: string | null;
  acted_at: Date;
  acted_by: string;
  email: string | null;
}

const toAction = (r: ActionRow): PeriodActionRecord => ({
  id: r.id,
  siteId: r.site_id,
  month: r.month,
  action: r.action,
  startMs: r.start_at.getTime(),
  endMs: r.end_at.getTime(),
  reason: r.reason,
  actedAt: r.acted_at,
  actedBy: { id: r.acted_by, email: r.email },
});

/** $n as an instant from epoch ms. */
const at = (n: number) => `to_timestamp($${n}::float8 / 1000.0)`;

/** All SQL of period close and reopen (tables of migration 0011, read beside the history tables). */
export function periodsRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, bind: unknown[], transaction?: Transaction) =>
    sequelize.query<T>(sql, { bind, type: QueryTypes.SELECT, transaction });

  return {
    async site(siteId: string, transaction?: Transaction): Promise<SiteCalendarRecord | null> {
      const [site] = await select<{ id: string; code: string; time_zone: string; contract_hour: number }>(
        'SELECT id::text, code, time_zone, contract_hour FROM sites WHERE id = $1',
        [siteId],
        transaction,
      );
      if (!site) return null;
      const versions = await select<{ effective_from: Date; contract_hour: number }>(
        'SELECT effective_from, contract_hour FROM site_setting_versions WHERE site_id = $1 ORDER BY effective_from, id',
        [siteId],
        transaction,
      );
      return {
        id: site.id,
        code: site.code,
        timeZone: site.time_zone,
        contractHour: site.contract_hour,
        contractHours: versions.map((v) => ({
          effectiveFromMs: v.effective_from.getTime(),
          contractHour: v.contract_hour,
        })),
      };
    },

    /** Serialises closes and reopens of one site's month (the history table is append-only: no row lock). */
    async lockMonth(siteId: string, month: string, transaction: Transaction): Promise<void> {
      await sequelize.query('SELECT pg_advisory_xact_lock(hashtext($1))', {
        bind: [`period:${siteId}:${month}`],
        transaction,
      });
    },

    async latestAction(siteId: string, month: string, transaction?: Transaction): Promise<PeriodActionRecord | null> {
      const [row] = await select<ActionRow>(
        `SELECT p.id::text, p.site_id::text, p.month, p.action, p.start_at, p.end_at, p.reason, p.acted_at,
                p.acted_by::text, u.email
           FROM period_closes p LEFT JOIN users u ON u.id = p.acted_by
          WHERE p.site_id = $1 AND p.month = $2 ORDER BY p.id DESC LIMIT 1`,
        [siteId, month],
        transaction,
      );
      return row ? toAction(row) : null;
    },

    async insertAction(
      action: {
        siteId: string;
        month: string;
        action: 'close' | 'reopen';
        startMs: number;
        endMs: number;
        incomplete: unknown;
        reason: string | null;
        actedBy: string;
      },
      transaction: Transaction,
    ): Promise<string> {
      const [row] = await select<{ id: string }>(
        `INSERT INTO period_closes (site_id, month, action, start_at, end_at, incomplete, reason, acted_by)
         VALUES ($1, $2, $3, ${at(4)}, ${at(5)}, $6::jsonb, $7, $8) RETURNING id::text`,
        [
          action.siteId,
          action.month,
          action.action,
          action.startMs,
          action.endMs,
          action.incomplete === null ? null : JSON.stringify(action.incomplete),
          action.reason,
          action.actedBy,
        ],
        transaction,
      );
      return row.id;
    },

    async meterRuns(siteId: string, transaction?: Transaction): Promise<MeterRunRef[]> {
      return select<MeterRunRef>(
        `SELECT m.id::text AS "id", m.tag AS "tag", s.time_zone AS "timeZone"
           FROM meter_runs m JOIN sites s ON s.id = m.site_id WHERE m.site_id = $1 ORDER BY m.tag`,
        [siteId],
        transaction,
      );
    },

    /** Seconds covered by the records of [start, end) of each meter run of the site, provisional records, queued hours. */
    async hourCoverage(siteId: string, bounds: Bounds): Promise<HourCoverageRecord[]> {
      const rows = await select<{ meter_run_id: string; covered_s: number; provisional: number; queued: number }>(
        `SELECT m.id::text AS meter_run_id,
                coalesce((SELECT sum(extract(epoch FROM h."end" - h.start)) FROM hourly_records h
                           WHERE h.meter_run_id = m.id AND h.start >= ${at(2)} AND h.start < ${at(3)}), 0)::float8 AS covered_s,
                (SELECT count(*) FROM hourly_records h
                  WHERE h.meter_run_id = m.id AND h.start >= ${at(2)} AND h.start < ${at(3)}
                    AND coalesce(h.as_of, h.computed_at) < h."end")::int AS provisional,
                (SELECT count(*) FROM stale_hours q
                  WHERE q.meter_run_id = m.id AND q.start >= ${at(2)} AND q.start < ${at(3)})::int AS queued
           FROM meter_runs m WHERE m.site_id = $1`,
        [siteId, bounds.startMs, bounds.endMs],
      );
      return rows.map((r) => ({
        meterRunId: r.meter_run_id,
        coveredS: r.covered_s,
        provisionalRecords: r.provisional,
        queuedHours: r.queued,
      }));
    },

    async proposedCorrections(siteId: string, bounds: Bounds): Promise<ProposedCorrectionRecord[]> {
      const rows = await select<{ id: string; meter_run_id: string; start: Date; end: Date }>(
        `SELECT c.id::text, c.meter_run_id::text, c.start, c."end" FROM corrections c
           JOIN meter_runs m ON m.id = c.meter_run_id
          WHERE m.site_id = $1 AND c.status = 'proposed' AND c.start < ${at(3)} AND c."end" > ${at(2)}
          ORDER BY c.id`,
        [siteId, bounds.startMs, bounds.endMs],
      );
      return rows.map((r) => ({
        id: r.id,
        meterRunId: r.meter_run_id,
        startMs: r.start.getTime(),
        endMs: r.end.getTime(),
      }));
    },

    /** Alarms of the given conditions on the site's meter runs that are not back to normal. */
    async openAlarms(siteId: string, conditions: readonly string[]): Promise<OpenAlarmRecord[]> {
      return select<OpenAlarmRecord>(
        `SELECT a.id::text AS "id", a.meter_run_id::text AS "meterRunId", a.condition AS "condition",
                a.state AS "state", a.message AS "message"
           FROM alarms a JOIN meter_runs m ON m.id = a.meter_run_id
          WHERE m.site_id = $1 AND a.condition = ANY($2::text[]) AND a.state <> 'normal'
          ORDER BY a.id`,
        [siteId, conditions],
      );
    },

    async heldHours(siteId: string, bounds: Bounds): Promise<HeldHourRecord[]> {
      const rows = await select<{ meter_run_id: string; start: Date; cause: string; cause_reference: string | null }>(
        `SELECT h.meter_run_id::text, h.start, h.cause, h.cause_reference FROM held_hours h
           JOIN meter_runs m ON m.id = h.meter_run_id
          WHERE m.site_id = $1 AND h.start >= ${at(2)} AND h.start < ${at(3)}
          ORDER BY h.meter_run_id, h.start`,
        [siteId, bounds.startMs, bounds.endMs],
      );
      return rows.map((r) => ({
        meterRunId: r.meter_run_id,
        startMs: r.start.getTime(),
        cause: r.cause,
        causeReference: r.cause_reference,
      }));
    },

    /** Imports (readings or field totals) that brought data for [start, end) of the site after `sinceMs`. */
    async importsSince(siteId: string, bounds: Bounds, sinceMs: number): Promise<PendingImportRecord[]> {
      const rows = await select<{ id: string; kind: string; filename: string; created_at: Date }>(
        `SELECT i.id::text, i.kind, i.filename, i.created_at FROM imports i
          WHERE i.created_at > ${at(4)} AND (
            EXISTS (SELECT 1 FROM readings r JOIN transmitters t ON t.id = r.transmitter_id
                      JOIN meter_runs m ON m.id = t.meter_run_id
                     WHERE m.site_id = $1 AND r.import_id = i.id AND r.time >= ${at(2)} AND r.time < ${at(3)})
            OR EXISTS (SELECT 1 FROM field_totals f JOIN meter_runs m ON m.id = f.meter_run_id
                     WHERE m.site_id = $1 AND f.import_id = i.id AND f.period_start < ${at(3)} AND f.period_end > ${at(2)}))
          ORDER BY i.id`,
        [siteId, bounds.startMs, bounds.endMs, sinceMs],
      );
      return rows.map((r) => ({ id: r.id, kind: r.kind, filename: r.filename, createdAt: r.created_at }));
    },

    /** Sets the status of the site's contract-day and contract-month totals of the month to 'closed', keeping the one it replaces. */
    async markTotalsClosed(siteId: string, month: string, bounds: Bounds, transaction: Transaction): Promise<void> {
      await sequelize.query(
        `UPDATE daily_totals d SET status_before_close = d.status, status = 'closed'
           FROM meter_runs m WHERE m.id = d.meter_run_id AND m.site_id = $1 AND d.status <> 'closed'
            AND d.start >= ${at(2)} AND d.start < ${at(3)}`,
        { bind: [siteId, bounds.startMs, bounds.endMs], transaction },
      );
      await sequelize.query(
        `UPDATE monthly_totals t SET status_before_close = t.status, status = 'closed'
           FROM meter_runs m WHERE m.id = t.meter_run_id AND m.site_id = $1 AND t.status <> 'closed' AND t.month = $2::date`,
        { bind: [siteId, `${month}-01`], transaction },
      );
    },

    /** Puts back the status the totals had before the close. */
    async restoreTotals(siteId: string, month: string, bounds: Bounds, transaction: Transaction): Promise<void> {
      await sequelize.query(
        `UPDATE daily_totals d SET status = coalesce(d.status_before_close, 'provisional'), status_before_close = NULL
           FROM meter_runs m WHERE m.id = d.meter_run_id AND m.site_id = $1 AND d.status = 'closed'
            AND d.start >= ${at(2)} AND d.start < ${at(3)}`,
        { bind: [siteId, bounds.startMs, bounds.endMs], transaction },
      );
      await sequelize.query(
        `UPDATE monthly_totals t SET status = coalesce(t.status_before_close, 'provisional'), status_before_close = NULL
           FROM meter_runs m WHERE m.id = t.meter_run_id AND m.site_id = $1 AND t.status = 'closed' AND t.month = $2::date`,
        { bind: [siteId, `${month}-01`], transaction },
      );
    },

    /** Empties the month's held hours (a reopen queues every hour of the month instead). */
    async releaseHeldHours(siteId: string, bounds: Bounds, transaction: Transaction): Promise<void> {
      await sequelize.query(
        `DELETE FROM held_hours h USING meter_runs m
          WHERE m.id = h.meter_run_id AND m.site_id = $1 AND h.start >= ${at(2)} AND h.start < ${at(3)}`,
        { bind: [siteId, bounds.startMs, bounds.endMs], transaction },
      );
    },
  };
}

export type PeriodsRepository = ReturnType<typeof periodsRepository>;
