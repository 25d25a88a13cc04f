import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import { connectDatabase } from '../db/connect';
import { migrate } from '../db/migrate';
import { dropDatabase } from './postgres';
import { ensureOwnedDatabase, urlOfDatabase } from '../db/roles';
import { testApp } from '../test-support/app';
import { alarmFixture, repeat } from '../alarms/alarm-test-fixture';

/**
 * `npm run backup` and `npm run restore` (issue 12), run as the commands they are against
 * databases of their own on the test cluster: a database with history (a meter run, readings,
 * hourly records recomputed by an approved correction, audit events) is backed up, restored into
 * a fresh database, and compared row for row, table by table; the app role's rights, the audit
 * trail and the stored files come back too. Tampered and non-empty targets are refused.
 */
const root = path.resolve(__dirname, '..', '..');
const adminUrl = process.env.TEST_ADMIN_DATABASE_URL!;
const ownerUrl = process.env.TEST_OWNER_DATABASE_URL!;
const appUrl = process.env.TEST_APP_DATABASE_URL!;
const tag = `${process.pid}_${crypto.randomBytes(3).toString('hex')}`;
const source = `tallyrun_backup_src_${tag}`;
const target = `tallyrun_backup_dst_${tag}`;
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-backup-'));
const sourceData = path.join(work, 'source-data');
const targetData = path.join(work, 'target-data');
const dayMs = 86_400_000;
const hourMs = 3_600_000;
const DAY = Math.floor(Date.now() / dayMs) * dayMs - 3 * dayMs;

/** Runs a CLI of server/cli with tsx, as `npm run` does. */
function cli(name: string, args: string[], env: Record<string, string>) {
  return new Promise<{ code: number | null; out: string }>((resolve, reject) => {
    const child = spawn(
      path.join(root, 'node_modules', '.bin', 'tsx'),
      [path.join(root, 'server', 'cli', name), ...args],
      {
        cwd: root,
        env: { ...process.env, ...env },
        stdio: ['ignore', 'pipe', 'pipe'],
      },
    );
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    child.stderr.on('data', (c: Buffer) => (out += c.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, out }));
  });
}

async function withClient<T>(url: string, work2: (c: Client) => Promise<T>): Promise<T> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    return await work2(client);
  } finally {
    await client.end();
  }
}

/** Every table of schema public with its rows' text in a fixed order: the whole content, compared exactly. */
const contents = (url: string) =>
  withClient(url, async (c) => {
    const tables = await c.query<{ name: string }>(
      `SELECT c.relname AS name FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
        WHERE n.nspname = 'public' AND c.relkind IN ('r', 'p') AND NOT c.relispartition ORDER BY 1`,
    );
    const out: Record<string, { rows: number; digest: string }> = {};
    for (const { name } of tables.rows) {
      const res = await c.query<{ rows: string; digest: string | null }>(
        `SELECT count(*)::text AS rows, md5(string_agg(t::text, E'\\n' ORDER BY t::text)) AS digest FROM "${name}" t`,
      );
      out[name] = { rows: Number(res.rows[0].rows), digest: res.rows[0].digest ?? '' };
    }
    return out;
  });

const sequences = (url: string) =>
  withClient(url, async (c) => (await c.query('SELECT sequencename, last_value FROM pg_sequences ORDER BY 1')).rows);

const appGrants = (url: string) =>
  withClient(
    url,
    async (c) =>
      (
        await c.query(
          `SELECT table_name, privilege_type FROM information_schema.role_table_grants
            WHERE grantee = 'tallyrun_app' AND table_schema = 'public' ORDER BY 1, 2`,
        )
      ).rows,
  );

let backupFolder = '';
const certificate = Buffer.from('%PDF-1.4\n% a certificate kept with a record\n%%EOF\n');
const original = 'time,tag,value\n2026-10-10T00:00:00Z,DP,20\n';

