import mqtt from 'mqtt';
import { client, createMeterRun, mqttPort, settled, signIn, until, type Client } from '../support/api';

/**
 * A direction input (measure `flow-direction`, unit `sign`: > 0 forward, < 0 reverse) fed over the
 * real broker and through a CSV import says which way a bi-directional meter run flows
 * (bidir-design.md). By hand: one reading every 5 min (gap limit 15 min) of DP 20 kPa, P 2 MPa,
 * T 300 K and the direction; an hour with direction +1 is 3600 s of forward flow and none reverse,
 * an hour with −1 the other way round. The DP reads magnitude, so only the input tells them apart.
 */
let engineer: Client;
let admin: Client;
beforeAll(async () => {
  engineer = client(await signIn('engineer@demo.tallyrun'));
  admin = client(await signIn('admin@demo.tallyrun'));
});

const hourMs = 3_600_000;
type Hour = { start: string; flowTimeS: number; reverse: { flowTimeS: number } | null };

/** A meter run made bi-directional with its direction from an input, and that input. */
async function bidirectionalRun() {
  const f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0, maxGapS: 900 });
  const version = await engineer.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
    effectiveFrom: '2021-01-01T00:00:00Z',
    element: f.element,
    fluid: f.fluid,
    reverseElement: f.element,
    directionSource: 'direction-input',
    reason: 'bi-directional, direction from the valve position switch',
  });
  expect(version.status).toBe(201);
  const direction = await engineer.post('/api/transmitters', {
    meterRunId: f.meterRun.id,
    tag: `${f.meterRun.tag}-FD`,
    measures: 'flow-direction',
    unit: 'sign',
    lowerRange: -1,
    upperRange: 1,
  });
  expect(direction.status).toBe(201);
  const second = await engineer.post('/api/transmitters', {
    meterRunId: f.meterRun.id,
    tag: `${f.meterRun.tag}-FD2`,
    measures: 'flow-direction',
    unit: 'sign',
    lowerRange: -1,
    upperRange: 1,
  });
  // One direction input per meter run: a second is refused, naming measures.
  expect(second.status).toBe(409);
  expect(second.body.error.field).toBe('measures');
  return { ...f, fd: direction.body as { id: string; tag: string } };
}

/** Readings every 5 min over two hours from h0: the first hour direction +1, the second −1. */
function readings(h0: number) {
  const out: { t: number; tag: 'dp' | 'pt' | 'tt' | 'fd'; v: number }[] = [];
  for (let t = h0; t < h0 + 2 * hourMs; t += 5 * 60_000) {
    out.push({ t, tag: 'dp', v: 20 }, { t, tag: 'pt', v: 2 }, { t, tag: 'tt', v: 300 });
    out.push({ t, tag: 'fd', v: t < h0 + hourMs ? 1 : -1 });
  }
  return out;
}

async function twoHours(f: Awaited<ReturnType<typeof bidirectionalRun>>, h0: number) {
  await settled(engineer, f.meterRun.id);
  const res = await engineer.get(
    `/api/meter-runs/${f.meterRun.id}/hourly-records?from=${new Date(h0).toISOString()}&to=${new Date(h0 + 2 * hourMs).toISOString()}`,
  );
  return res.body as Hour[];
}

function expectForwardThenReverse(hours: Hour[]) {
  expect(hours.map((h) => [h.flowTimeS, h.reverse?.flowTimeS ?? null])).toEqual([
    [3600, 0],
    [0, 3600],
  ]);
}

it('takes forward and reverse hours from a direction input imported as CSV', async () => {
  const f = await bidirectionalRun();
  const h0 = Math.floor((Date.now() - 3 * 24 * hourMs) / hourMs) * hourMs;
  const tags = { dp: f.dp.tag, pt: f.pt.tag, tt: f.tt.tag, fd: f.fd.tag };
  const lines = ['time,tag,value,quality'];
  for (const r of readings(h0)) lines.push(`${new Date(r.t).toISOString()},${tags[r.tag]},${r.v},good`);
  const started = await engineer.upload('/api/imports', 'readings.csv', lines.join('\n') + '\n');
  expect(started.status).toBe(202);
  const done = await until('the import to finish', async () => {
    const r = await engineer.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  expect(done.status).not.toBe('failed');
  expectForwardThenReverse(await twoHours(f, h0));
});

it('takes forward and reverse hours from a direction input published over MQTT', async () => {
  const f = await bidirectionalRun();
  const device = await admin.post('/api/devices', { name: 'direction test RTU', siteId: f.site.id });
  expect(device.status).toBe(201);
  const c = await new Promise<mqtt.MqttClient>((resolve, reject) => {
    const m = mqtt.connect({
      host: '127.0.0.1',
      port: mqttPort,
      protocolVersion: 4,
      username: device.body.username,
      password: device.body.password,
      reconnectPeriod: 0,
      clean: true,
    });
    m.once('connect', () => resolve(m));
    m.once('error', reject);
  });
  const h0 = Math.floor((Date.now() - 2 * 24 * hourMs) / hourMs) * hourMs;
  try {
    const tags = { dp: f.dp.tag, pt: f.pt.tag, tt: f.tt.tag, fd: f.fd.tag };
    const all = readings(h0);
    for (const key of ['pt', 'tt', 'fd', 'dp'] as const) {
      const payload = JSON.stringify(all.filter((r) => r.tag === key).map((r) => ({ t: r.t, v: r.v, q: 'good' })));
      await new Promise<void>((resolve, reject) =>
        c.publish(`tallyrun/${f.site.code}/${tags[key]}`, payload, { qos: 1 }, (err) =>
          err ? reject(err) : resolve(),
        ),
      );
    }
  } finally {
    c.end(true);
  }
  expectForwardThenReverse(await twoHours(f, h0));
});
