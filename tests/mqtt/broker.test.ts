import mqtt from 'mqtt';

/** The embedded broker of the server that `npm test` started. */
const port = Number(process.env.TALLYRUN_MQTT_PORT ?? 1883);

function connect(options: mqtt.IClientOptions) {
  return new Promise<{ ok: true } | { ok: false; code: number | undefined }>((resolve) => {
    const client = mqtt.connect({
      host: '127.0.0.1',
      port,
      protocolVersion: 4,
      reconnectPeriod: 0,
      connectTimeout: 5000,
      ...options,
    });
    client.once('connect', () => {
      client.end(true);
      resolve({ ok: true });
    });
    client.once('error', (err) => {
      client.end(true);
      resolve({ ok: false, code: (err as Error & { code?: number }).code });
    });
  });
}

it('refuses a device that gives no credentials', async () => {
  expect(await connect({})).toEqual({ ok: false, code: 4 });
});

it('refuses a device whose credentials were never issued', async () => {
  expect(await connect({ username: 'made-up-device', password: 'made-up-password' })).toEqual({ ok: false, code: 4 });
});
