import type { AddressInfo } from 'node:net';
import { testApp } from '../../server/test-support/app';

/**
 * Every API route, for every role and for no token. The expectations are written out here
 * from the role table of the product design (DESIGN.md "Roles"), not imported from the server's
 * own matrix, so a wrong entry there fails here. A route added to the server without a line
 * here fails the first test.
 */
type Who = 'operator' | 'engineer' | 'accountant' | 'admin';
const everyone: Who[] = ['operator', 'engineer', 'accountant', 'admin'];
const PUBLIC = 'public' as const;

const expected: Record<string, Who[] | typeof PUBLIC> = {
  'GET /api/health': PUBLIC,
  'POST /api/auth/login': PUBLIC,
  'GET /api/auth/me': everyone,
  // users, device credentials, mail outbox: admin only
  'GET /api/users': ['admin'],
  'POST /api/users': ['admin'],
  'PATCH /api/users/:id': ['admin'],
  'GET /api/mail': ['admin'],
  // audit log: read by engineer, accountant, admin
  'GET /api/audit-events': ['engineer', 'accountant', 'admin'],
  'GET /api/audit-events/actors': ['engineer', 'accountant', 'admin'],
  // calculations are part of "live view, trends, totals": every role
  'POST /api/calculations/flow': everyone,
  // live view, trends, totals: every role reads set-up, readings, history and the live board
  'GET /api/sites': everyone,
  'GET /api/sites/:id': everyone,
  // what is due in the care of a site's meters (issue 11 §4): every role reads
  'GET /api/sites/:id/care-due': everyone,
  'GET /api/meter-runs': everyone,
  'GET /api/meter-runs/:id': everyone,
  'GET /api/meter-runs/:id/config-versions': everyone,
  'GET /api/meter-runs/:id/setting-versions': everyone,
  'GET /api/meter-runs/:id/element-calibrations': everyone,
  'GET /api/meter-runs/:id/gas-analyses': everyone,
  'GET /api/meter-runs/:id/inspections': everyone,
  'GET /api/meter-runs/:id/totals': everyone,
  'GET /api/meter-runs/:id/hourly-records': everyone,
  'GET /api/meter-runs/:id/trend': everyone,
  'GET /api/meter-runs/:id/recompute-status': everyone,
  'GET /api/transmitters': everyone,
  'GET /api/transmitters/:id': everyone,
  'GET /api/readings': everyone,
  'GET /api/live/board': everyone,
  'GET /api/live/stream': everyone,
  // sites, meter runs, transmitters, configuration versions: engineer and admin
  'POST /api/sites': ['engineer', 'admin'],
  'PATCH /api/sites/:id': ['engineer', 'admin'],
  'POST /api/meter-runs': ['engineer', 'admin'],
  'PATCH /api/meter-runs/:id': ['engineer', 'admin'],
  'POST /api/meter-runs/:id/config-versions': ['engineer', 'admin'],
  'POST /api/meter-runs/:id/element-calibrations': ['engineer', 'admin'],
  'POST /api/meter-runs/:id/gas-analyses': ['engineer', 'admin'],
  'POST /api/meter-runs/:id/inspections': ['engineer', 'admin'],
  'POST /api/transmitters': ['engineer', 'admin'],
  'PATCH /api/transmitters/:id': ['engineer', 'admin'],
  // calibrations with certificates (issue 11 §1): every role reads and downloads; engineer and admin record
  'GET /api/transmitters/:id/calibrations': everyone,
  'POST /api/transmitters/:id/calibrations': ['engineer', 'admin'],
  'GET /api/calibrations/:id/certificate': everyone,
  // a failed as-found's correction proposal (issue 11 §4): engineer and admin, who propose corrections
  'GET /api/calibrations/:id/correction-proposal': ['engineer', 'admin'],
  // element care certificates (issue 11 §2, §3): every role downloads
  'GET /api/element-calibrations/:id/certificate': everyone,
  'GET /api/gas-analyses/:id/certificate': everyone,
  'GET /api/element-inspections/:id/certificate': everyone,
  // import readings and field totals: engineer and admin
  'GET /api/imports': ['engineer', 'admin'],
  'GET /api/imports/:id': ['engineer', 'admin'],
  'GET /api/imports/:id/original': ['engineer', 'admin'],
  'POST /api/imports': ['engineer', 'admin'],
  // device credentials: admin
  'GET /api/devices': ['admin'],
  'POST /api/devices': ['admin'],
  'PATCH /api/devices/:id': ['admin'],
  'GET /api/devices/:id/rejections': ['admin'],
  // alarms (issue 5): every role reads; acknowledge and shelve: operator, engineer, admin;
  // out of service is maintenance of the alarm system, like configuration: engineer, admin
  'GET /api/alarms': everyone,
  'GET /api/alarms/counts': everyone,
  'GET /api/alarms/:id': everyone,
  'GET /api/alarms/:id/events': everyone,
  'POST /api/alarms/:id/acknowledge': ['operator', 'engineer', 'admin'],
  'POST /api/alarms/:id/shelve': ['operator', 'engineer', 'admin'],
  'POST /api/alarms/:id/unshelve': ['operator', 'engineer', 'admin'],
  'POST /api/alarms/:id/out-of-service': ['engineer', 'admin'],
  'POST /api/alarms/:id/return-to-service': ['engineer', 'admin'],
  // monthly alarm performance per site (issue 13 item 9): every role reads
  'GET /api/alarm-performance': everyone,
  // alarm limits are part of a meter run's configuration: engineer and admin change them; all read
  'GET /api/alarm-limits': everyone,
  'POST /api/alarm-limits': ['engineer', 'admin'],
  'DELETE /api/alarm-limits/:id': ['engineer', 'admin'],
  // range health is a view of totals and trends: every role reads it
  'GET /api/meter-runs/:id/range-health': everyone,
  // record versions are part of the history (issue 9): every role reads them
  'GET /api/meter-runs/:id/hourly-records/versions': everyone,
  'GET /api/meter-runs/:id/totals/versions': everyone,
  // corrections (issue 9): every role reads them; engineer and admin propose, estimate and decide
  'GET /api/corrections': everyone,
  'GET /api/corrections/estimate': ['engineer', 'admin'],
  'GET /api/corrections/:id': everyone,
  'POST /api/corrections': ['engineer', 'admin'],
  'POST /api/corrections/:id/approve': ['engineer', 'admin'],
  'POST /api/corrections/:id/reject': ['engineer', 'admin'],
  // month end (issue 10): every role reads the monthly volumes; engineer, accountant and admin export them
  'GET /api/monthly-volumes': everyone,
  'GET /api/exports/monthly-volumes': ['engineer', 'accountant', 'admin'],
  'GET /api/exports/monthly-statement': ['engineer', 'accountant', 'admin'],
  // conflicts of re-sent readings (issue 9): every role lists them; those who propose corrections resolve them
  'GET /api/reading-conflicts': everyone,
  'POST /api/reading-conflicts/:id/resolve': ['engineer', 'admin'],
  // balance groups (issue 10): balances are in the view row, every role reads; defining a group is configuration
  'GET /api/balance-groups': everyone,
  'GET /api/balance-groups/:id': everyone,
  'GET /api/balance-groups/:id/balance': everyone,
  'GET /api/balance-groups/:id/allocation': everyone,
  'POST /api/balance-groups': ['engineer', 'admin'],
  // period close (issue 10): every role reads a month's status; accountant and admin close; admin reopens
  'GET /api/periods/:month': everyone,
  'POST /api/periods/:month/close': ['accountant', 'admin'],
  'POST /api/periods/:month/reopen': ['admin'],
  // reconciliation against field totals (issue 10): a view of totals, every role reads; the tolerance is configuration
  'GET /api/reconciliations': everyone,
  'GET /api/reconciliations/summary': everyone,
  'PATCH /api/reconciliations/tolerances/:id': ['engineer', 'admin'],
  'GET /api/reconciliations/tolerances/:id': everyone,
};

