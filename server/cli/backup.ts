/**
 * `npm run backup [-- --out <folder>]`: one folder named by the time, `tallyrun-backup-<UTC time>`,
 * under `<data dir>/backups` (or `--out`), holding
 * - `database.dump`: pg_dump's custom format of the database;
 * - `files.tar`: the records' stored files of the data folder (imports' originals, certificates);
 * - `manifest.json`: the SHA-256 and size of both, the migration level and the rows per table.
 *
 * The dump and the row counts come from one snapshot (exported by a repeatable-read transaction
 * and handed to pg_dump), so the counts describe exactly what was dumped while the server runs
 * on. The files are taken after the snapshot: a file is kept before its record is written and
 * never removed, so every file a dumped record names is in the tar.
 *
 * The database is DATABASE_URL when set, otherwise the project's cluster (database `tallyrun`).
 * The folder is made as `….partial` and renamed when whole: a half-made backup is never taken
 * for a backup. Exit 0 with the folder's path; 1 when the backup failed.
 */
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import {
  appliedMigrations,
  connectionOf,
  dataDirOf,
  databaseOf,
  describePart,
  dumpFile,
  filesTar,
  manifestFile,
  rowCounts,
  runPgTool,
  runTar,
  storedFolders,
  type BackupManifest,
} from './backup-parts';

const say = (line: string) => process.stdout.write(`${line}\n`);

function outArgument(argv: string[]): string | null {
  const at = argv.indexOf('--out');
  if (at === -1) return null;
  const value = argv[at + 1];
  if (!value) throw new Error('--out needs a folder');
  return path.resolve(value);
}

async function main(): Promise<number> {
  const dataDir = dataDirOf();
  const connection = await connectionOf(dataDir).catch((err: Error) => {
    say(`backup could not reach the database: ${err.message}`);
    return null;
  });
  if (!connection) return 1;
  const { url, cluster } = connection;
  const client = new Client({ connectionString: url });
  let partial: string | null = null;
  try {
    const parent = outArgument(process.argv.slice(2)) ?? path.join(dataDir, 'backups');
    const createdAt = new Date();
    const stamp = createdAt
      .toISOString()
      .replace(/[-:]/g, '')
      .replace(/\.\d+Z$/, 'Z');
    const folder = path.join(parent, `tallyrun-backup-${stamp}`);
    if (fs.existsSync(folder)) throw new Error(`${folder} exists already; it is left as it is`);
    partial = `${folder}.partial`;
    fs.mkdirSync(parent, { recursive: true });
    fs.mkdirSync(partial, { mode: 0o700 });

    await client.connect();
    await client.query('BEGIN ISOLATION LEVEL REPEATABLE READ, READ ONLY');
    const snapshot = (await client.query<{ id: string }>('SELECT pg_export_snapshot() AS id')).rows[0].id;
    await runPgTool(
      'pg_dump',
      ['--format=custom', `--snapshot=${snapshot}`, `--file=${path.join(partial, dumpFile)}`],
      url,
    );
    const counts = await rowCounts(client);
    const migrations = await appliedMigrations(client);
    const version = (await client.query<{ v: string }>("SELECT current_setting('server_version') AS v")).rows[0].v;
    await client.query('COMMIT');

    const present = storedFolders.filter((f) => fs.existsSync(path.join(dataDir, f)));
    const tarPath = path.join(partial, filesTar);
    await runTar(
      present.length > 0
        ? ['--create', '--sort=name', `--file=${tarPath}`, `--directory=${dataDir}`, ...present]
        : ['--create', `--file=${tarPath}`, '--files-from=/dev/null'],
    );

    const manifest: BackupManifest = {
      kind: 'tallyrun-backup',
      formatVersion: 1,
      createdAt: createdAt.toISOString(),
      database: databaseOf(url),
      postgresVersion: version,
      migrationLevel: migrations.at(-1) ?? null,
      migrations,
      parts: [await describePart(partial, dumpFile), await describePart(partial, filesTar)],
      rowCounts: counts,
    };
    fs.writeFileSync(path.join(partial, manifestFile), `${JSON.stringify(manifest, null, 2)}\n`, { flag: 'wx' });
    fs.renameSync(partial, folder);
    partial = null;
    const rows = Object.values(counts).reduce((a, b) => a + b, 0);
    say(`backup written: ${folder}`);
    say(
      `database ${manifest.database} at ${manifest.migrationLevel ?? '(no migrations)'}: ` +
        `${Object.keys(counts).length} tables, ${rows} rows; stored files: ${present.join(', ') || 'none'}`,
    );
    return 0;
  } catch (err) {
    say(`backup failed: ${err instanceof Error ? err.message : String(err)}`);
    return 1;
  } finally {
    await client.end().catch(() => undefined);
    // Only a folder this run made and did not finish is removed.
    if (partial) fs.rmSync(partial, { recursive: true, force: true });
    if (cluster?.startedHere) cluster.stop();
  }
}

void main().then((code) => process.exit(code));
