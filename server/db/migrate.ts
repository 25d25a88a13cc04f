import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import { Client } from 'pg';
import * as m0001 from '../migrations/0001-foundation';
import * as m0002 from '../migrations/0002-setup-and-history';
import * as m0003 from '../migrations/0003-alarms';
import * as m0004 from '../migrations/0004-audit-chain';
import * as m0005 from '../migrations/0005-import-originals';
import * as m0006 from '../migrations/0006-record-versions';

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
];

export function migrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/**
 * Applies every pending migration, holding an advisory lock on a connection of its own (the
 * pool could hand lock and unlock to different sessions) so two processes never race.
 */
export async function migrate(sequelize: Sequelize, databaseUrl: string): Promise<string[]> {
  const lockKey = 7_200_417; // arbitrary, fixed: identifies Tallyrun's migration lock
  const lock = new Client({ connectionString: databaseUrl });
  await lock.connect();
  try {
    await lock.query('SELECT pg_advisory_lock($1)', [lockKey]);
    const done = await migrator(sequelize).up();
    return done.map((m) => m.name);
  } finally {
    await lock.end();
  }
}
