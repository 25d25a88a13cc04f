import { stringify } from 'csv-stringify/sync';
import ExcelJS from 'exceljs';
import { recordExport } from '../../audit';
import type { SignedInUser } from '../../auth/passport';
import { AppError } from '../../errors';
import type { MonthlyVolumesRepository } from '../monthly-volumes/repository';
import { monthlyVolumes, type MonthlyVolumes } from '../monthly-volumes/use-cases';
import { allocationForMonth, listBalanceGroups, type AllocationReport } from '../balance-groups/use-cases';
import type { BalanceGroupsRepository } from '../balance-groups/repository';
import { exportTable, neutralised, type ExportTable } from './export-table';
import { statementHtml } from './statement-html';

/** A meter run's share of a sales meter's month, allocated pro rata (issue 10 §4). */
export interface AllocationRow {
  meterRunTag: string;
  /** The tag of the sales meter run whose volume was allocated, and the balance group that says so. */
  fromTag: string;
  groupName: string;
  /** Null when the inlets measured nothing (no share can be worked out). */
  factor: number | null;
  allocatedStandardVolumeM3: number | null;
  allocatedEnergyJ: number | null;
}

/**
 * The allocation rows of the site's month: every balance group of the site whose one outlet is a
 * sales meter allocates its month to the inlets (the balance groups' own use case, the same as
 * `GET /api/balance-groups/:id/allocation`). A group with several outlets allocates nothing, and
 * one whose sales meter has no total for the month has nothing to allocate yet.
 */
export async function allocationRowsFor(
  balanceGroups: BalanceGroupsRepository,
  siteId: string,
  month: string,
): Promise<AllocationRow[]> {
  const rows: AllocationRow[] = [];
  for (const group of await listBalanceGroups(balanceGroups, { siteId })) {
    if (group.members.filter((m) => m.side === 'outlet').length !== 1) continue;
    let report: AllocationReport;
    try {
      report = await allocationForMonth(balanceGroups, { group, month });
    } catch (err) {
      if (err instanceof AppError && err.status === 404) continue;
      throw err;
    }
    for (const w of report.wells)
      rows.push({
        meterRunTag: w.tag,
        fromTag: report.sales.tag,
        groupName: group.name,
        factor: w.factor,
        allocatedStandardVolumeM3: w.allocatedStandardVolumeM3,
        allocatedEnergyJ: w.allocatedEnergyJ,
      });
  }
  return rows;
}

/** What the exports read: the monthly volumes and the balance groups (for allocation). */
export interface ExportDeps {
  volumes: MonthlyVolumesRepository;
  balanceGroups: BalanceGroupsRepository;
}

export interface ExportFile {
  fileName: string;
  contentType: string;
  body: Buffer | string;
}

/** The month, refused with the reason when it holds no total to export. */
async function monthToExport(repository: MonthlyVolumesRepository, siteId: string, month: string) {
  const volumes = await monthlyVolumes(repository, { siteId, month });
  if (!volumes.hasData)
    throw new AppError(
      404,
      'not_found',
      `No monthly totals for site ${volumes.site.code} in ${month}: there is nothing to export.`,
    );
  return volumes;
}

const fileStem = (v: MonthlyVolumes) => `monthly-volumes-${v.site.code}-${v.month}`.replace(/[^\w.-]/g, '_');

/**
 * The monthly volumes of a site as CSV or an Excel workbook: a header block (site, month, base
 * conditions, units, status, exported at and by whom), then one row per meter run and the site's
 * total, in the site's units. The export is recorded in the audit trail before the file is made.
 * @throws 404 with the reason when the month has no data
 */
export async function exportMonthlyVolumes(
  deps: ExportDeps,
  request: { siteId: string; month: string; format: 'csv' | 'xlsx'; actor: SignedInUser; nowMs?: number },
): Promise<ExportFile> {
  const volumes = await monthToExport(deps.volumes, request.siteId, request.month);
  const allocation = await allocationRowsFor(deps.balanceGroups, request.siteId, request.month);
  const table = exportTable(volumes, { atMs: request.nowMs ?? Date.now(), by: request.actor }, allocation);
  await recordExport({
    actor: request.actor,
    what: 'monthly-volumes',
    format: request.format,
    filters: { siteId: request.siteId, month: request.month },
    rows: table.rows.length,
  });
  const stem = fileStem(volumes);
  if (request.format === 'csv')
    return { fileName: `${stem}.csv`, contentType: 'text/csv; charset=utf-8', body: csvFile(table) };
  return {
    fileName: `${stem}.xlsx`,
    contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    body: await workbookFile(table, volumes.month),
  };
}

/** The header block, an empty record, then the table (RFC 4180, CRLF). */
function csvFile(table: ExportTable): string {
  const records = [
    ...table.header.map(([label, value]) => [label, value].map(neutralised)),
    [],
    table.columns,
    ...table.rows.map((row) => row.map(neutralised)),
  ];
  return stringify(records, { record_delimiter: 'windows', cast: { number: (v) => String(v) } });
}

/** One sheet: the header block in two columns, an empty row, the table with numbers as numbers. */
async function workbookFile(table: ExportTable, month: string): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.created = new Date();
  const sheet = workbook.addWorksheet(`Volumes ${month}`);
  for (const [label, value] of table.header) sheet.addRow([label, neutralised(value)]).getCell(1).font = { bold: true };
  sheet.addRow([]);
  const head = sheet.addRow(table.columns);
  head.font = { bold: true };
  for (const row of table.rows) sheet.addRow(row.map(neutralised));
  sheet.columns.forEach((column, i) => {
    column.width = i < 2 ? 24 : 16;
  });
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

/**
 * A printable statement of the site's month (HTML with a print stylesheet, page numbers and the
 * status stamped on it), recorded in the audit trail like any export.
 * @throws 404 with the reason when the month has no data
 */
export async function monthlyStatement(
  deps: ExportDeps,
  request: { siteId: string; month: string; actor: SignedInUser; nowMs?: number },
): Promise<ExportFile> {
  const volumes = await monthToExport(deps.volumes, request.siteId, request.month);
  const allocation = await allocationRowsFor(deps.balanceGroups, request.siteId, request.month);
  const table = exportTable(volumes, { atMs: request.nowMs ?? Date.now(), by: request.actor }, allocation);
  await recordExport({
    actor: request.actor,
    what: 'monthly-statement',
    format: 'html',
    filters: { siteId: request.siteId, month: request.month },
    rows: table.rows.length,
  });
  return {
    fileName: `${fileStem(volumes).replace('monthly-volumes', 'statement')}.html`,
    contentType: 'text/html; charset=utf-8',
    body: statementHtml(table, volumes.totals.status),
  };
}
