import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import { Client } from 'pg';
import { appRole, applyGrants, canMigrate } from './roles';
import * as m0001 from '../migrations/0001-foundation';
import * as m0002 from '../migrations/0002-setup-and-history';
import * as m0003 from '../migrations/0003-alarms';
import * as m0004 from '../migrations/0004-audit-chain';
import * as m0005 from '../migrations/0005-import-originals';
import * as m0006 from '../migrations/0006-record-versions';
import * as m0007 from '../migrations/0007-setting-versions';
import * as m0008 from '../migrations/0008-reading-provenance';
import * as m0009 from '../migrations/0009-corrections';
import * as m0010 from '../migrations/0010-database-roles';
import * as m0011 from '../migrations/0011-periods';
import * as m0012 from '../migrations/0012-reconciliation';
import * as m0013 from '../migrations/0013-balance-groups';
import * as m0014 from '../migrations/0014-calibrations';
import * as m0015 from '../migrations/0015-element-care';
import * as m0016 from '../migrations/0016-care-certificates-and-due';
import * as m0017 from '../migrations/0017-device-rejections';
import * as m0018 from '../migrations/0018-token-version';
import * as m0019 from '../migrations/0019-reconciliation-tolerance-versions';
import * as m0022 from '../migrations/0022-hourly-uncertainty-budget';
import * as m0023 from '../migrations/0023-transmitter-accuracy-kind';
import * as m0024 from '../migrations/0024-bidirectional-meter-runs';
import * as m0025 from '../migrations/0025-element-calibration-direction';

/**
 * Migrations are listed here, in order, rather than globbed: the list works the same under
 * tsx, ts-jest and a bundler, and a missing file is a compile error instead of a skipped step.
 */
const migrations = [
  { name: '0001-foundation', ...m0001 },
  { name: '0002-setup-and-history', ...m0002 },
  { name: '0003-alarms', ...m0003 },
  { name: '0004-audit-chain', ...m0004 },
  { name: '0005-import-originals', ...m0005 },
  { name: '0006-record-versions', ...m0006 },
  { name: '0007-setting-versions', ...m0007 },
  { name: '0008-reading-provenance', ...m0008 },
  { name: '0009-corrections', ...m0009 },
  { name: '0010-database-roles', ...m0010 },
  { name: '0011-periods', ...m0011 },
  { name: '0012-reconciliation', ...m0012 },
  { name: '0013-balance-groups', ...m0013 },
  { name: '0014-calibrations', ...m0014 },
  { name: '0015-element-care', ...m0015 },
  { name: '0016-care-certificates-and-due', ...m0016 },
  { name: '0017-device-rejections', ...m0017 },
  { name: '0018-token-version', ...m0018 },
  { name: '0019-reconciliation-tolerance-versions', ...m0019 },
  { name: '0022-hourly-uncertainty-budget', ...m0022 },
  { name: '0023-transmitter-accuracy-kind', ...m0023 },
  { name: '0024-bidirectional-meter-runs', ...m0024 },
  { name: '0025-element-calibration-direction', ...m0025 },
];

export function migrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** The names of the listed migrations the database has not run yet (all of them before the first). */
async function pendingNames(db: Client): Promise<string[]> {
  const table = await db.query<{ found: string | null }>(
    "SELECT to_regclass('public.schema_migrations')::text AS found",
  );
  if (!table.rows[0].found) return migrations.map((m) => m.name);
  const done = await db.query<{ name: string }>('SELECT name FROM schema_migrations');
  const names = new Set(done.rows.map((r) => r.name));
  return migrations.map((m) => m.name).filter((name) => !names.has(name));
}

/**
 * Applies every pending migration, holding an advisory lock on a connection of its own (the
 * pool could hand lock and unlock to different sessions) so two processes never race, then gives
 * the app role its privileges on whatever the migrations made (server/db/roles.ts).
 *
 * Only the owner role (or a superuser) migrates. The app role's connection (the server's) finds
 * nothing pending and returns at once; with something pending it fails naming what is pending,
 * rather than half-migrating without the right to.
 */
export async function migrate(sequelize: Sequelize, databaseUrl: string): Promise<string[]> {
  const lockKey = 7_200_417; // arbitrary, fixed: identifies Tallyrun's migration lock
  const lock = new Client({ connectionString: databaseUrl });
  await lock.connect();
  try {
    const allowed = await canMigrate(lock);
    if (!allowed) {
      const pending = await pendingNames(lock);
      if (pending.length === 0) return [];
      const who = (await lock.query<{ me: string }>('SELECT current_user AS me')).rows[0].me;
      throw new Error(
        `database migrations ${pending.join(', ')} are pending and the connection as ${who} may not apply them; ` +
          `migrations run as tallyrun_owner (npm start and npm test do so before the server starts)` +
          (who === appRole ? '' : ", as a superuser or as the database's owner"),
      );
    }
    await lock.query('SELECT pg_advisory_lock($1)', [lockKey]);
    const done = await migrator(sequelize).up();
    await applyGrants(lock);
    return done.map((m) => m.name);
  } finally {
    await lock.end();
  }
}