beforeAll(async () => {
  // The source database, owned and migrated as npm start makes it, used through the app role.
  await ensureOwnedDatabase(adminUrl, source, { fresh: true });
  const owner = connectDatabase(urlOfDatabase(ownerUrl, source));
  await migrate(owner, urlOfDatabase(ownerUrl, source));
  await owner.close();
  const jestDatabase = process.env.TEST_DATABASE_URL;
  process.env.TEST_DATABASE_URL = urlOfDatabase(appUrl, source);
  const t = await testApp();
  process.env.TEST_DATABASE_URL = jestDatabase;
  try {
    const engineer = await t.signedIn('engineer');
    const admin = await t.signedIn('admin');
    const f = await alarmFixture(t, engineer.token);
    await f.writeMinutes(DAY, repeat(3 * 60, 0.4));
    await t.services.history.settle(60_000);
    const proposed = await t
      .http()
      .post('/api/corrections')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send({
        meterRunId: f.meterRunId,
        start: new Date(DAY).toISOString(),
        end: new Date(DAY + 2 * hourMs).toISOString(),
        kind: 'adjust',
        factor: 1.02,
        reason: 'plate found worn at the inspection',
      });
    expect(proposed.status).toBe(201);
    const approved = await t
      .http()
      .post(`/api/corrections/${proposed.body.id}/approve`)
      .set('Authorization', `Bearer ${admin.token}`)
      .send({ reason: 'checked against the inspection report' });
    expect(approved.status).toBe(200);
    await t.services.history.settle(60_000);
  } finally {
    await t.close();
  }
  const sha = crypto.createHash('sha256').update(certificate).digest('hex');
  fs.mkdirSync(path.join(sourceData, 'certificates', '2026', '10'), { recursive: true });
  fs.writeFileSync(path.join(sourceData, 'certificates', '2026', '10', `${sha}.pdf`), certificate);
  fs.mkdirSync(path.join(sourceData, 'originals', '2026', '10'), { recursive: true });
  fs.writeFileSync(path.join(sourceData, 'originals', '2026', '10', '1-abc.csv'), original);

  const backup = await cli('backup.ts', ['--out', path.join(work, 'backups')], {
    DATABASE_URL: urlOfDatabase(ownerUrl, source),
    TALLYRUN_DATA_DIR: sourceData,
  });
  expect(backup.out).toContain('backup written');
  expect(backup.code).toBe(0);
  backupFolder = /backup written: (.+)/.exec(backup.out)![1].trim();
}, 120_000);

afterAll(async () => {
  await dropDatabase(urlOfDatabase(adminUrl, 'postgres'), source);
  await dropDatabase(urlOfDatabase(adminUrl, 'postgres'), target);
  fs.rmSync(work, { recursive: true, force: true });
});

describe('npm run backup', () => {
  it('writes one folder named by the time with the dump, the files and a manifest of hashes, migration level and rows', () => {
    expect(path.basename(backupFolder)).toMatch(/^tallyrun-backup-\d{8}T\d{6}Z$/);
    expect(fs.readdirSync(backupFolder).sort()).toEqual(['database.dump', 'files.tar', 'manifest.json']);
    const manifest = JSON.parse(fs.readFileSync(path.join(backupFolder, 'manifest.json'), 'utf8'));
    for (const part of manifest.parts) {
      const bytes = fs.readFileSync(path.join(backupFolder, part.file));
      expect(crypto.createHash('sha256').update(bytes).digest('hex')).toBe(part.sha256);
    }
    // The source ran every migration, so its level is the newest migration file.
    const newest = fs
      .readdirSync(path.join(__dirname, '..', 'migrations'))
      .filter((f) => /^\d{4}-.*\.ts$/.test(f))
      .sort()
      .at(-1)!
      .replace(/\.ts$/, '');
    expect(manifest.migrationLevel).toBe(newest);
    expect(manifest.rowCounts.audit_events).toBeGreaterThan(0);
    expect(manifest.rowCounts.corrections).toBe(1);
    expect(manifest.postgresVersion).toMatch(/^15\./);
  });
});

