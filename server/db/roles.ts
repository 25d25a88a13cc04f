import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Client, type ClientBase } from 'pg';

/**
 * The two database roles of Tallyrun (issue 9 §7).
 *
 * - `tallyrun_owner` owns the database, its schema objects and the functions; only migrations
 *   connect as it.
 * - `tallyrun_app` is what the server, the tests, the simulators and the CLIs connect as. It
 *   owns nothing, so it can neither drop nor disable a trigger, nor alter a table. It may read
 *   and write ordinary tables, but only read and append to the append-only ones (no UPDATE,
 *   DELETE or TRUNCATE privilege: the triggers are the second lock, the grants the first).
 *
 * Neither is a superuser, nor may create roles or databases. A superuser (the private cluster's
 * `postgres`, or the DATABASE_URL given) makes the roles and the databases; nothing else uses it.
 */
export const ownerRole = 'tallyrun_owner';
export const appRole = 'tallyrun_app';

/**
 * The role the server connects as: the app role. ('owner' was the step between, while the
 * readings writer still made partitions with CREATE TABLE.)
 */
export const serverConnectsAs: 'app' | 'owner' = 'app';

export interface RolePasswords {
  owner: string;
  app: string;
}

/** Reads a password kept in a file, making it (0600, exclusively, so two runs agree) when missing. */
function keptPassword(file: string): string {
  try {
    fs.writeFileSync(file, crypto.randomBytes(18).toString('base64url'), { mode: 0o600, flag: 'wx' });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
  }
  return fs.readFileSync(file, 'utf8').trim();
}

/** The roles' passwords, kept beside the cluster's own `pg-password` (`pg-owner-password`, `pg-app-password`). */
export function rolePasswords(secretsDir: string): RolePasswords {
  fs.mkdirSync(secretsDir, { recursive: true });
  return {
    owner: keptPassword(path.join(secretsDir, 'pg-owner-password')),
    app: keptPassword(path.join(secretsDir, 'pg-app-password')),
  };
}

/** The same server and database as `url`, signed in as another role. */
export function urlAs(url: string, role: string, password: string): string {
  const u = new URL(url);
  u.username = encodeURIComponent(role);
  u.password = encodeURIComponent(password);
  return u.toString();
}

/** The same server and role as `url`, another database. */
export function urlOfDatabase(url: string, database: string): string {
  const u = new URL(url);
  u.pathname = `/${database}`;
  return u.toString();
}

const quoteLiteral = (s: string) => `'${s.replace(/'/g, "''")}'`;

/**
 * Creates the two roles when missing and sets their passwords to the kept ones; run as a
 * superuser. Two bring-ups at once may both try to create a role: the loser's error is expected.
 */
export async function ensureRoles(admin: ClientBase, passwords: RolePasswords) {
  for (const [role, password] of [
    [ownerRole, passwords.owner],
    [appRole, passwords.app],
  ] as const) {
    const exists = await admin.query('SELECT 1 FROM pg_roles WHERE rolname = $1', [role]);
    if (!exists.rowCount) {
      await admin.query(`CREATE ROLE ${role} LOGIN`).catch((err: { code?: string }) => {
        // 42710 duplicate_object, 23505 unique_violation: another bring-up made it just now.
        if (err.code !== '42710' && err.code !== '23505') throw err;
      });
    }
    await admin.query(
      `ALTER ROLE ${role} LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION NOBYPASSRLS INHERIT
         PASSWORD ${quoteLiteral(password)}`,
    );
  }
}

/**
 * Creates the database owned by `tallyrun_owner` (with `fresh`, drops it first), or hands an
 * existing one over to it: a database made before the roles existed has every object owned by
 * the superuser, which the owner role could then not migrate. Run as a superuser on any database
 * of the server (`adminUrl`).
 */
export async function ensureOwnedDatabase(adminUrl: string, name: string, options: { fresh?: boolean } = {}) {
  const admin = new Client({ connectionString: urlOfDatabase(adminUrl, 'postgres') });
  await admin.connect();
  try {
    if (options.fresh) await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    const exists = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (exists.rowCount === 0) {
      await admin.query(`CREATE DATABASE "${name}" OWNER ${ownerRole}`);
    } else {
      await admin.query(`ALTER DATABASE "${name}" OWNER TO ${ownerRole}`);
    }
    // Only the two roles (and superusers) may connect; the app needs no temporary tables.
    await admin.query(`REVOKE ALL ON DATABASE "${name}" FROM PUBLIC`);
    await admin.query(`GRANT CONNECT ON DATABASE "${name}" TO ${appRole}`);
  } finally {
    await admin.end();
  }
  const db = new Client({ connectionString: urlOfDatabase(adminUrl, name) });
  await db.connect();
  try {
    await adoptObjects(db);
  } finally {
    await db.end();
  }
}

/**
 * Hands every object of schema public that someone else owns over to the owner role. Sequences
 * that belong to a column follow their table (ALTER TABLE carries them; altering them alone is
 * an error); indexes and row types follow their table too.
 */
