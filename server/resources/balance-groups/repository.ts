import type { Pool, PoolClient } from 'pg';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export type Side = 'inlet' | 'outlet';

/** A balance group as stored, with its members. */
export interface BalanceGroupRecord {
  id: string;
  siteId: string;
  name: string;
  allowancePercent: number | null;
  allowanceDailyM3: number | null;
  tolerancePercent: number;
  version: number;
  createdAtMs: number;
  /** The site's IANA zone: plain dates of a balance window are read in it. */
  timeZone: string;
  members: { meterRunId: string; tag: string; side: Side }[];
}

export interface NewBalanceGroup {
  siteId: string;
  name: string;
  allowancePercent: number | null;
  allowanceDailyM3: number | null;
  tolerancePercent: number;
  createdBy: string;
  inletMeterRunIds: string[];
  outletMeterRunIds: string[];
}

/** One member's daily or monthly total, as the balance and the allocation read it. */
export interface MemberTotal {
  meterRunId: string;
  /** The contract day or month, YYYY-MM-DD. */
  period: string;
  startMs: number;
  endMs: number;
  standardVolumeM3: number;
  energyJ: number | null;
  uncertaintyPercent: number | null;
  status: string;
}

interface GroupRow {
  id: string;
  site_id: string;
  name: string;
  allowance_percent: number | null;
  allowance_daily_m3: number | null;
  tolerance_percent: number;
  version: number;
  created_at: Date;
  time_zone: string;
}

interface MemberRow {
  balance_group_id: string;
  meter_run_id: string;
  tag: string;
  side: Side;
}

interface TotalRow {
  meter_run_id: string;
  period: string;
  start: Date;
  end: Date;
  standard_volume_m3: number;
  energy_j: number | null;
  uncertainty_percent: number | null;
  status: string;
}

const toMemberTotal = (r: TotalRow): MemberTotal => ({
  meterRunId: r.meter_run_id,
  period: r.period,
  startMs: r.start.getTime(),
  endMs: r.end.getTime(),
  standardVolumeM3: r.standard_volume_m3,
  energyJ: r.energy_j,
  uncertaintyPercent: r.uncertainty_percent,
  status: r.status,
});

/** Daily (contract day) or monthly totals of meter runs whose period starts in [$2, $3), with $1 the ids. */
const totalsSql = (interval: 'day' | 'month') => {
  const table = interval === 'day' ? 'daily_totals' : 'monthly_totals';
  const period = interval === 'day' ? 'contract_day' : 'month';
  return `SELECT meter_run_id::text, to_char(${period}, 'YYYY-MM-DD') AS period, start, "end", standard_volume_m3, energy_j,
                 uncertainty_percent, status
            FROM ${table}
           WHERE meter_run_id = ANY($1::bigint[]) AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0)
           ORDER BY start, ${table}.meter_run_id`;
};

const SELECT_GROUP = `
  SELECT g.id::text, g.site_id::text, g.name, g.allowance_percent, g.allowance_daily_m3, g.tolerance_percent, g.version,
         g.created_at, s.time_zone
    FROM balance_groups g JOIN sites s ON s.id = g.site_id`;

