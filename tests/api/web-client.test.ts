import { baseUrl } from '../support/api';

/** Express serves the exported client: every route, deep links included, without redirects. */
it.each(['/', '/sign-in', '/setup', '/meter-runs', '/meter-runs/42', '/range-check', '/alarms'])(
  'answers %s with the page itself (200, HTML, no redirect)',
  async (path) => {
    const res = await fetch(`${baseUrl}${path}`, { redirect: 'manual' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/text\/html/);
  },
);

it('answers an unknown page with the not-found page and 404', async () => {
  const res = await fetch(`${baseUrl}/no/such/page`, { redirect: 'manual' });
  expect(res.status).toBe(404);
});

it('answers an unknown API path with JSON, not the web client', async () => {
  const res = await fetch(`${baseUrl}/api/no-such-thing`);
  expect(res.status).toBe(401);
  expect(await res.json()).toMatchObject({ error: { code: 'unauthorized' } });
});
