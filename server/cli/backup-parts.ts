/**
 * What `npm run backup` and `npm run restore` share: the manifest of a backup folder, hashing,
 * the database connection they work on, and running Debian's PostgreSQL 15 client programs.
 */
import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { ClientBase } from 'pg';
import { ensureCluster, type Cluster } from './postgres';

export const root = path.resolve(__dirname, '..', '..');
export const binDir = '/usr/lib/postgresql/15/bin';

/** The parts of a backup folder, by file name. */
export const dumpFile = 'database.dump';
export const filesTar = 'files.tar';
export const manifestFile = 'manifest.json';
/** The folders of the data folder that hold records' files (imports' originals, certificates). */
export const storedFolders = ['originals', 'certificates'] as const;

export interface BackupPart {
  file: string;
  sha256: string;
  sizeBytes: number;
}

export interface BackupManifest {
  kind: 'tallyrun-backup';
  formatVersion: 1;
  createdAt: string;
  database: string;
  postgresVersion: string;
  /** The newest migration applied, and every applied one in order. */
  migrationLevel: string | null;
  migrations: string[];
  parts: BackupPart[];
  /** Rows per table of schema public (a partitioned table counts its partitions' rows). */
  rowCounts: Record<string, number>;
}

export async function sha256OfFile(file: string): Promise<string> {
  const hash = crypto.createHash('sha256');
  await pipeline(fs.createReadStream(file, { highWaterMark: 1 << 20 }), hash);
  return hash.digest('hex');
}

export async function describePart(folder: string, file: string): Promise<BackupPart> {
  const full = path.join(folder, file);
  return { file, sha256: await sha256OfFile(full), sizeBytes: fs.statSync(full).size };
}

/** Row counts of every table of schema public, read in the caller's transaction (its snapshot). */
export async function rowCounts(db: ClientBase): Promise<Record<string, number>> {
  const tables = await db.query<{ name: string }>(
    `SELECT c.relname AS name FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
      WHERE n.nspname = 'public' AND c.relkind IN ('r', 'p') AND NOT c.relispartition ORDER BY c.relname`,
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables.rows) {
    const res = await db.query<{ n: string }>(`SELECT count(*)::text AS n FROM public."${name.replace(/"/g, '""')}"`);
    counts[name] = Number(res.rows[0].n);
  }
  return counts;
}

/** The applied migrations in the order they were applied (none when the table is missing). */
export async function appliedMigrations(db: ClientBase): Promise<string[]> {
  const found = await db.query<{ t: string | null }>("SELECT to_regclass('public.schema_migrations')::text AS t");
  if (!found.rows[0].t) return [];
  const res = await db.query<{ name: string }>('SELECT name FROM schema_migrations ORDER BY name');
  return res.rows.map((r) => r.name);
}

/**
 * The connection to work with: DATABASE_URL when set, otherwise the project's own cluster
 * (as `npm start` makes it) signed in as its superuser. `secretsDir` is where the roles'
 * passwords are kept (server/db/roles.ts).
 */
export async function connectionOf(
  dataDir: string,
): Promise<{ url: string; secretsDir: string; cluster: Cluster | null }> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, secretsDir: dataDir, cluster: null };
  const cluster = await ensureCluster({ dataDir, port: Number(process.env.TALLYRUN_PG_PORT ?? 54329), log: () => {} });
  return { url: cluster.url('tallyrun'), secretsDir: cluster.secretsDir, cluster };
}

export const databaseOf = (url: string) => decodeURIComponent(new URL(url).pathname.slice(1)) || 'tallyrun';

/**
 * Runs a PostgreSQL client program against `url`. The password goes in the environment, never
 * on the command line (where `ps` would show it).
 */
export function runPgTool(program: string, args: string[], url: string): Promise<void> {
  const u = new URL(url);
  const env = {
    ...process.env,
    PGHOST: u.hostname,
    PGPORT: u.port || '5432',
    PGUSER: decodeURIComponent(u.username),
    PGPASSWORD: decodeURIComponent(u.password),
    PGDATABASE: databaseOf(url),
  };
  return new Promise((resolve, reject) => {
    const child = spawn(path.join(binDir, program), args, { env, stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code) =>
      code === 0 ? resolve() : reject(new Error(`${program} failed (exit ${code}): ${stderr.trim()}`)),
    );
  });
}

/** Runs GNU tar; rejects with its message. */
export function runTar(args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn('tar', args, { stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code) =>
      code === 0 ? resolve() : reject(new Error(`tar failed (exit ${code}): ${stderr.trim()}`)),
    );
  });
}

export function dataDirOf(): string {
  return path.resolve(process.env.TALLYRUN_DATA_DIR ?? path.join(root, '.tallyrun'));
}
