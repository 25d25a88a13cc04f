import fs from 'node:fs';
import { parse, type CsvError, type Options as CsvOptions } from 'csv-parse';
import type { Pool } from 'pg';
import type { Catalog, CatalogTransmitter } from './catalog';
import type { ReadingWriter } from './reading-writer';
import { validateReading, type ValidReading } from './validate-reading';
import { toSI, unitQuantity } from '../../shared/units';
import { isDatabaseUnreachable } from '../db/availability';
import { componentLogger } from '../log';

const log = componentLogger('imports');

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

/**
 * Saves the import's final state. When the database is unreachable (a restart under the import)
 * this waits for it, trying every 2 s for up to 15 minutes, so the import does not stay `running`
 * with no one to finish it; after that the next server start marks it failed.
 */
async function saveFinal(pool: Pool, id: string, p: Progress, status: 'done' | 'failed', retryMs = 2000) {
  const until = Date.now() + 15 * 60_000;
  for (let logged = false; ; logged = true) {
    try {
      return await saveProgress(pool, id, p, status);
    } catch (err) {
      if (!isDatabaseUnreachable(err) || Date.now() > until) throw err;
      if (!logged) log.warn({ importId: id, status }, 'the database is unreachable; the import result waits for it');
      await new Promise((resolve) => setTimeout(resolve, retryMs));
    }
  }
}

/** Why an import stopped, saying what is stored when the database went away under it. */
function stopReason(err: unknown, stored: string): string {
  const message = err instanceof Error ? err.message : String(err);
  if (!isDatabaseUnreachable(err)) return message;
  return `the database could not be reached (${message}); ${stored}; re-import the file to finish (readings already stored count as duplicates)`;
}

function reject(p: Progress, line: number, message: string) {
  p.rejected++;
  if (p.errors.length < maxListedErrors) p.errors.push({ line, message });
}

/** Where a pass of the parser starts: a byte offset in the file and the number of lines before it. */
interface PassStart {
  byte: number;
  linesBefore: number;
}

/** Newlines inside a record's quoted fields (a legal multi-line value): the record spans that many more lines. */
function newlinesIn(record: string[]): number {
  let n = 0;
  for (const field of record) for (let i = field.indexOf('\n'); i >= 0; i = field.indexOf('\n', i + 1)) n++;
  return n;
}

/** The byte offset where line `line` (1-based) starts, or null when the file has fewer lines. */
async function offsetOfLine(file: string, line: number): Promise<number | null> {
  let newlines = 0;
  let offset = 0;
  for await (const chunk of fs.createReadStream(file, { highWaterMark: 1 << 20 }) as AsyncIterable<Buffer>) {
    for (let i = chunk.indexOf(10); i >= 0; i = chunk.indexOf(10, i + 1)) {
      if (++newlines === line - 1) {
        const at = offset + i + 1;
        return at < fs.statSync(file).size ? at : null;
      }
    }
    offset += chunk.length;
  }
  return null;
}

/** What went wrong in a record csv-parse could not read, in words (the line is said by the caller). */
function quoteProblem(code: string, message: string): string {
  if (code === 'CSV_QUOTE_NOT_CLOSED') return 'a quote opened here is never closed';
  if (code === 'CSV_INVALID_CLOSING_QUOTE') return 'a closing quote must be followed by a comma or the end of the line';
  if (code === 'INVALID_OPENING_QUOTE')
    return 'a quote inside an unquoted value (quote the whole value and double each quote inside it)';
  return message;
}