export function balanceGroupsRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>, transaction?: Transaction) =>
    sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });

  async function withMembers(rows: GroupRow[], transaction?: Transaction): Promise<BalanceGroupRecord[]> {
    if (!rows.length) return [];
    const members = await select<MemberRow>(
      `SELECT b.balance_group_id::text, b.meter_run_id::text, m.tag, b.side
         FROM balance_group_members b JOIN meter_runs m ON m.id = b.meter_run_id
        WHERE b.balance_group_id IN (:ids)
        ORDER BY b.side, m.tag, b.meter_run_id`,
      { ids: rows.map((r) => r.id) },
      transaction,
    );
    return rows.map((r) => ({
      id: r.id,
      siteId: r.site_id,
      name: r.name,
      allowancePercent: r.allowance_percent,
      allowanceDailyM3: r.allowance_daily_m3,
      tolerancePercent: r.tolerance_percent,
      version: r.version,
      createdAtMs: r.created_at.getTime(),
      timeZone: r.time_zone,
      members: members
        .filter((m) => m.balance_group_id === r.id)
        .map((m) => ({ meterRunId: m.meter_run_id, tag: m.tag, side: m.side })),
    }));
  }

  async function findById(id: string, transaction?: Transaction): Promise<BalanceGroupRecord | null> {
    const rows = await select<GroupRow>(`${SELECT_GROUP} WHERE g.id = :id`, { id }, transaction);
    return (await withMembers(rows, transaction))[0] ?? null;
  }

  return {
    /** The site's zone and contract hour, or null when there is no such site. */
    async siteClock(siteId: string) {
      const [row] = await select<{ time_zone: string; contract_hour: number }>(
        'SELECT time_zone, contract_hour FROM sites WHERE id = :siteId',
        { siteId },
      );
      return row ? { timeZone: row.time_zone, contractHour: row.contract_hour } : null;
    },

    /** The site each of the meter runs belongs to (meter runs that do not exist are left out). */
    async meterRunSites(meterRunIds: string[]): Promise<Map<string, string>> {
      if (!meterRunIds.length) return new Map();
      const rows = await select<{ id: string; site_id: string }>(
        'SELECT id::text, site_id::text FROM meter_runs WHERE id IN (:ids)',
        { ids: meterRunIds },
      );
      return new Map(rows.map((r) => [r.id, r.site_id]));
    },

    async list(filter: { siteId?: string }): Promise<BalanceGroupRecord[]> {
      const rows = await select<GroupRow>(
        `${SELECT_GROUP} WHERE (:siteId::bigint IS NULL OR g.site_id = :siteId::bigint) ORDER BY g.site_id, g.name, g.id`,
        { siteId: filter.siteId ?? null },
      );
      return withMembers(rows);
    },

    findById,

    /** Whether the site already has a group of that name (names are unique per site, case aside). */
    async nameTaken(siteId: string, name: string): Promise<boolean> {
      const rows = await select<{ found: number }>(
        'SELECT 1 AS found FROM balance_groups WHERE site_id = :siteId AND lower(name) = lower(:name)',
        { siteId, name },
      );
      return rows.length > 0;
    },

    async insert(group: NewBalanceGroup, transaction: Transaction): Promise<BalanceGroupRecord> {
      const [row] = await select<{ id: string }>(
        `INSERT INTO balance_groups (site_id, name, allowance_percent, allowance_daily_m3, tolerance_percent, created_by)
         VALUES (:siteId, :name, :allowancePercent, :allowanceDailyM3, :tolerancePercent, :createdBy)
         RETURNING id::text`,
        {
          siteId: group.siteId,
          name: group.name,
          allowancePercent: group.allowancePercent,
          allowanceDailyM3: group.allowanceDailyM3,
          tolerancePercent: group.tolerancePercent,
          createdBy: group.createdBy,
        },
        transaction,
      );
      const members = [
        ...group.inletMeterRunIds.map((meterRunId) => ({ meterRunId, side: 'inlet' })),
        ...group.outletMeterRunIds.map((meterRunId) => ({ meterRunId, side: 'outlet' })),
      ];
      await sequelize.query(
        `INSERT INTO balance_group_members (balance_group_id, meter_run_id, side)
         SELECT :id, m.meter_run_id::bigint, m.side
           FROM jsonb_to_recordset(:members::jsonb) AS m (meter_run_id text, side text)`,
        {
          replacements: {
            id: row.id,
            members: JSON.stringify(members.map((m) => ({ meter_run_id: m.meterRunId, side: m.side }))),
          },
          transaction,
        },
      );
      const stored = await findById(row.id, transaction);
      if (!stored) throw new Error(`balance group ${row.id} vanished inside its own transaction`);
      return stored;
    },

    /**
     * Daily (contract day) or monthly totals of the meter runs whose period starts in [fromMs, toMs).
     */
    async totals(
      interval: 'day' | 'month',
      meterRunIds: string[],
      fromMs: number,
      toMs: number,
    ): Promise<MemberTotal[]> {
      if (!meterRunIds.length) return [];
      const rows = await sequelize.query<TotalRow>(totalsSql(interval), {
        type: QueryTypes.SELECT,
        bind: [meterRunIds, fromMs, toMs],
      });
      return rows.map(toMemberTotal);
    },

    /** The monthly totals of the meter runs for one contract month (`YYYY-MM`). */
    async monthTotals(meterRunIds: string[], month: string): Promise<MemberTotal[]> {
      if (!meterRunIds.length) return [];
      const rows = await select<TotalRow>(
        `SELECT meter_run_id::text, to_char(month, 'YYYY-MM-DD') AS period, start, "end", standard_volume_m3, energy_j,
                uncertainty_percent, status
           FROM monthly_totals WHERE meter_run_id IN (:ids) AND month = :month::date ORDER BY monthly_totals.meter_run_id`,
        { ids: meterRunIds, month: `${month}-01` },
      );
      return rows.map(toMemberTotal);
    },
  };
}