async function adoptObjects(db: ClientBase) {
  await db.query(`
    DO $$
    DECLARE
      o record;
    BEGIN
      -- As PostgreSQL 15 makes it: the database's owner owns public, and nobody else may create in it.
      EXECUTE 'ALTER SCHEMA public OWNER TO pg_database_owner';
      EXECUTE 'REVOKE CREATE ON SCHEMA public FROM PUBLIC';
      FOR o IN
        SELECT c.oid::regclass AS name, c.relkind
          FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
         WHERE n.nspname = 'public' AND c.relkind IN ('r', 'p', 'v', 'm', 'f', 'S')
           AND c.relowner <> '${ownerRole}'::regrole
           AND NOT (c.relkind = 'S' AND EXISTS (
                 SELECT 1 FROM pg_depend d
                  WHERE d.classid = 'pg_class'::regclass AND d.objid = c.oid AND d.deptype IN ('a', 'i')))
      LOOP
        EXECUTE format('ALTER %s %s OWNER TO ${ownerRole}',
          CASE o.relkind WHEN 'v' THEN 'VIEW' WHEN 'm' THEN 'MATERIALIZED VIEW' WHEN 'S' THEN 'SEQUENCE'
                         WHEN 'f' THEN 'FOREIGN TABLE' ELSE 'TABLE' END, o.name);
      END LOOP;
      FOR o IN
        SELECT p.oid::regprocedure AS name, p.prokind
          FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
         WHERE n.nspname = 'public' AND p.proowner <> '${ownerRole}'::regrole
      LOOP
        EXECUTE format('ALTER %s %s OWNER TO ${ownerRole}',
          CASE o.prokind WHEN 'p' THEN 'PROCEDURE' WHEN 'a' THEN 'AGGREGATE' ELSE 'FUNCTION' END, o.name);
      END LOOP;
      FOR o IN
        SELECT t.oid::regtype AS name
          FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
         WHERE n.nspname = 'public' AND t.typowner <> '${ownerRole}'::regrole
           AND t.typtype IN ('e', 'd', 'r', 'm')
      LOOP
        EXECUTE format('ALTER TYPE %s OWNER TO ${ownerRole}', o.name);
      END LOOP;
    END $$;
  `);
}

/**
 * The app role's privileges, applied by the owner after every migration run, so tables that
 * later migrations add are covered without this code knowing them:
 * - SELECT, INSERT, UPDATE, DELETE on every table, USAGE and SELECT on every sequence, now and
 *   (default privileges) for whatever the owner makes later, readings partitions included;
 * - then, on every append-only table, UPDATE, DELETE and TRUNCATE taken back. A table is
 *   append-only when it has a trigger named `…_append_only` (the convention of migrations
 *   0004–0008). A table whose trigger allows some updates (corrections: decided once) keeps
 *   UPDATE and leaves the rule to its trigger;
 * - TRUNCATE on no table at all;
 * - `schema_migrations` read-only: only the owner migrates.
 * No CREATE on the schema: the app makes no objects (readings partitions come from the owner's
 * `ensure_readings_partition`, migration 0010).
 *
 * Does nothing when the app role does not exist, or when the connection is neither the owner nor
 * a superuser (one role for everything: a DATABASE_URL that is no superuser).
 */
export async function applyGrants(db: ClientBase) {
  const roles = await db.query<{ ready: boolean }>(
    `SELECT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = $1)
        AND (current_user = $2 OR (SELECT rolsuper FROM pg_roles WHERE rolname = current_user)) AS ready`,
    [appRole, ownerRole],
  );
  if (!roles.rows[0].ready) return;
  await db.query(`
    DO $$
    DECLARE
      t record;
    BEGIN
      GRANT USAGE ON SCHEMA public TO ${appRole};
      GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${appRole};
      GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO ${appRole};
      ALTER DEFAULT PRIVILEGES FOR ROLE ${ownerRole} IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${appRole};
      ALTER DEFAULT PRIVILEGES FOR ROLE ${ownerRole} IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO ${appRole};
      FOR t IN
        SELECT DISTINCT c.oid::regclass AS name
          FROM pg_trigger g JOIN pg_class c ON c.oid = g.tgrelid JOIN pg_namespace n ON n.oid = c.relnamespace
         WHERE n.nspname = 'public' AND NOT g.tgisinternal
           AND g.tgname LIKE '%\\_append\\_only'
      LOOP
        EXECUTE format('REVOKE UPDATE, DELETE, TRUNCATE ON %s FROM ${appRole}', t.name);
      END LOOP;
      IF to_regprocedure('public.ensure_readings_partition(timestamptz)') IS NOT NULL THEN
        GRANT EXECUTE ON FUNCTION ensure_readings_partition(timestamptz) TO ${appRole};
      END IF;
      IF to_regclass('public.schema_migrations') IS NOT NULL THEN
        REVOKE INSERT, UPDATE, DELETE, TRUNCATE ON schema_migrations FROM ${appRole};
      END IF;
    END $$;
  `);
}

/**
 * Whether the connection may migrate and grant: the owner role, a superuser, or (one role for
 * everything, with a DATABASE_URL that is no superuser) the role that owns the database.
 */
export async function canMigrate(db: ClientBase): Promise<boolean> {
  const { rows } = await db.query<{ allowed: boolean }>(
    `SELECT current_user = $1 OR r.rolsuper OR d.datdba = r.oid AS allowed
       FROM pg_roles r, pg_database d WHERE r.rolname = current_user AND d.datname = current_database()`,
    [ownerRole],
  );
  return rows[0]?.allowed === true;
}