describe('npm run restore', () => {
  it('refuses a backup whose part does not match its hash, before touching any database', async () => {
    const tampered = path.join(work, 'tampered');
    fs.cpSync(backupFolder, tampered, { recursive: true });
    fs.appendFileSync(path.join(tampered, 'database.dump'), 'x');
    const res = await cli('restore.ts', [tampered, '--database', target], {
      DATABASE_URL: adminUrl,
      TALLYRUN_DATA_DIR: targetData,
    });
    expect(res.code).toBe(1);
    expect(res.out).toMatch(/restore refused: part database\.dump does not match the manifest/);
    const exists = await withClient(adminUrl, (c) => c.query('SELECT 1 FROM pg_database WHERE datname = $1', [target]));
    expect(exists.rowCount).toBe(0);
  });

  it('brings back every table row for row, the sequences, the app role rights, the audit trail and the files', async () => {
    await ensureOwnedDatabase(adminUrl, target, { fresh: true });
    const res = await cli('restore.ts', [backupFolder], {
      DATABASE_URL: urlOfDatabase(ownerUrl, target),
      TALLYRUN_DATA_DIR: targetData,
    });
    expect(res.out).toContain('audit trail whole');
    expect(res.code).toBe(0);

    const before = await contents(urlOfDatabase(ownerUrl, source));
    const after = await contents(urlOfDatabase(ownerUrl, target));
    expect(after).toEqual(before);
    // The history the comparison covers: totals, record versions, corrections and audit events.
    expect(before.hourly_records.rows).toBeGreaterThanOrEqual(3);
    expect(before.hourly_record_versions.rows).toBeGreaterThan(0);
    expect(before.corrections.rows).toBe(1);
    expect(before.audit_events.rows).toBeGreaterThan(5);
    expect(await sequences(urlOfDatabase(ownerUrl, target))).toEqual(await sequences(urlOfDatabase(ownerUrl, source)));

    const grants = await appGrants(urlOfDatabase(ownerUrl, target));
    expect(grants.length).toBeGreaterThan(0);
    expect(grants).toEqual(await appGrants(urlOfDatabase(ownerUrl, source)));
    await expect(
      withClient(urlOfDatabase(appUrl, target), (c) => c.query('UPDATE audit_events SET action = action')),
    ).rejects.toMatchObject({ code: '42501' });

    const verify = await cli('audit-verify.ts', [], { DATABASE_URL: urlOfDatabase(appUrl, target) });
    expect(verify.out).toContain('audit trail whole');
    expect(verify.code).toBe(0);

    for (const file of ['certificates/2026/10', 'originals/2026/10/1-abc.csv']) {
      const from = path.join(sourceData, file);
      const kept = fs.statSync(from).isDirectory() ? path.join(file, fs.readdirSync(from)[0]) : file;
      expect(fs.readFileSync(path.join(targetData, kept))).toEqual(fs.readFileSync(path.join(sourceData, kept)));
    }
  });

  it('refuses to restore over a database that is not empty unless told to replace it', async () => {
    const res = await cli('restore.ts', [backupFolder, '--database', target], {
      DATABASE_URL: adminUrl,
      TALLYRUN_DATA_DIR: targetData,
    });
    expect(res.code).toBe(1);
    expect(res.out).toMatch(new RegExp(`restore refused: database ${target} is not empty`));
  });

  it('refuses stored files that would replace other bytes under the same name', async () => {
    const clash = path.join(work, 'clash-data');
    fs.mkdirSync(path.join(clash, 'originals', '2026', '10'), { recursive: true });
    fs.writeFileSync(path.join(clash, 'originals', '2026', '10', '1-abc.csv'), 'other bytes\n');
    const res = await cli('restore.ts', [backupFolder, '--database', `${target}_x`], {
      DATABASE_URL: adminUrl,
      TALLYRUN_DATA_DIR: clash,
    });
    expect(res.code).toBe(1);
    expect(res.out).toContain('hold other bytes than the backup');
    expect(fs.readFileSync(path.join(clash, 'originals', '2026', '10', '1-abc.csv'), 'utf8')).toBe('other bytes\n');
  });
});
