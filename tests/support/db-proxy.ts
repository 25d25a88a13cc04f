import net from 'node:net';
import type { AddressInfo } from 'node:net';
import { Client } from 'pg';
import { connectDatabase } from '../../server/db/connect';
import { migrate } from '../../server/db/migrate';
import { ensureOwnedDatabase, urlOfDatabase } from '../../server/db/roles';

/**
 * A TCP proxy between a server under test and PostgreSQL, to take the database away and give it
 * back without stopping a cluster others use: `cut()` ends every connection and stops listening
 * (new connections are refused, as when PostgreSQL is stopped); `restore()` listens again on the
 * same port.
 */
export async function startDatabaseProxy(target: { host: string; port: number }) {
  const sockets = new Set<net.Socket>();
  const server = net.createServer((inbound) => {
    const outbound = net.connect(target.port, target.host);
    for (const s of [inbound, outbound]) {
      sockets.add(s);
      s.on('error', () => s.destroy());
      s.on('close', () => {
        sockets.delete(s);
        (s === inbound ? outbound : inbound).destroy();
      });
    }
    inbound.pipe(outbound);
    outbound.pipe(inbound);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const port = (server.address() as AddressInfo).port;
  return {
    port,
    /** The same URL with this proxy as the host. */
    via(url: string) {
      const u = new URL(url);
      u.hostname = '127.0.0.1';
      u.port = String(port);
      return u.toString();
    },
    async cut() {
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      for (const s of sockets) s.destroy();
      await closed;
    },
    restore: () => new Promise<void>((resolve) => server.listen(port, '127.0.0.1', () => resolve())),
    async close() {
      for (const s of sockets) s.destroy();
      if (server.listening) await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/**
 * A migrated database of its own for one test file, beside the run's test databases (made with
 * the superuser connection `npm test` passes, owned by the owner role, used as the app role):
 * a server started on it may mark running imports failed and run its workers without touching
 * the other files' data. `drop()` removes it.
 */
export async function makeOwnDatabase(name: string) {
  const adminUrl = process.env.TEST_ADMIN_DATABASE_URL;
  const ownerUrl = process.env.TEST_OWNER_DATABASE_URL;
  const appUrl = process.env.TEST_APP_DATABASE_URL;
  if (!adminUrl || !ownerUrl || !appUrl)
    throw new Error('run this test with `npm test`, which sets TEST_*_DATABASE_URL');
  await ensureOwnedDatabase(adminUrl, name, { fresh: true });
  const owner = urlOfDatabase(ownerUrl, name);
  const sequelize = connectDatabase(owner);
  try {
    await migrate(sequelize, owner);
  } finally {
    await sequelize.close();
  }
  return {
    appUrl: urlOfDatabase(appUrl, name),
    async drop() {
      const admin = new Client({ connectionString: urlOfDatabase(adminUrl, 'postgres') });
      await admin.connect();
      try {
        await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      } finally {
        await admin.end();
      }
    },
  };
}
