import fs from 'node:fs';
import { parse } from 'csv-parse';
import type { Pool } from 'pg';
import type { Catalog, CatalogTransmitter } from './catalog';
import type { ReadingWriter } from './reading-writer';
import { validateReading, type ValidReading } from './validate-reading';
import { toSI, unitQuantity } from '../../shared/units';

/** At most this many rejected lines are listed (all are counted). */
const maxListedErrors = 1000;
const batchSize = 10_000;

interface Progress {
  bytesRead: number;
  rowsRead: number;
  rowsImported: number;
  duplicates: number;
  /** Duplicates whose value or quality differed from the stored reading: recorded as conflicts, not rejected. */
  conflicts: number;
  rejected: number;
  errors: { line: number; message: string }[];
}

async function saveProgress(pool: Pool, id: string, p: Progress, status?: 'done' | 'failed') {
  await pool.query(
    `UPDATE imports SET bytes_read = $2, rows_read = $3, rows_imported = $4, duplicates = $5, rejected = $6, errors = $7::jsonb,
            status = COALESCE($8, status), finished_at = CASE WHEN $8::text IS NULL THEN NULL ELSE now() END, conflicts = $9
      WHERE id = $1`,
    [
      id,
      p.bytesRead,
      p.rowsRead,
      p.rowsImported,
      p.duplicates,
      p.rejected,
      JSON.stringify(p.errors),
      status ?? null,
      p.conflicts,
    ],
  );
}

function reject(p: Progress, line: number, message: string) {
  p.rejected++;
  if (p.errors.length < maxListedErrors) p.errors.push({ line, message });
}

/**
 * Streams a readings CSV (`time,tag,value[,quality][,unit]`) from disk into the readings table
 * in batches. Every rejected line is listed with its number and reason; good lines are kept;
 * a re-imported line (same tag and time) counts as a duplicate, and one whose value or quality
 * differs from the stored reading also counts as a conflict (listed for an engineer to resolve;
 * the first reading stays stored). Each stored reading carries the import's id. The import's row is updated
 * after each committed batch, so the progress shown is what is really in the database. The file
 * is the import's kept original (read-only): it is read, never removed.
 */
export async function importReadingsCsv(
  deps: { pool: Pool; catalog: Catalog; writer: ReadingWriter; onStored?: (r: ValidReading[]) => void },
  importId: string,
  file: string,
) {
  const p: Progress = {
    bytesRead: 0,
    rowsRead: 0,
    rowsImported: 0,
    duplicates: 0,
    conflicts: 0,
    rejected: 0,
    errors: [],
  };
  const input = fs.createReadStream(file, { highWaterMark: 1 << 20 });
  input.on('data', (chunk) => (p.bytesRead += chunk.length));
  // Plain records (no per-record info, no trim: both halve csv-parse's speed). Empty lines are
  // kept as records so that the n-th record is line n: a line number without csv-parse's info.
  const parser = input.pipe(parse({ bom: true, skip_empty_lines: false, relax_column_count: true }));
  let line = 0;
  let columns: { time: number; tag: number; value: number; quality: number; unit: number } | null = null;
  let batch: ValidReading[] = [];
  // One write in flight while the next batch is parsed; progress is saved after each commit.
  let writing: Promise<void> = Promise.resolve();
  const flush = async () => {
    await writing;
    if (!batch.length) return;
    const rows = batch;
    batch = [];
    writing = deps.writer.write(rows, 'csv', { importId }).then(async ({ inserted, duplicates, conflicts }) => {
      p.rowsImported += inserted;
      p.duplicates += duplicates;
      p.conflicts += conflicts;
      deps.onStored?.(rows);
      await saveProgress(deps.pool, importId, p);
    });
  };
  // Transmitters looked up once per tag for the whole file.
  const transmitters = new Map<string, CatalogTransmitter | null>();
  try {
    const nowMs = Date.now();
    for await (const record of parser as AsyncIterable<string[]>) {
      line++;
      if (record.length === 1 && record[0].trim() === '') continue;
      if (!columns) {
        const header = record.map((h) => h.trim().toLowerCase());
        const missing = ['time', 'tag', 'value'].filter((c) => !header.includes(c));
        if (missing.length)
          throw new Error(
            `line ${line}: the header must name the columns time,tag,value[,quality][,unit]; missing ${missing.join(', ')}`,
          );
        columns = {
          time: header.indexOf('time'),
          tag: header.indexOf('tag'),
          value: header.indexOf('value'),
          quality: header.indexOf('quality'),
          unit: header.indexOf('unit'),
        };
        continue;
      }
      p.rowsRead++;
      const tag = record[columns.tag]?.trim();
      if (!tag) {
        reject(p, line, 'tag: is missing');
        continue;
      }
      let transmitter = transmitters.get(tag);
      if (transmitter === undefined) {
        transmitter = await deps.catalog.byTransmitterTag(tag);
        transmitters.set(tag, transmitter);
      }
      if (!transmitter) {
        reject(p, line, `tag: unknown transmitter ${tag}`);
        continue;
      }
      const checked = validateReading(
        {
          time: record[columns.time],
          value: record[columns.value],
          quality: columns.quality >= 0 ? record[columns.quality]?.trim() : undefined,
          unit: columns.unit >= 0 ? record[columns.unit]?.trim() : undefined,
        },
        transmitter,
        nowMs,
      );
      if (typeof checked === 'string') reject(p, line, checked);
      else batch.push(checked);
      if (batch.length >= batchSize) await flush();
    }
    await flush();
    await writing;
    await saveProgress(deps.pool, importId, p, 'done');
  } catch (err) {
    // Batches already committed stay; the import says where it stopped and why.
    await writing.catch(() => undefined);
    await flush().catch(() => undefined);
    await writing.catch(() => undefined);
    reject(p, p.rowsRead + 1, err instanceof Error ? err.message : String(err));
    await saveProgress(deps.pool, importId, p, 'failed');
  }
}

