/**
 * `npm run --silent audit-verify`: proves the audit trail whole. Exit 0 and one line when every
 * event matches its hash and names the one before it; exit 1 naming the first broken event;
 * exit 2 when the check could not run (no database).
 *
 * The database is `DATABASE_URL` when set, otherwise the project's own cluster (database
 * `tallyrun`, as `npm start` uses it); a cluster this command had to start is stopped again.
 */
import path from 'node:path';
import { Client } from 'pg';
import { ensureCluster, type Cluster } from './postgres';
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
      url = cluster.url('tallyrun');
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
