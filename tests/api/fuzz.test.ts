import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import fc from 'fast-check';
import { testApp } from '../../server/test-support/app';
import { client, createMeterRun } from '../support/api';

/**
 * Issue 12 "What to prove": a fuzz run over every route that takes a body. Each answer is a 2xx or
 * a 4xx whose JSON error gives a reason (`error.message`), never a 5xx, and the server still
 * answers /api/health afterwards. The routes are read from the role table of
 * tests/api/role-matrix.test.ts (its text, so the table stays in one place), signed in as admin so
 * every route is reachable. The seed is fixed (tests/support/fast-check-seed.ts); fast-check prints
 * it with any counterexample. Bodies that succeed create data in the test database only.
 */
const runsPerRoute = Number(process.env.TALLYRUN_FUZZ_RUNS ?? 30);

const tableText = fs.readFileSync(path.join(__dirname, 'role-matrix.test.ts'), 'utf8');
const bodyRoutes = [...tableText.matchAll(/^\s*'((?:POST|PATCH|PUT|DELETE) \/api\/[^']*)':/gm)].map((m) => m[1]);

let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
let listening: Server;
/** Real ids of this file's own records, so bodies reach validation instead of stopping at "not found". */
const ids: Record<string, string> = {};

beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('admin')).token;
  listening = t.app.listen(0);
  const api = client(token, `http://127.0.0.1:${(listening.address() as AddressInfo).port}`);
  const f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0 });
  ids.sites = f.site.id;
  ids['meter-runs'] = f.meterRun.id;
  ids.transmitters = f.dp.id;
  ids['reconciliations/tolerances'] = f.meterRun.id;
  ids.devices = (await api.post('/api/devices', { name: 'fuzz RTU', siteId: f.site.id })).body.id;
  // A user of this file's own, so a random PATCH never changes someone another test signs in as.
  ids.users = (await t.signedIn('operator')).id;
});
afterAll(async () => {
  await new Promise((r) => listening.close(r));
  await t.close();
});

/** The URL of a route with this file's ids (1 where it has none; a far-past month for periods). */
function urlOf(route: string) {
  const p = route.split(' ')[1];
  const resource = p.replace(/^\/api\//, '').split('/:')[0];
  return p.replace(':id', ids[resource] ?? '1').replace(':month', '2003-02');
}

/** Field names the API's bodies use, to put wrong types where a schema looks. */
const knownFields = [
  'name',
  'code',
  'email',
  'password',
  'role',
  'active',
  'siteId',
  'meterRunId',
  'transmitterId',
  'tag',
  'measures',
  'unit',
  'timeZone',
  'contractHour',
  'validFrom',
  'effectiveFrom',
  'reason',
  'value',
  'values',
  'from',
  'to',
  'time',
  'month',
  'note',
  'kind',
  'config',
  'settings',
  'lowerRange',
  'upperRange',
  'pressureReference',
  'boreDiameterMm',
  'pipeDiameterMm',
  'composition',
  'asFound',
  'asLeft',
  'hours',
  'until',
  'minutes',
  'limit',
  'high',
  'low',
  'tolerancePercent',
  'members',
  'resolution',
  'readings',
  'differentialPressurePa',
  'staticPressurePa',
  'temperatureK',
  'comment',
  'date',
  'performedAt',
];

const nastyString = fc.oneof(
  fc.string(),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.constantFrom(
    'NaN',
    'Infinity',
    '-Infinity',
    '1e309',
    '-0',
    '0x1F',
    '',
    ' ',
    '\u0000',
    '\u202e',
    '💥'.repeat(50),
    '2026-02-30T25:61:00Z',
    '9999999999999999999999',
    '../../etc/passwd',
    "' OR 1=1 --",
    '__proto__',
    'constructor',
    '<script>alert(1)</script>',
    'x'.repeat(20_000),
  ),
);
const hugeNumber = fc.oneof(
  fc.double(),
  fc.constantFrom(Number.MAX_VALUE, -Number.MAX_VALUE, Number.MIN_VALUE, 2 ** 63, -(2 ** 63), 1e300, -1e300),
  fc.integer(),
  fc.bigInt({ min: -(10n ** 30n), max: 10n ** 30n }).map((n) => Number(n)),
);
const leaf = fc.oneof(nastyString, hugeNumber, fc.boolean(), fc.constant(null));
const value = fc.oneof({ maxDepth: 3 }, leaf, fc.array(leaf, { maxLength: 5 }), fc.dictionary(fc.string(), leaf));
const shapedObject = fc.dictionary(fc.constantFrom(...knownFields), value, { maxKeys: 8 });

/** A raw JSON text: deep nesting within the 1 MB limit, and texts that are not JSON at all. */
const rawText = fc.oneof(
  fc.integer({ min: 1, max: 20_000 }).map((depth) => '['.repeat(depth) + ']'.repeat(depth)),
  fc.integer({ min: 1, max: 5_000 }).map((depth) => '{"name":'.repeat(depth) + '1' + '}'.repeat(depth)),
  fc.string().map((s) => `{"name": ${s}`),
  fc.constantFrom('', 'null', 'NaN', '{"__proto__": {"admin": true}}', '[1,2', '"\\ud800"', '1e999'),
);

type Body = { json: unknown } | { raw: string };
const body: fc.Arbitrary<Body> = fc.oneof(
  shapedObject.map((json) => ({ json })),
  fc.jsonValue({ maxDepth: 4 }).map((json) => ({ json })),
  value.map((json) => ({ json })),
  rawText.map((raw) => ({ raw })),
);

async function send(route: string, b: Body) {
  const method = route.split(' ')[0].toLowerCase() as 'post' | 'patch' | 'put' | 'delete';
  const req = t.http()[method](urlOf(route)).set('Authorization', `Bearer ${token}`);
  if ('raw' in b) return req.set('content-type', 'application/json').send(b.raw);
  // superagent sends a bare string as a form; a JSON text of it is what a client would send.
  return req.set('content-type', 'application/json').send(JSON.stringify(b.json ?? null));
}

it('reads every route of the server that takes a body from the role table', () => {
  const served = (t.app.locals.apiRoutes as string[]).filter((route) => !route.startsWith('GET '));
  expect(bodyRoutes.length).toBeGreaterThanOrEqual(30);
  expect([...bodyRoutes].sort()).toEqual(served.sort());
});

describe.each(bodyRoutes)('%s', (route) => {
  it('answers any body with a 2xx, or a 4xx whose JSON error gives a reason, and never a 5xx', async () => {
    await fc.assert(
      fc.asyncProperty(body, async (b) => {
        const res = await send(route, b);
        const reason = res.body?.error?.message;
        if (res.status >= 500 || res.status < 200 || (res.status >= 300 && res.status < 400))
          throw new Error(`${route} answered ${res.status}: ${res.text.slice(0, 300)}`);
        if (res.status >= 400 && (typeof reason !== 'string' || reason.trim() === ''))
          throw new Error(`${route} answered ${res.status} without error.message: ${res.text.slice(0, 300)}`);
      }),
      { numRuns: runsPerRoute },
    );
  });
});

it('still answers /api/health after the fuzz run', async () => {
  const res = await t.http().get('/api/health');
  expect(res.status).toBe(200);
  expect(res.body.status).toBe('ok');
});
