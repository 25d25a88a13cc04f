/**
 * Part "outage" (issue 12, "What to prove", first point): PostgreSQL is stopped (`pg_ctl stop -m fast`) and
 * started again under a server taking MQTT QoS 1 readings and a CSV import at once. Fails when the server
 * died, health never said degraded, an acknowledged reading was lost or stored twice, or the import neither
 * completed nor said what it stored.
 */
import mqtt from 'mqtt';
import { Client as PgClient } from 'pg';
import { until } from '../support/api';
import { meterRunWithDevice, say, sleep, type Harness } from './harness';

export interface PartResult {
  part: string;
  figures: [string, string][];
  failures: string[];
}

export async function outagePart(h: Harness, options: { messages: number; csvLines: number }): Promise<PartResult> {
  const { messages, csvLines } = options;
  const server = await h.startServer();
  const { engineer, f, device, topic } = await meterRunWithDevice(server);
  const failures: string[] = [];
  const healthSeen = new Set<string>();
  const watching = setInterval(() => {
    void fetch(`${server.url}/api/health`)
      .then((r) => r.json())
      .then((health: { status: string }) => healthSeen.add(health.status))
      .catch(() => healthSeen.add('no answer'));
  }, 250);

  // The publisher's ledger: each message one reading at its own time; acknowledged ones are recorded.
  const publisher = mqtt.connect({
    host: '127.0.0.1',
    port: server.mqttPort,
    username: device.username,
    password: device.password,
    protocolVersion: 4,
    clean: true,
    reconnectPeriod: 500,
  });
  publisher.on('error', () => undefined);
  try {
    await new Promise((r) => publisher.once('connect', r));
    // Every time in the past, the CSV's too (one a second): else its last lines would be refused as future.
    const t0 = Date.now() - Math.max(messages, csvLines) * 1000 - 3_600_000;
    const acknowledged: number[] = [];
    const publishing = (async () => {
      const pending: Promise<void>[] = [];
      for (let i = 0; i < messages; i++) {
        const t = t0 + i * 1000;
        pending.push(
          new Promise<void>((resolve) =>
            publisher.publish(topic, JSON.stringify({ t, v: 10 + (i % 50), q: 'good' }), { qos: 1 }, (err) => {
              if (!err) acknowledged.push(t);
              resolve();
            }),
          ),
        );
        if (i % 50 === 49) await sleep(20);
      }
      await Promise.all(pending);
    })();

    // The CSV import: the pressure transmitter, one reading a second, beside the MQTT load.
    const csv = ['time,tag,value,quality'];
    for (let i = 0; i < csvLines; i++) csv.push(`${new Date(t0 + i * 1000).toISOString()},${f.pt.tag},2,good`);
    const started = await engineer.api.upload('/api/imports', 'reliability.csv', csv.join('\n') + '\n');
    say(`CSV import of ${csvLines} lines started: HTTP ${started.status}`);

    await sleep(1500);
    say('stopping PostgreSQL (pg_ctl stop -m fast) under load');
    h.stopCluster();
    await sleep(5000);
    say('starting PostgreSQL again');
    await h.startCluster();

    await publishing;
    say(`${acknowledged.length} of ${messages} messages acknowledged`);
    const finished = await until(
      'the import to end',
      async () => {
        const r = await engineer.api.get(`/api/imports/${started.body.id}`);
        return r.status === 200 && r.body.status !== 'running' ? r.body : null;
      },
      120_000,
    ).catch(() => null);
    clearInterval(watching);

    const check = new PgClient({ connectionString: h.appUrl });
    await check.connect();
    const stored = await check.query<{ t: string; n: number }>(
      `SELECT (extract(epoch FROM time) * 1000)::bigint::text AS t, count(*)::int AS n FROM readings WHERE transmitter_id = $1 GROUP BY time`,
      [f.dp.id],
    );
    const counts = new Map(stored.rows.map((r) => [Number(r.t), r.n]));
    const lost = acknowledged.filter((t) => !counts.has(t)).length;
    const twice = stored.rows.filter((r) => r.n > 1).length;
    const csvStored = (
      await check.query<{ n: number }>('SELECT count(*)::int AS n FROM readings WHERE transmitter_id = $1', [f.pt.id])
    ).rows[0].n;
    await check.end();

    say(`health states seen: ${[...healthSeen].join(', ')}`);
    say(`acknowledged readings lost: ${lost}; stored more than once: ${twice}`);
    say(
      finished
        ? `import ended ${finished.status}: ${finished.rowsImported} rows imported, ${csvStored} stored; errors ${JSON.stringify(finished.errors?.slice?.(0, 3) ?? finished.errors)}`
        : 'import did not end within 2 minutes',
    );
    if (server.exited()) failures.push(`the server process ended (${server.exited()})`);
    if (!healthSeen.has('degraded')) failures.push('health never said degraded');
    if (!healthSeen.has('ok')) failures.push('health never said ok');
    if (lost) failures.push(`${lost} acknowledged readings lost`);
    if (twice) failures.push(`${twice} readings stored twice`);
    if (!finished) failures.push('the import did not end');
    else if (finished.status === 'done' && csvStored !== csvLines)
      failures.push(`the import said done but ${csvStored} of ${csvLines} rows are stored`);
    else if (finished.status === 'failed' && finished.rowsImported !== csvStored)
      failures.push(`the import said ${finished.rowsImported} rows imported but ${csvStored} are stored`);
    return {
      part: 'outage',
      figures: [
        ['messages acknowledged', `${acknowledged.length} of ${messages}`],
        ['health states seen', [...healthSeen].join(', ')],
        ['acknowledged readings lost', String(lost)],
        ['readings stored more than once', String(twice)],
        [
          'import',
          finished ? `${finished.status}, ${finished.rowsImported} imported, ${csvStored} stored` : 'did not end',
        ],
      ],
      failures,
    };
  } finally {
    clearInterval(watching);
    publisher.end(true);
    await server.stop();
  }
}
