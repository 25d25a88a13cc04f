/**
 * Part "kill" (issue 12, "What to prove", second point): a publisher sends N QoS 1 readings in batched
 * payloads (a JSON array per message, as field gateways send them) with several messages in flight, and keeps
 * a ledger of each message and whether it got its PUBACK. Part-way (about 40 % acknowledged) the server gets
 * kill -9; it is started again, the publisher reconnects and resends every message not acknowledged, and the
 * ledger is compared with the database: acknowledged readings missing (must be 0) and readings stored more
 * than once per (transmitter, time) (must be 0).
 */
import mqtt, { type MqttClient } from 'mqtt';
import { Client as PgClient } from 'pg';
import { meterRunWithDevice, say, type Harness, type ServerProcess } from './harness';
import type { PartResult } from './outage';

const perMessage = 50;
const inFlight = 20;
const spacingMs = 100;

function connect(server: ServerProcess, device: { username: string; password: string }) {
  const publisher = mqtt.connect({
    host: '127.0.0.1',
    port: server.mqttPort,
    username: device.username,
    password: device.password,
    protocolVersion: 4,
    clean: true,
    // The ledger decides what to resend: no automatic reconnect or replay by the library.
    reconnectPeriod: 0,
  });
  publisher.on('error', () => undefined);
  return new Promise<MqttClient>((resolve, reject) => {
    publisher.once('connect', () => resolve(publisher));
    publisher.once('close', () => reject(new Error('the publisher could not connect')));
  });
}

/** Publishes the listed messages, `inFlight` at a time; ends when all are acknowledged or the connection closes. */
function pump(
  publisher: MqttClient,
  topic: string,
  queue: number[],
  payload: (m: number) => string,
  onAck: (m: number) => void,
) {
  return new Promise<'done' | 'closed'>((resolve) => {
    let next = 0;
    let outstanding = 0;
    let closed = false;
    publisher.once('close', () => {
      closed = true;
      resolve('closed');
    });
    const fill = () => {
      while (!closed && outstanding < inFlight && next < queue.length) {
        const m = queue[next++];
        outstanding++;
        publisher.publish(topic, payload(m), { qos: 1 }, (err) => {
          outstanding--;
          if (closed) return;
          if (!err) onAck(m);
          if (next >= queue.length && outstanding === 0) resolve('done');
          else fill();
        });
      }
    };
    if (queue.length === 0) resolve('done');
    else fill();
  });
}