/**
 * Streams a field-totals CSV (`start,end,meterRun,quantity,value,unit`; quantity is
 * standard-volume, mass or energy, unit one of the named units) into field_totals, for
 * reconciliation against Tallyrun's own totals. A repeated row (same meter run and period)
 * replaces the value in force in field_totals and counts as a duplicate; every value imported is
 * also kept in field_total_versions with its import and line, so the earlier one stays on record.
 */
export async function importFieldTotalsCsv(deps: { pool: Pool }, importId: string, file: string) {
  const p: Progress = {
    bytesRead: 0,
    rowsRead: 0,
    rowsImported: 0,
    duplicates: 0,
    conflicts: 0,
    rejected: 0,
    errors: [],
  };
  const input = fs.createReadStream(file);
  input.on('data', (chunk) => (p.bytesRead += chunk.length));
  const parser = input.pipe(
    parse({ bom: true, trim: true, skip_empty_lines: true, relax_column_count: true, info: true }),
  );
  const runs = new Map(
    (await deps.pool.query<{ id: string; tag: string }>('SELECT id::text, tag FROM meter_runs')).rows.map((r) => [
      r.tag,
      r.id,
    ]),
  );
  const column = { 'standard-volume': 'standard_volume_m3', mass: 'mass_kg', energy: 'energy_j' } as const;
  const expectedUnit = { 'standard-volume': 'volume', mass: 'mass', energy: 'energy' } as const;
  let header: string[] | null = null;
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      const line = info.lines;
      if (!header) {
        header = record.map((h) => h.toLowerCase());
        const missing = ['start', 'end', 'meterrun', 'quantity', 'value', 'unit'].filter((c) => !header!.includes(c));
        if (missing.length)
          throw new Error(
            `line ${line}: the header must be start,end,meterRun,quantity,value,unit; missing ${missing.join(', ')}`,
          );
        continue;
      }
      p.rowsRead++;
      const row: Record<string, string> = {};
      header.forEach((h, i) => (row[h] = record[i] ?? ''));
      const runId = runs.get(row.meterrun);
      const start = Date.parse(row.start);
      const end = Date.parse(row.end);
      const value = Number(row.value);
      const quantity = row.quantity as keyof typeof column;
      const offset = /(Z|[+-]\d{2}:?\d{2})$/i;
      if (!runId) reject(p, line, `meterRun: unknown meter run ${row.meterrun}`);
      else if (!offset.test(row.start) || Number.isNaN(start))
        reject(p, line, 'start: must be ISO 8601 with an offset or Z');
      else if (!offset.test(row.end) || Number.isNaN(end) || end <= start)
        reject(p, line, 'end: must be ISO 8601 with an offset, after start');
      else if (!(quantity in column)) reject(p, line, 'quantity: must be standard-volume, mass or energy');
      else if (row.value === '' || !Number.isFinite(value) || value < 0) reject(p, line, 'value: must be a number ≥ 0');
      else {
        let si: number;
        try {
          si = toSI(value, row.unit);
        } catch {
          reject(p, line, `unit: unknown unit ${row.unit}`);
          continue;
        }
        if (unitQuantity(row.unit) !== expectedUnit[quantity]) {
          reject(p, line, `unit: ${row.unit} is not a unit of ${quantity}`);
          continue;
        }
        const col = column[quantity];
        // One statement: the version is kept exactly when the value in force is written.
        const res = await deps.pool.query<{ inserted: boolean }>(
          `WITH version AS (
             INSERT INTO field_total_versions (meter_run_id, period_start, period_end, quantity, value_si, import_id, line, unit)
             VALUES ($1, to_timestamp($2 / 1000.0), to_timestamp($3 / 1000.0), $6, $4, $5, $7, $8)
           )
           INSERT INTO field_totals (meter_run_id, period_start, period_end, ${col}, import_id)
           VALUES ($1, to_timestamp($2 / 1000.0), to_timestamp($3 / 1000.0), $4, $5)
           ON CONFLICT (meter_run_id, period_start, period_end) DO UPDATE SET ${col} = EXCLUDED.${col}, import_id = EXCLUDED.import_id
           RETURNING (xmax = 0) AS inserted`,
          // The unit as the field device reported it, so reconciliation shows figures in it.
          [runId, start, end, si, importId, quantity, line, row.unit],
        );
        if (res.rows[0].inserted) p.rowsImported++;
        else p.duplicates++;
      }
    }
    await saveProgress(deps.pool, importId, p, 'done');
  } catch (err) {
    reject(p, p.rowsRead + 1, err instanceof Error ? err.message : String(err));
    await saveProgress(deps.pool, importId, p, 'failed');
  }
}