/** Routes that stream (server-sent events): checked on a real socket, status only. */
const streaming = new Set(['GET /api/live/stream']);

let t: Awaited<ReturnType<typeof testApp>>;
const tokens = {} as Record<Who, string>;
beforeAll(async () => {
  t = await testApp();
  for (const role of everyone) tokens[role] = (await t.signedIn(role)).token;
});
afterAll(() => t.close());

it('has an expectation for every route the server has, and no expectation for a route it lacks', () => {
  expect([...(t.app.locals.apiRoutes as string[])].sort()).toEqual(Object.keys(expected).sort());
});

const cases = Object.entries(expected).flatMap(([route, allowed]) =>
  [...everyone, 'no token' as const].map((who) => [route, who, allowed] as const),
);

async function streamStatus(url: string, token: string | null) {
  const server = t.app.listen(0);
  const port = (server.address() as AddressInfo).port;
  const abort = new AbortController();
  try {
    const res = await fetch(`http://127.0.0.1:${port}${url}`, {
      headers: token ? { Authorization: `Bearer ${token}` } : {},
      signal: abort.signal,
    });
    return res.status;
  } finally {
    abort.abort();
    server.closeAllConnections();
    await new Promise((r) => server.close(r));
  }
}

it.each(cases)('%s as %s answers as the role table says', async (route, who, allowed) => {
  const [method, path] = route.split(' ');
  const url = path.replace(':id', '1');
  if (streaming.has(route)) {
    const status = await streamStatus(url, who === 'no token' ? null : tokens[who]);
    if (who === 'no token') expect(status).toBe(401);
    else if (allowed === PUBLIC || allowed.includes(who)) expect(status).toBe(200);
    else expect(status).toBe(403);
    return;
  }
  let req = t.http()[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](url);
  if (who !== 'no token') req = req.set('Authorization', `Bearer ${tokens[who]}`);
  // An empty body: allowed callers get past the gate and are stopped by validation (400) at most.
  const res = method === 'GET' ? await req : await req.send({});
  if (allowed === PUBLIC) {
    expect([401, 403]).not.toContain(res.status);
  } else if (who === 'no token') {
    expect(res.status).toBe(401);
  } else if (allowed.includes(who)) {
    expect([401, 403]).not.toContain(res.status);
  } else {
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  }
});