/**
 * Streams a readings CSV (`time,tag,value[,quality][,unit]`) from disk into the readings table
 * in batches. Every rejected line is listed with its number and reason; good lines are kept;
 * a re-imported line (same tag and time) counts as a duplicate, and one whose value or quality
 * differs from the stored reading also counts as a conflict (listed for an engineer to resolve;
 * the first reading stays stored). Each stored reading carries the import's id. The import's row is updated
 * after each committed batch, so the progress shown is what is really in the database. The file
 * is the import's kept original (read-only): it is read, never removed.
 *
 * A line csv-parse cannot read (a stray or unbalanced quote) is rejected under its own line with
 * the line parsing resumed at; the lines around it are kept (issue 12, point 4).
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
  let columns: { time: number; tag: number; value: number; quality: number; unit: number } | null = null;
  let batch: ValidReading[] = [];
  // The last line of the last committed batch: batches commit in file order, so every good line up to it is stored.
  let storedThroughLine = 0;
  // One write in flight while the next batch is parsed; progress is saved after each commit.
  let writing: Promise<void> = Promise.resolve();
  const flush = async () => {
    await writing;
    if (!batch.length) return;
    const rows = batch;
    const lastLine = line;
    batch = [];
    writing = deps.writer.write(rows, 'csv', { importId }).then(async ({ inserted, duplicates, conflicts }) => {
      storedThroughLine = lastLine;
      p.rowsImported += inserted;
      p.duplicates += duplicates;
      p.conflicts += conflicts;
      deps.onStored?.(rows);
      await saveProgress(deps.pool, importId, p);
    });
  };
  // Transmitters looked up once per tag for the whole file.
  const transmitters = new Map<string, CatalogTransmitter | null>();
  let line = 0;
  const nowMs = Date.now();

  /**
   * One pass of csv-parse from `from` to the end of the file. Records the parser cannot read are
   * skipped by csv-parse itself (`skip_records_with_error`), which resyncs at the next line after a
   * stray quote inside a value. It cannot resync after a quote that is never closed: everything to
   * the end of the file is one unfinished field. That case returns the line where the bad record
   * starts, and the caller starts a new pass at the line after it (the only reason for our own
   * line scanning, `offsetOfLine`). Line numbers are counted by us, not by csv-parse's `info`
   * (which counts a CRLF inside a quoted value as two lines, and halves the parser's speed).
   */
  const pass = async (from: PassStart): Promise<number | null> => {
    // Lines before the next record, updated synchronously by the parser's callbacks, so that a
    // skipped record and the records around it are numbered in file order.
    let linesDone = from.linesBefore;
    let parserLinesDone = 0;
    let unclosedAt: number | null = null;
    let closingAt: number | null = null;
    const skipped: { line: number; message: string }[] = [];
    const input = fs.createReadStream(file, { highWaterMark: 1 << 20, start: from.byte });
    let passBytes = 0;
    input.on('data', (chunk) => {
      passBytes += chunk.length;
      p.bytesRead = Math.max(p.bytesRead, from.byte + passBytes);
    });
    // Empty lines are kept as records so that every line belongs to a record.
    const options: CsvOptions<{ record: string[]; line: number }, string[]> = {
      bom: true,
      skip_empty_lines: false,
      relax_column_count: true,
      skip_records_with_error: true,
      on_record: (record: string[], context: { lines: number }) => {
        if (closingAt !== null) {
          // csv-parse dropped the lines from a bad closing quote to here (no quoted line break in them to miscount).
          const last = closingAt + Math.max(1, context.lines - newlinesIn(record) - parserLinesDone - 1) - 1;
          const said = skipped.find((s) => s.line === closingAt);
          const span =
            last === closingAt ? `line ${last} could not be read` : `lines ${closingAt}–${last} could not be read`;
          if (said) said.message += `; ${span}; parsing resumed at line ${last + 1}`;
          linesDone = last;
          closingAt = null;
        }
        const first = linesDone + 1;
        linesDone = first + newlinesIn(record);
        parserLinesDone = context.lines;
        return { record, line: first };
      },
      on_skip: (err: (CsvError & { lines?: number }) | undefined) => {
        if (!err) return undefined;
        const first = linesDone + 1;
        // After a bad closing quote csv-parse stays inside the quoted value: it ends as a quote never closed.
        if (err.code === 'CSV_QUOTE_NOT_CLOSED' || err.code === 'CSV_INVALID_CLOSING_QUOTE') {
          if (err.code === 'CSV_QUOTE_NOT_CLOSED') unclosedAt = first;
          else closingAt = first;
          if (skipped.at(-1)?.line !== first)
            skipped.push({ line: first, message: `line ${first}: ${quoteProblem(err.code, err.message)}` });
          return undefined;
        }
        // The parser has read to the end of the line it found the fault on, then drops the record.
        const last = Math.max(first, first + (err.lines ?? parserLinesDone + 1) - parserLinesDone - 1);
        parserLinesDone = err.lines ?? parserLinesDone + 1;
        linesDone = last;
        const lines = last === first ? `line ${first} could not be read` : `lines ${first}–${last} could not be read`;
        skipped.push({
          line: first,
          message: `line ${first}: ${quoteProblem(err.code ?? '', err.message)}; ${lines}; parsing resumed at line ${last + 1}`,
        });
        return undefined;
      },
    };
    // The typings of parse() know only string[] records; ours are wrapped with their line by on_record.
    const parser = input.pipe(parse(options as unknown as CsvOptions));
    const rejectSkipped = (before: number) => {
      while (skipped.length && skipped[0].line < before) {
        const s = skipped.shift()!;
        p.rowsRead++;
        reject(p, s.line, s.message);
      }
    };
    for await (const { record, line: at } of parser as AsyncIterable<{ record: string[]; line: number }>) {
      rejectSkipped(at);
      line = at;
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
    if (unclosedAt !== null) {
      const last = skipped.find((s) => s.line === unclosedAt);
      const next = await offsetOfLine(file, unclosedAt + 1);
      if (last) {
        const said = last.message.replace(/; .*$/, '');
        last.message =
          next === null
            ? `${said}; it is on the file's last line, so nothing after it was lost`
            : `${said}; only this line was set aside and parsing resumed at line ${unclosedAt + 1}`;
      }
      rejectSkipped(Infinity);
      line = unclosedAt;
      return next === null ? null : next;
    }
    rejectSkipped(Infinity);
    return null;
  };

  try {
    let from: PassStart | null = { byte: 0, linesBefore: 0 };
    while (from) {
      const next = await pass(from);
      from = next === null ? null : { byte: next, linesBefore: line };
    }
    await flush();
    await writing;
    await saveFinal(deps.pool, importId, p, 'done');
  } catch (err) {
    // Batches already committed stay; the import says where it stopped and why.
    await writing.catch(() => undefined);
    await flush().catch(() => undefined);
    await writing.catch(() => undefined);
    const stored = storedThroughLine
      ? `the good lines up to line ${storedThroughLine} are stored (${p.rowsImported} new readings, ${p.duplicates} duplicates) and nothing after`
      : 'nothing of this file was stored';
    // A header fault is filed under the header's line; anything else under the first line whose
    // readings are not stored (where a re-import has work to do), never past the file's end.
    reject(p, columns ? Math.max(storedThroughLine, 1) + 1 : Math.max(line, 1), stopReason(err, stored));
    await saveFinal(deps.pool, importId, p, 'failed');
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
    await saveFinal(deps.pool, importId, p, 'done');
  } catch (err) {
    const stored = `${p.rowsImported} new field totals and ${p.duplicates} repeated ones of the lines before are stored, nothing after`;
    reject(p, p.rowsRead + 1, stopReason(err, stored));
    await saveFinal(deps.pool, importId, p, 'failed');
  }
}
