/**
 * `npm run restore -- <backup folder> [--database <name>] [--replace]`: brings a backup of
 * `npm run backup` back into a database and the data folder.
 *
 * 1. The manifest's parts are hashed again; any mismatch (or a missing part) refuses the restore
 *    before anything is touched.
 * 2. The target database (`--database`, else DATABASE_URL's, else `tallyrun`) must be missing or
 *    have no tables: a database with tables is refused unless `--replace` is given (then it is
 *    dropped and made anew; that needs a superuser's connection).
 * 3. With a superuser's connection (DATABASE_URL, or the project's cluster): the roles and the
 *    database owned by `tallyrun_owner` are made as `npm start` makes them, and pg_restore runs as
 *    the owner role, so every object is the owner's. With another connection (the owner role, say)
 *    the database must exist and is restored as that role.
 * 4. The restored rows per table and the migration level are compared with the manifest.
 * 5. The database is prepared as `npm start` prepares it (server/db/prepare.ts): pending
 *    migrations, then the app role's rights (server/db/roles.ts applyGrants).
 * 6. The audit trail is verified (as `npm run audit-verify`).
 * 7. The stored files go back under the data folder: a missing file is written (read-only); a
 *    file already there with the same bytes is left; one with other bytes refuses the whole
 *    restore, naming it, before the database is touched (they are compared first, after step 1):
 *    a record is never overwritten silently.
 *
 * Exit 0 when all of it held; 1 when refused or failed, saying why.
 */
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import {
  appliedMigrations,
  connectionOf,
  dataDirOf,
  databaseOf,
  dumpFile,
  filesTar,
  manifestFile,
  rowCounts,
  runPgTool,
  runTar,
  sha256OfFile,
  type BackupManifest,
} from './backup-parts';
import { prepareDatabase } from '../db/prepare';
import { ensureOwnedDatabase, ensureRoles, ownerRole, rolePasswords, urlAs, urlOfDatabase } from '../db/roles';
import { verifyAuditChain } from '../audit-chain';

const say = (line: string) => process.stdout.write(`${line}\n`);

class Refused extends Error {}

function parseArguments(argv: string[]) {
  const options = { folder: '', database: null as string | null, replace: false };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--replace') options.replace = true;
    else if (arg === '--database') {
      options.database = argv[++i] ?? '';
      if (!/^[A-Za-z_][A-Za-z0-9_]{0,62}$/.test(options.database))
        throw new Refused('--database needs a name of letters, digits and underscores');
    } else if (arg.startsWith('--')) throw new Refused(`unknown option ${arg}`);
    else if (!options.folder) options.folder = path.resolve(arg);
    else throw new Refused(`one backup folder only (also given: ${arg})`);
  }
  if (!options.folder) throw new Refused('name the backup folder: npm run restore -- <backup folder>');
  return options;
}

/** The manifest, with every part hashed again and compared. */
async function checkedManifest(folder: string): Promise<BackupManifest> {
  const file = path.join(folder, manifestFile);
  if (!fs.existsSync(file)) throw new Refused(`${folder} has no ${manifestFile}: not a Tallyrun backup folder`);
  let manifest: BackupManifest;
  try {
    manifest = JSON.parse(fs.readFileSync(file, 'utf8')) as BackupManifest;
  } catch (err) {
    throw new Refused(`${manifestFile} is not JSON: ${(err as Error).message}`);
  }
  if (manifest.kind !== 'tallyrun-backup' || manifest.formatVersion !== 1)
    throw new Refused(`${manifestFile} is not a Tallyrun backup manifest of format 1`);
  for (const name of [dumpFile, filesTar]) {
    const part = manifest.parts?.find((p) => p.file === name);
    if (!part) throw new Refused(`${manifestFile} lists no part ${name}`);
    const full = path.join(folder, name);
    if (!fs.existsSync(full)) throw new Refused(`part ${name} is missing from ${folder}`);
    const sha256 = await sha256OfFile(full);
    if (sha256 !== part.sha256)
      throw new Refused(`part ${name} does not match the manifest: SHA-256 ${sha256}, manifest says ${part.sha256}`);
  }
  return manifest;
}

async function tableCount(url: string): Promise<number | null> {
  const client = new Client({ connectionString: url });
  try {
    await client.connect();
  } catch (err) {
    if ((err as { code?: string }).code === '3D000') return null; // invalid_catalog_name: no such database
    throw err;
  }
  try {
    const res = await client.query<{ n: string }>(
      `SELECT count(*)::text AS n FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
        WHERE n.nspname NOT IN ('pg_catalog', 'information_schema', 'pg_toast') AND c.relkind IN ('r', 'p')`,
    );
    return Number(res.rows[0].n);
  } finally {
    await client.end();
  }
}

async function isSuperuser(url: string): Promise<boolean> {
  const client = new Client({ connectionString: urlOfDatabase(url, 'postgres') });
  await client.connect();
  try {
    const res = await client.query<{ s: boolean }>('SELECT rolsuper AS s FROM pg_roles WHERE rolname = current_user');
    return res.rows[0]?.s === true;
  } finally {
    await client.end();
  }
}

/** Compares the restored database with the manifest: migration level and rows of every table. */
async function compareWithManifest(url: string, manifest: BackupManifest) {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    const migrations = await appliedMigrations(client);
    if (JSON.stringify(migrations) !== JSON.stringify(manifest.migrations))
      throw new Error(`restored migrations ${migrations.at(-1)} differ from the manifest's ${manifest.migrationLevel}`);
    const counts = await rowCounts(client);
    const names = new Set([...Object.keys(counts), ...Object.keys(manifest.rowCounts)]);
    const differ = [...names].filter((t) => counts[t] !== manifest.rowCounts[t]);
    if (differ.length > 0)
      throw new Error(
        `restored rows differ from the manifest: ${differ
          .map((t) => `${t} ${counts[t] ?? 'missing'} (manifest ${manifest.rowCounts[t] ?? 'missing'})`)
          .join(', ')}`,
      );
    return Object.values(counts).reduce((a, b) => a + b, 0);
  } finally {
    await client.end();
  }
}

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)));
}

