import crypto from 'node:crypto';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { Client } from 'pg';
import { connectDatabase } from './db/connect';
import { migrate } from './db/migrate';
import { verifyAuditChain } from './audit-chain';

/**
 * The audit trail on a database of its own (made and dropped here), because these tests tamper
 * with it as a superuser would, and a broken chain must not leak into other test files.
 */
const root = path.resolve(__dirname, '..');
const name = `tallyrun_audit_${process.pid}_${crypto.randomBytes(3).toString('hex')}`;
const urlOf = (database: string) => {
  const url = new URL(process.env.TEST_DATABASE_URL ?? '');
  url.pathname = `/${database}`;
  return url.toString();
};
let admin: Client;
let db: Client;

beforeAll(async () => {
  if (!process.env.TEST_DATABASE_URL) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`.');
  admin = new Client({ connectionString: urlOf('postgres') });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name}`);
  const sequelize = connectDatabase(urlOf(name));
  await migrate(sequelize, urlOf(name));
  await sequelize.close();
  db = new Client({ connectionString: urlOf(name) });
  await db.connect();
  // Twelve events: past nine, so an order by text (1, 10, 11, 2 …) instead of by number would show.
  for (let i = 1; i <= 12; i++) {
    await db.query(
      `INSERT INTO audit_events (actor_email, action, entity_type, entity_id, before, after, reason)
       VALUES ('engineer@test.tallyrun', 'site.update', 'site', '7', $1, $2, $3)`,
      [{ name: `Site ${i - 1}` }, { name: `Site ${i}` }, i === 3 ? 'Renamed after the station survey' : null],
    );
  }
}, 60_000);

afterAll(async () => {
  await db?.end();
  await admin?.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await admin?.end();
});

/** A superuser's way around the append-only triggers: replica mode skips ordinary triggers. */
async function asSuperuserBypassingTriggers(sql: string, params: unknown[] = []) {
  await db.query('SET session_replication_role = replica');
  try {
    await db.query(sql, params);
  } finally {
    await db.query('SET session_replication_role = DEFAULT');
  }
}

function auditVerify() {
  const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
  return spawnSync(tsx, ['server/cli/audit-verify.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: urlOf(name) },
    encoding: 'utf8',
    timeout: 60_000,
  });
}

describe('the audit trail', () => {
  it('chains each event to the one before by the hash of its canonical text (SHA-256, FIPS 180-4)', async () => {
    const { rows } = await db.query<{
      chain_seq: string;
      previous_hash: string | null;
      hash: string;
      canonical: string;
    }>(
      `SELECT chain_seq::text, previous_hash, hash,
              jsonb_build_array(chain_seq, id, to_char(occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"'),
                actor_id, actor_email, action, entity_type, entity_id, before, after, reason, previous_hash)::text AS canonical
         FROM audit_events ORDER BY audit_events.chain_seq`,
    );
    expect(rows.map((r) => Number(r.chain_seq))).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(rows[0].previous_hash).toBeNull();
    for (let i = 1; i < rows.length; i++) expect(rows[i].previous_hash).toBe(rows[i - 1].hash);
    // Node's SHA-256 (OpenSSL), not the database's, recomputes each stored hash.
    for (const r of rows) expect(crypto.createHash('sha256').update(r.canonical).digest('hex')).toBe(r.hash);
  });

  it('refuses UPDATE, DELETE and TRUNCATE through an ordinary connection', async () => {
    await expect(db.query("UPDATE audit_events SET action = 'nothing' WHERE chain_seq = 1")).rejects.toThrow(
      /append-only: UPDATE refused/,
    );
    await expect(db.query('DELETE FROM audit_events WHERE chain_seq = 1')).rejects.toThrow(
      /append-only: DELETE refused/,
    );
    await expect(db.query('TRUNCATE audit_events')).rejects.toThrow(/append-only: TRUNCATE refused/);
  });

  it('is found whole by the verifier and by `npm run --silent audit-verify` (exit 0)', async () => {
    expect(await verifyAuditChain(db)).toEqual(expect.objectContaining({ ok: true, events: 12, firstBreak: null }));
    const run = auditVerify();
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^audit trail whole: 12 events; newest hash [0-9a-f]{64}$/m);
  });

  it('names the event a superuser edited, and is whole again once the edit is undone', async () => {
    const [third] = (
      await db.query<{ id: string; after: unknown }>('SELECT id::text, after FROM audit_events WHERE chain_seq = 3')
    ).rows;
    await asSuperuserBypassingTriggers('UPDATE audit_events SET after = $1 WHERE chain_seq = 3', [{ name: 'Forged' }]);
    const report = await verifyAuditChain(db);
    expect(report.firstBreak).toEqual({
      chainSeq: 3,
      eventId: third.id,
      problem: expect.stringMatching(/was changed/),
    });
    const run = auditVerify();
    expect(run.status).toBe(1);
    expect(run.stdout).toContain(`audit trail broken at event ${third.id} (place 3)`);

    await asSuperuserBypassingTriggers('UPDATE audit_events SET after = $1 WHERE chain_seq = 3', [third.after]);
    expect((await verifyAuditChain(db)).ok).toBe(true);
  });

  it('names the event after one a superuser deleted', async () => {
    const [fourth] = (await db.query<{ id: string }>('SELECT id::text FROM audit_events WHERE chain_seq = 4')).rows;
    await asSuperuserBypassingTriggers('DELETE FROM audit_events WHERE chain_seq = 3');
    const report = await verifyAuditChain(db);
    expect(report).toEqual(
      expect.objectContaining({
        ok: false,
        events: 2,
        firstBreak: expect.objectContaining({ chainSeq: 4, eventId: fourth.id }),
      }),
    );
    expect(report.firstBreak?.problem).toMatch(/1 event\(s\) before it were removed/);
    const run = auditVerify();
    expect(run.status).toBe(1);
    expect(run.stdout).toContain(`audit trail broken at event ${fourth.id} (place 4)`);
  });
});