export type BalanceGroupsRepository = ReturnType<typeof balanceGroupsRepository>;

/** A balance group as the alarm judge reads it (server/alarms/balance-alarm.ts), with its alarm watermark. */
export interface JudgedBalanceGroup extends BalanceGroupRecord {
  /** The end of the last contract day judged for the alarm; null before the first. */
  alarmWatermarkMs: number | null;
}

/**
 * What the balance alarm reads and writes, on a pg pool or on a client inside the judge's
 * transaction (the alarm evaluator has no Sequelize).
 */
export function balanceAlarmRepository(db: Pool | PoolClient) {
  return {
    async groupIds(): Promise<string[]> {
      const { rows } = await db.query<{ id: string }>('SELECT id::text FROM balance_groups ORDER BY balance_groups.id');
      return rows.map((r) => r.id);
    },

    async group(id: string): Promise<JudgedBalanceGroup | null> {
      const { rows } = await db.query<GroupRow & { alarm_watermark: Date | null }>(
        `${SELECT_GROUP.replace('g.created_at,', 'g.created_at, g.alarm_watermark,')} WHERE g.id = $1`,
        [id],
      );
      const r = rows[0];
      if (!r) return null;
      const members = await db.query<MemberRow>(
        `SELECT b.balance_group_id::text, b.meter_run_id::text, m.tag, b.side
           FROM balance_group_members b JOIN meter_runs m ON m.id = b.meter_run_id
          WHERE b.balance_group_id = $1 ORDER BY b.side, m.tag, b.meter_run_id`,
        [id],
      );
      return {
        id: r.id,
        siteId: r.site_id,
        name: r.name,
        allowancePercent: r.allowance_percent,
        allowanceDailyM3: r.allowance_daily_m3,
        tolerancePercent: r.tolerance_percent,
        version: r.version,
        createdAtMs: r.created_at.getTime(),
        timeZone: r.time_zone,
        members: members.rows.map((m) => ({ meterRunId: m.meter_run_id, tag: m.tag, side: m.side })),
        alarmWatermarkMs: r.alarm_watermark?.getTime() ?? null,
      };
    },

    async totals(
      interval: 'day' | 'month',
      meterRunIds: string[],
      fromMs: number,
      toMs: number,
    ): Promise<MemberTotal[]> {
      if (!meterRunIds.length) return [];
      const { rows } = await db.query<TotalRow>(totalsSql(interval), [meterRunIds, fromMs, toMs]);
      return rows.map(toMemberTotal);
    },

    async setAlarmWatermark(id: string, watermarkMs: number) {
      await db.query('UPDATE balance_groups SET alarm_watermark = to_timestamp($2 / 1000.0) WHERE id = $1', [
        id,
        watermarkMs,
      ]);
    },
  };
}