/**
 * Unpacks the backup's stored files into a staging folder of the data folder and compares them
 * with the files already there (step 7 above), before the database is touched.
 */
async function stagedFiles(folder: string, dataDir: string) {
  fs.mkdirSync(dataDir, { recursive: true });
  const staging = fs.mkdtempSync(path.join(dataDir, '.restore-'));
  try {
    await runTar(['--extract', `--file=${path.join(folder, filesTar)}`, `--directory=${staging}`, '--no-same-owner']);
    const files = filesUnder(staging);
    const toWrite: string[] = [];
    const conflicts: string[] = [];
    for (const file of files) {
      const target = path.join(dataDir, file);
      if (!fs.existsSync(target)) toWrite.push(file);
      else if ((await sha256OfFile(target)) !== (await sha256OfFile(path.join(staging, file)))) conflicts.push(file);
    }
    if (conflicts.length > 0)
      throw new Refused(
        `stored files already in ${dataDir} hold other bytes than the backup's: ${conflicts.join(', ')}`,
      );
    return { staging, toWrite, present: files.length - toWrite.length };
  } catch (err) {
    fs.rmSync(staging, { recursive: true, force: true });
    throw err;
  }
}

/** Writes the staged files that are missing, read-only, never over an existing one. */
function writeFiles(staged: { staging: string; toWrite: string[] }, dataDir: string) {
  for (const file of staged.toWrite) {
    const target = path.join(dataDir, file);
    fs.mkdirSync(path.dirname(target), { recursive: true });
    fs.copyFileSync(path.join(staged.staging, file), target, fs.constants.COPYFILE_EXCL);
    fs.chmodSync(target, 0o444);
  }
}

async function main(): Promise<number> {
  let cluster: Awaited<ReturnType<typeof connectionOf>>['cluster'] = null;
  let staged: Awaited<ReturnType<typeof stagedFiles>> | null = null;
  try {
    const options = parseArguments(process.argv.slice(2));
    const manifest = await checkedManifest(options.folder);
    say(`backup of ${manifest.createdAt} checked: both parts match the manifest`);
    const dataDir = dataDirOf();
    staged = await stagedFiles(options.folder, dataDir);
    const connection = await connectionOf(dataDir);
    cluster = connection.cluster;
    const database = options.database ?? databaseOf(connection.url);
    const targetUrl = urlOfDatabase(connection.url, database);
    const superuser = await isSuperuser(connection.url);

    const tables = await tableCount(targetUrl);
    if (tables && !options.replace)
      throw new Refused(`database ${database} is not empty (${tables} tables); give --replace to drop and restore it`);
    if (tables && !superuser)
      throw new Refused('--replace needs a superuser connection (DATABASE_URL) to drop the database');

    let restoreUrl = targetUrl;
    if (superuser) {
      const passwords = rolePasswords(connection.secretsDir);
      const admin = new Client({ connectionString: urlOfDatabase(connection.url, 'postgres') });
      await admin.connect();
      try {
        await ensureRoles(admin, passwords);
      } finally {
        await admin.end();
      }
      if (tables) say(`dropping database ${database} (--replace)`);
      await ensureOwnedDatabase(connection.url, database, { fresh: Boolean(tables) });
      restoreUrl = urlAs(targetUrl, ownerRole, passwords.owner);
    } else if (tables === null) {
      throw new Refused(`database ${database} does not exist, and the connection may not create it`);
    }

    await runPgTool(
      'pg_restore',
      [
        '--no-owner',
        '--no-privileges',
        '--exit-on-error',
        '--single-transaction',
        `--dbname=${database}`,
        path.join(options.folder, dumpFile),
      ],
      restoreUrl,
    );
    const rows = await compareWithManifest(restoreUrl, manifest);
    say(
      `database ${database} restored at ${manifest.migrationLevel ?? '(no migrations)'}: ${rows} rows, every table as the manifest counts`,
    );

    const prepared = await prepareDatabase({ adminUrl: connection.url, database, secretsDir: connection.secretsDir });
    say(
      prepared.migrated.length > 0
        ? `migrations applied after the restore: ${prepared.migrated.join(', ')}`
        : 'no migrations pending; the app role has its rights again',
    );

    const check = new Client({ connectionString: restoreUrl });
    await check.connect();
    try {
      const report = await verifyAuditChain(check);
      if (!report.ok)
        throw new Error(`audit trail broken at event ${report.firstBreak?.eventId}: ${report.firstBreak?.problem}`);
      say(`audit trail whole: ${report.events} events`);
    } finally {
      await check.end();
    }

    writeFiles(staged, dataDir);
    say(
      `stored files under ${dataDir}: ${staged.toWrite.length} written, ${staged.present} already there with the same bytes`,
    );
    return 0;
  } catch (err) {
    say(
      `${err instanceof Refused ? 'restore refused' : 'restore failed'}: ${err instanceof Error ? err.message : String(err)}`,
    );
    return 1;
  } finally {
    if (staged) fs.rmSync(staged.staging, { recursive: true, force: true });
    if (cluster?.startedHere) cluster.stop();
  }
}

void main().then((code) => process.exit(code));
