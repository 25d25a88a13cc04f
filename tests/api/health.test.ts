/**
 * The running server that `npm test` started (real PostgreSQL, real broker, exported client).
 */
const baseUrl = process.env.TALLYRUN_BASE_URL ?? 'http://127.0.0.1:8080';

it('reports the database and the broker up, in exactly the shape of the design', async () => {
  const res = await fetch(`${baseUrl}/api/health`);
  expect(res.status).toBe(200);
  expect(await res.json()).toEqual({ status: 'ok', database: 'up', broker: 'up' });
});

it('serves the sign-in page of the web client', async () => {
  const res = await fetch(`${baseUrl}/sign-in`);
  expect(res.status).toBe(200);
  expect(res.headers.get('content-type')).toMatch(/text\/html/);
});

it('signs in a demo user with the demo password', async () => {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({
      email: 'operator@demo.tallyrun',
      password: process.env.TALLYRUN_DEMO_PASSWORD ?? 'tallyrun-demo',
    }),
  });
  expect(res.status).toBe(200);
  expect((await res.json()).user.role).toBe('operator');
});
