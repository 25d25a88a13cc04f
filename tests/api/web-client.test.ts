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

it('serves the fonts the pages declare as WOFF2, never TTF, cached for a year', async () => {
  const page = await (await fetch(`${baseUrl}/sign-in`)).text();
  expect(page).not.toMatch(/\.ttf\b/);
  const urls = [...new Set([...page.matchAll(/url\((\/fonts\/[^)]+)\)/g)].map((m) => m[1]))];
  expect(urls.length).toBeGreaterThanOrEqual(4);
  for (const family of ['Inter_400Regular', 'Inter_500Medium', 'Inter_600SemiBold', 'Inter_700Bold'])
    expect(page).toContain(`font-family:${family};`);
  for (const url of urls) {
    const res = await fetch(`${baseUrl}${url}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('font/woff2');
    expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    // Every WOFF2 file starts with the signature "wOF2" (W3C WOFF File Format 2.0, §4.1).
    expect(
      Buffer.from(await res.arrayBuffer())
        .subarray(0, 4)
        .toString('latin1'),
    ).toBe('wOF2');
  }
});

it('sends the entry script compressed when the browser accepts brotli', async () => {
  const page = await (await fetch(`${baseUrl}/`)).text();
  const entry = page.match(/src="(\/_expo\/static\/js\/web\/entry-[^"]+\.js)"/)![1];
  const res = await fetch(`${baseUrl}${entry}`, { headers: { 'Accept-Encoding': 'br' } });
  expect(res.headers.get('content-encoding')).toBe('br');
  expect(res.headers.get('vary')).toMatch(/Accept-Encoding/);
  expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
});
