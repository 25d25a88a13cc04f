import { Client } from 'pg';
import { connectDatabase } from './connect';
import { migrate } from './migrate';
import {
  appRole,
  ensureOwnedDatabase,
  ensureRoles,
  ownerRole,
  rolePasswords,
  serverConnectsAs,
  urlAs,
  urlOfDatabase,
} from './roles';

export interface PreparedDatabase {
  /** As `tallyrun_owner`: migrations only. */
  ownerUrl: string;
  /** As `tallyrun_app`: the tests of the app's rights, the simulators and the CLIs. */
  appUrl: string;
  /** What the server (and TEST_DATABASE_URL) connects with: see `serverConnectsAs` in roles.ts. */
  serverUrl: string;
  /** False when the given connection was no superuser: then one role does everything, as before. */
  separateRoles: boolean;
  /** The migrations this run applied. */
  migrated: string[];
}

async function migrateAs(url: string): Promise<string[]> {
  const sequelize = connectDatabase(url);
  try {
    return await migrate(sequelize, url);
  } finally {
    await sequelize.close();
  }
}

/**
 * Everything a database needs before the server connects, done with a superuser's connection
 * (`adminUrl`: the private cluster's `postgres`, or the DATABASE_URL given): the two roles
 * (passwords kept in `secretsDir`), the database owned by `tallyrun_owner` (with `fresh`, made
 * anew), the migrations run as the owner, and the app role's grants. One bring-up at a time per
 * server (advisory lock), since roles and database settings are shared by every run.
 *
 * A connection that is no superuser cannot make roles: the database is then made (when missing)
 * and migrated with that connection, which the server goes on using, as before the roles.
 */
export async function prepareDatabase(options: {
  adminUrl: string;
  database: string;
  secretsDir: string;
  fresh?: boolean;
}): Promise<PreparedDatabase> {
  const url = urlOfDatabase(options.adminUrl, options.database);
  const admin = new Client({ connectionString: urlOfDatabase(options.adminUrl, 'postgres') });
  await admin.connect();
  let superuser: boolean;
  let passwords: ReturnType<typeof rolePasswords> | null = null;
  try {
    const me = await admin.query<{ rolsuper: boolean }>('SELECT rolsuper FROM pg_roles WHERE rolname = current_user');
    superuser = me.rows[0]?.rolsuper === true;
    const lockKey = 7_200_418; // arbitrary, fixed: Tallyrun's role and database set-up
    await admin.query('SELECT pg_advisory_lock($1)', [lockKey]);
    if (superuser) {
      passwords = rolePasswords(options.secretsDir);
      await ensureRoles(admin, passwords);
      await ensureOwnedDatabase(options.adminUrl, options.database, { fresh: options.fresh });
    } else {
      if (options.fresh) await admin.query(`DROP DATABASE IF EXISTS "${options.database}" WITH (FORCE)`);
      const exists = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [options.database]);
      if (exists.rowCount === 0) await admin.query(`CREATE DATABASE "${options.database}"`);
    }
  } finally {
    await admin.end();
  }
  if (!passwords) {
    const migrated = await migrateAs(url);
    return { ownerUrl: url, appUrl: url, serverUrl: url, separateRoles: false, migrated };
  }
  const ownerUrl = urlAs(url, ownerRole, passwords.owner);
  const appUrl = urlAs(url, appRole, passwords.app);
  const migrated = await migrateAs(ownerUrl);
  const serverUrl = serverConnectsAs === 'app' ? appUrl : ownerUrl;
  return { ownerUrl, appUrl, serverUrl, separateRoles: true, migrated };
}
