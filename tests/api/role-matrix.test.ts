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
  // calculations are part of "live view, trends, totals": every role
  'POST /api/calculations/flow': everyone,
};

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

it.each(cases)('%s as %s answers as the role table says', async (route, who, allowed) => {
  const [method, path] = route.split(' ');
  const url = path.replace(':id', '1');
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
