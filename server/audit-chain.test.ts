import crypto from 'node:crypto';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { Client } from 'pg';
import { connectDatabase } from './db/connect';
import { migrate } from './db/migrate';
import { applyGrants, appRole, ensureOwnedDatabase, ownerRole, urlOfDatabase } from './db/roles';
import { verifyAuditChain } from './audit-chain';

/**
 * The audit trail on a database of its own (made and dropped here), because these tests tamper
 * with it as a superuser would, and a broken chain must not leak into other test files. It is
 * made as `npm test` makes every database: owned by tallyrun_owner and migrated as it; the events
 * are written and the refusals tried through the application's role, tallyrun_app
 * (server/db/roles.ts).
 */
const root = path.resolve(__dirname, '..');
const name = `tallyrun_audit_${process.pid}_${crypto.randomBytes(3).toString('hex')}`;
const env = (key: string) => {
  const value = process.env[key];
  if (!value) throw new Error(`${key} is not set: run the tests with \`npm test\`.`);
  return value;
};
let admin: Client;
/** The application's connection (tallyrun_app). */
let db: Client;
/** The owner's connection (tallyrun_owner): what migrations use. */
let owner: Client;
/** A superuser's connection to the same database: what tampering would use. */
let superuser: Client;
let appUrl: string;

beforeAll(async () => {
  const adminUrl = env('TEST_ADMIN_DATABASE_URL');
  const ownerUrl = urlOfDatabase(env('TEST_OWNER_DATABASE_URL'), name);
  appUrl = urlOfDatabase(env('TEST_APP_DATABASE_URL'), name);
  admin = new Client({ connectionString: adminUrl });
  await admin.connect();
  await ensureOwnedDatabase(adminUrl, name);
  const sequelize = connectDatabase(ownerUrl);
  await migrate(sequelize, ownerUrl);
  await sequelize.close();
  db = new Client({ connectionString: appUrl });
  owner = new Client({ connectionString: ownerUrl });
  superuser = new Client({ connectionString: urlOfDatabase(adminUrl, name) });
  await Promise.all([db.connect(), owner.connect(), superuser.connect()]);
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
  await Promise.all([db?.end(), owner?.end(), superuser?.end()]);
  await admin?.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await admin?.end();
});

/** A superuser's way around the append-only triggers: replica mode skips ordinary triggers. */
async function asSuperuserBypassingTriggers(sql: string, params: unknown[] = []) {
  await superuser.query('SET session_replication_role = replica');
  try {
    await superuser.query(sql, params);
  } finally {
    await superuser.query('SET session_replication_role = DEFAULT');
  }
}

