/**
 * `npm run --silent audit-verify`: proves the audit trail whole. Exit 0 and one line when every
 * event matches its hash and names the one before it; exit 1 naming the first broken event;
 * exit 2 when the check could not run (no database).
 *
 * The database is `DATABASE_URL` when set (any role that may read audit_events), otherwise the
 * project's own cluster (database `tallyrun`, as `npm start` uses it), read as the app role
 * `tallyrun_app` (server/db/roles.ts); a cluster this command had to start is stopped again.
 */
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { ensureCluster, type Cluster } from './postgres';
import { appRole, urlAs } from '../db/roles';
import { verifyAuditChain } from '../audit-chain';

const root = path.resolve(__dirname, '..', '..');
const say = (line: string) => process.stdout.write(`${line}\n`);

async function main(): Promise<number> {
  let cluster: Cluster | null = null;
  let client: Client | null = null;
  try {
    let url = process.env.DATABASE_URL;
    if (!url) {
      const dataDir = path.resolve(process.env.TALLYRUN_DATA_DIR ?? path.join(root, '.tallyrun'));
      cluster = await ensureCluster({ dataDir, port: Number(process.env.TALLYRUN_PG_PORT ?? 54329), log: () => {} });
      // The app role once `npm start` has made it; a cluster from before the roles has only the superuser.
      const appPassword = path.join(cluster.secretsDir, 'pg-app-password');
      url = fs.existsSync(appPassword)
        ? urlAs(cluster.url('tallyrun'), appRole, fs.readFileSync(appPassword, 'utf8').trim())
        : cluster.url('tallyrun');
    }
    client = new Client({ connectionString: url });
    await client.connect();
    const report = await verifyAuditChain(client);
    if (report.ok) {
      say(`audit trail whole: ${report.events} events; newest hash ${report.headHash ?? '(none yet)'}`);
      return 0;
    }
    const broken = report.firstBreak!;
    say(`audit trail broken at event ${broken.eventId} (place ${broken.chainSeq}): ${broken.problem}`);
    say(`${report.events} events before it are whole.`);
    return 1;
  } catch (err) {
    say(`audit-verify could not check the audit trail: ${err instanceof Error ? err.message : String(err)}`);
    return 2;
  } finally {
    await client?.end().catch(() => undefined);
    if (cluster?.startedHere) cluster.stop();
  }
}

void main().then((code) => process.exit(code));