export async function killPart(h: Harness, options: { readings: number }): Promise<PartResult> {
  const messages = Math.ceil(options.readings / perMessage);
  const total = messages * perMessage;
  let server = await h.startServer();
  const { f, device, topic } = await meterRunWithDevice(server);
  const failures: string[] = [];
  const t0 = Date.now() - total * spacingMs - 3_600_000;
  const payload = (m: number) => {
    const batch = [];
    for (let k = 0; k < perMessage; k++) {
      const i = m * perMessage + k;
      batch.push({ t: t0 + i * spacingMs, v: 10 + (i % 50), q: 'good' });
    }
    return JSON.stringify(batch);
  };
  const acked = new Uint8Array(messages);
  let ackedCount = 0;
  let publisher: MqttClient | null = null;
  try {
    // Before the kill: publish until about 40 % is acknowledged, then kill -9 the server.
    publisher = await connect(server, device);
    const startedMs = Date.now();
    let killedMs = 0;
    let ackedAtKill = 0;
    const killed = server;
    const first = pump(
      publisher,
      topic,
      Array.from({ length: messages }, (_, m) => m),
      payload,
      (m) => {
        acked[m] = 1;
        ackedCount++;
        if (!killedMs && ackedCount >= messages * 0.4) {
          killedMs = Date.now();
          ackedAtKill = ackedCount;
          killed.child.kill('SIGKILL');
        }
      },
    );
    const outcome = await first;
    if (!killedMs)
      throw new Error(
        outcome === 'closed'
          ? `the connection closed before the kill (server: ${server.exited() ?? 'running'})`
          : 'the publisher finished before the server was killed',
      );
    const rateBefore = (ackedAtKill * perMessage) / ((killedMs - startedMs) / 1000);
    say(`${ackedAtKill * perMessage} readings acknowledged at ${rateBefore.toFixed(0)} readings/s; server killed (-9)`);
    publisher.end(true);
    await server.stop(); // waits for the killed process to be reaped

    // Restart, reconnect, resend everything without a PUBACK.
    server = await h.startServer();
    publisher = await connect(server, device);
    const reconnectedMs = Date.now();
    let firstAckMs = 0;
    const unacked = Array.from({ length: messages }, (_, m) => m).filter((m) => !acked[m]);
    say(
      `server restarted and publisher reconnected in ${((reconnectedMs - killedMs) / 1000).toFixed(1)} s; resending ${unacked.length} messages`,
    );
    const second = await pump(publisher, topic, unacked, payload, (m) => {
      if (!firstAckMs) firstAckMs = Date.now();
      if (!acked[m]) ackedCount++;
      acked[m] = 1;
    });
    const doneMs = Date.now();
    if (second !== 'done') failures.push('the connection closed while resending');
    const recoverS = ((firstAckMs || doneMs) - killedMs) / 1000;
    const rateAfter = (unacked.length * perMessage) / ((doneMs - reconnectedMs) / 1000);

    // The ledger against the database: per message, how many of its readings are stored, and any time stored twice.
    const check = new PgClient({ connectionString: h.appUrl });
    await check.connect();
    const perMsg = await check.query<{ m: number; n: number }>(
      `SELECT (((extract(epoch FROM time) * 1000)::bigint - $2::bigint) / $3 / $4)::int AS m, count(DISTINCT time)::int AS n
         FROM readings WHERE transmitter_id = $1 GROUP BY 1`,
      [f.dp.id, t0, spacingMs, perMessage],
    );
    const twice = (
      await check.query<{ n: number }>(
        `SELECT count(*)::int AS n FROM (SELECT time FROM readings WHERE transmitter_id = $1 GROUP BY time HAVING count(*) > 1) d`,
        [f.dp.id],
      )
    ).rows[0].n;
    await check.end();
    const storedPer = new Map(perMsg.rows.map((r) => [r.m, r.n]));
    let lost = 0;
    for (let m = 0; m < messages; m++) if (acked[m]) lost += perMessage - (storedPer.get(m) ?? 0);
    const stored = perMsg.rows.reduce((s, r) => s + r.n, 0);
    say(
      `recovered in ${recoverS.toFixed(1)} s (kill to first PUBACK after restart); resent at ${rateAfter.toFixed(0)} readings/s`,
    );
    say(
      `${ackedCount * perMessage} of ${total} readings acknowledged, ${stored} stored; lost ${lost}, stored more than once ${twice}`,
    );
    if (ackedCount !== messages) failures.push(`${messages - ackedCount} messages never acknowledged`);
    if (lost) failures.push(`${lost} acknowledged readings missing from the database`);
    if (twice) failures.push(`${twice} readings stored more than once`);
    if (server.exited()) failures.push(`the restarted server ended (${server.exited()})`);
    return {
      part: 'kill',
      figures: [
        ['readings published', `${total} (${perMessage} a message, ${inFlight} in flight)`],
        ['readings/s before the kill', rateBefore.toFixed(0)],
        ['acknowledged at the kill', String(ackedAtKill * perMessage)],
        ['time to recover (kill to first PUBACK)', `${recoverS.toFixed(1)} s`],
        ['readings/s while resending', rateAfter.toFixed(0)],
        ['acknowledged readings lost', String(lost)],
        ['readings stored more than once', String(twice)],
      ],
      failures,
    };
  } finally {
    publisher?.end(true);
    await server.stop();
  }
}