function auditVerify() {
  const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
  return spawnSync(tsx, ['server/cli/audit-verify.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: appUrl },
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

  it("refuses UPDATE, DELETE and TRUNCATE through the application's connection (no such privilege)", async () => {
    await expect(db.query("UPDATE audit_events SET action = 'nothing' WHERE chain_seq = 1")).rejects.toThrow(
      /permission denied for table audit_events/,
    );
    await expect(db.query('DELETE FROM audit_events WHERE chain_seq = 1')).rejects.toThrow(
      /permission denied for table audit_events/,
    );
    await expect(db.query('TRUNCATE audit_events')).rejects.toThrow(/permission denied for table audit_events/);
  });

  it('refuses them by trigger even to the owner, who holds the privileges', async () => {
    await expect(owner.query("UPDATE audit_events SET action = 'nothing' WHERE chain_seq = 1")).rejects.toThrow(
      /append-only: UPDATE refused/,
    );
    await expect(owner.query('DELETE FROM audit_events WHERE chain_seq = 1')).rejects.toThrow(
      /append-only: DELETE refused/,
    );
    await expect(owner.query('TRUNCATE audit_events')).rejects.toThrow(/append-only: TRUNCATE refused/);
  });

  it("lets the application's connection neither drop nor disable nor replace the triggers", async () => {
    const refusals: [string, RegExp][] = [
      ['DROP TRIGGER audit_events_append_only ON audit_events', /must be owner of (table|relation) audit_events/],
      ['ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only', /must be owner of table audit_events/],
      ['ALTER TABLE audit_events DISABLE TRIGGER ALL', /must be owner of table audit_events/],
      ['DROP FUNCTION audit_events_refuse_change()', /must be owner of function audit_events_refuse_change/],
      [
        `CREATE OR REPLACE FUNCTION audit_events_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RETURN NEW; END $$`,
        /permission denied for schema public/,
      ],
      ['SET session_replication_role = replica', /permission denied to set parameter "session_replication_role"/],
      ['DROP TABLE audit_events', /must be owner of table audit_events/],
      ['CREATE TABLE audit_events_copy (id bigint)', /permission denied for schema public/],
    ];
    for (const [sql, refusal] of refusals) await expect(db.query(sql)).rejects.toThrow(refusal);
    const triggers = await superuser.query<{ tgname: string; tgenabled: string }>(
      `SELECT tgname, tgenabled FROM pg_trigger WHERE tgrelid = 'audit_events'::regclass AND NOT tgisinternal ORDER BY tgname`,
    );
    expect(triggers.rows).toEqual([
      { tgname: 'audit_events_append_only', tgenabled: 'O' },
      { tgname: 'audit_events_chain', tgenabled: 'O' },
      { tgname: 'audit_events_no_truncate', tgenabled: 'O' },
    ]);
  });

  it('connects as a role that is no superuser and owns nothing, while the owner role owns every table', async () => {
    const me = await db.query<{ user: string; rolsuper: boolean; rolcreaterole: boolean; rolcreatedb: boolean }>(
      `SELECT current_user AS user, rolsuper, rolcreaterole, rolcreatedb FROM pg_roles WHERE rolname = current_user`,
    );
    expect(me.rows).toEqual([{ user: appRole, rolsuper: false, rolcreaterole: false, rolcreatedb: false }]);
    const owners = await db.query<{ owner: string }>(
      `SELECT DISTINCT pg_get_userbyid(relowner) AS owner FROM pg_class
        WHERE relnamespace = 'public'::regnamespace AND relkind IN ('r', 'p', 'S', 'v', 'm')`,
    );
    expect(owners.rows).toEqual([{ owner: ownerRole }]);
  });

  it('covers tables that later migrations add: ordinary ones writable, append-only ones only appended to', async () => {
    // What a later migration would do, as the owner; then the grants every migration run ends with.
    await owner.query(`
      CREATE TABLE later_notes (id bigserial PRIMARY KEY, note text NOT NULL);
      CREATE TABLE later_log (id bigserial PRIMARY KEY, entry text NOT NULL);
      CREATE FUNCTION later_log_refuse() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN RAISE EXCEPTION 'later_log is append-only: % refused', TG_OP; END $$;
      CREATE TRIGGER later_log_append_only BEFORE UPDATE OR DELETE ON later_log
        FOR EACH ROW EXECUTE FUNCTION later_log_refuse();
    `);
    await applyGrants(owner);
    await db.query(`INSERT INTO later_notes (note) VALUES ('first')`);
    await db.query(`UPDATE later_notes SET note = 'second'`);
    await db.query(`DELETE FROM later_notes`);
    await db.query(`INSERT INTO later_log (entry) VALUES ('kept')`);
    expect((await db.query('SELECT entry FROM later_log')).rows).toEqual([{ entry: 'kept' }]);
    await expect(db.query(`UPDATE later_log SET entry = 'changed'`)).rejects.toThrow(/permission denied/);
    await expect(db.query('DELETE FROM later_log')).rejects.toThrow(/permission denied/);
    await expect(db.query('TRUNCATE later_notes')).rejects.toThrow(/permission denied/);
  });

  it("makes a month's readings partition for the application through the owner's function only", async () => {
    await db.query(`SET TimeZone = 'UTC'`); // how the bounds below are printed
    const made = await db.query<{ name: string }>(`SELECT ensure_readings_partition('2031-05-17T08:00:00Z') AS name`);
    expect(made.rows).toEqual([{ name: 'readings_y2031m05' }]);
    const again = await db.query<{ name: string }>(`SELECT ensure_readings_partition('2031-05-01T00:00:00Z') AS name`);
    expect(again.rows).toEqual([{ name: 'readings_y2031m05' }]);
    const partition = await db.query<{ bound: string; owner: string; insert: boolean }>(
      `SELECT pg_get_expr(c.relpartbound, c.oid) AS bound, pg_get_userbyid(c.relowner) AS owner,
              has_table_privilege($1, c.oid, 'INSERT') AS insert
         FROM pg_class c WHERE c.relname = 'readings_y2031m05'`,
      [appRole],
    );
    expect(partition.rows).toEqual([
      {
        bound: "FOR VALUES FROM ('2031-05-01 00:00:00+00') TO ('2031-06-01 00:00:00+00')",
        owner: ownerRole,
        insert: true,
      },
    ]);
    await expect(db.query('CREATE TABLE readings_y2031m06 (LIKE readings)')).rejects.toThrow(
      /permission denied for schema public/,
    );
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
