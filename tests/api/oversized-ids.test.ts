import { testApp } from '../../server/test-support/app';

/**
 * Ids beyond a PostgreSQL bigint (issue 12 §8) name no record: a path id answers 404 with the
 * record's name, a query or body id 400 naming the field, and never a 500 from PostgreSQL's
 * "out of range for type bigint". The routes come from the server's own route list, which
 * tests/api/role-matrix.test.ts holds equal to the role table, so a new route is walked too.
 */
const beyondBigint = '99999999999999999999';
/** One past the largest bigint (9223372036854775807): the first id that cannot be a record. */
const justBeyondBigint = '9223372036854775808';

let t: Awaited<ReturnType<typeof testApp>>;
let token: string;
beforeAll(async () => {
  t = await testApp();
  token = (await t.signedIn('admin')).token;
});
afterAll(() => t.close());

const idRoutes = () => (t.app.locals.apiRoutes as string[]).filter((route) => route.includes(':id'));

async function call(method: string, url: string, body?: unknown) {
  const req = t.http()[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](url);
  req.set('Authorization', `Bearer ${token}`);
  return method === 'GET' ? await req : await req.send((body ?? {}) as object);
}

it('walks at least the 40 routes with an :id', () => {
  expect(idRoutes().length).toBeGreaterThanOrEqual(40);
});

it.each([beyondBigint, justBeyondBigint])('answers every :id route with %s as not found, never 500', async (id) => {
  const answers: string[] = [];
  for (const route of idRoutes()) {
    const [method, path] = route.split(' ');
    const res = await call(method, path.replace(':id', id));
    const ok =
      (res.status === 404 && res.body.error.code === 'not_found' && /not found/.test(res.body.error.message)) ||
      // A write whose empty body is refused before the id is looked at names the body field at fault.
      (res.status === 400 && typeof res.body.error.field === 'string');
    if (!ok) answers.push(`${route} → ${res.status} ${JSON.stringify(res.body)}`);
  }
  expect(answers).toEqual([]);
});

it.each([
  ['/api/meter-runs?siteId=', 'siteId'],
  ['/api/readings?transmitterId=', 'transmitterId'],
  ['/api/alarms?meterRunId=', 'meterRunId'],
  ['/api/alarm-limits?meterRunId=', 'meterRunId'],
  ['/api/corrections?meterRunId=', 'meterRunId'],
  ['/api/reading-conflicts?meterRunId=', 'meterRunId'],
  ['/api/balance-groups?siteId=', 'siteId'],
  ['/api/audit-events?userId=', 'userId'],
])('refuses %s with an oversized id as 400 naming %s', async (url, field) => {
  const res = await call('GET', `${url}${beyondBigint}`);
  expect(res.status).toBe(400);
  expect(res.body.error.field).toBe(field);
});

it.each([
  ['/api/meter-runs', 'siteId', { tag: 'FT-1', name: 'Run 1' }],
  ['/api/transmitters', 'meterRunId', { tag: 'PT-1', measures: 'static-pressure', unit: 'kPa' }],
  ['/api/devices', 'siteId', { name: 'Gateway' }],
  ['/api/alarm-limits', 'meterRunId', {}],
])('refuses POST %s with an oversized %s as 400 naming it', async (url, field, rest) => {
  for (const id of [beyondBigint, Number(beyondBigint), 2 ** 60]) {
    const res = await call('POST', url, { ...rest, [field]: id });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  }
});
