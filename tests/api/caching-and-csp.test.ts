import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import express from 'express';
import request from 'supertest';
import { testApp } from '../../server/test-support/app';
import { precompressWebClient } from '../../server/cli/web-export';
import { serveWebClient } from '../../server/web';

/** Issue 12 §10: API answers are never stored by a browser or proxy; the web client runs under a strict policy. */
let t: Awaited<ReturnType<typeof testApp>>;
beforeAll(async () => {
  t = await testApp();
});
afterAll(() => t.close());

describe('Cache-Control on the API', () => {
  it('marks the sign-in answer, token included, no-store', async () => {
    const user = await t.signedIn('operator');
    const res = await t.http().post('/api/auth/login').send({ email: user.email, password: user.password });
    expect(res.status).toBe(200);
    expect(res.body.token).toEqual(expect.any(String));
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it.each([
    ['a refused sign-in', 'post', '/api/auth/login', {}],
    ['the health answer', 'get', '/api/health', undefined],
    ['an answer without a token', 'get', '/api/sites', undefined],
    ['an unknown API path', 'get', '/api/no-such-thing', undefined],
    ['a body that is not JSON', 'post', '/api/auth/login', '{"email":'],
  ] as const)('marks %s no-store', async (_name, method, url, body) => {
    let req = t.http()[method](url);
    if (typeof body === 'string') req = req.set('Content-Type', 'application/json');
    const res = body === undefined ? await req : await req.send(body);
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('marks a signed-in read no-store', async () => {
    const { token } = await t.signedIn('engineer');
    const res = await t.http().get('/api/sites').set('Authorization', `Bearer ${token}`);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('Content-Security-Policy of the web client', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-csp-'));
  const script = 'globalThis.__BOOT__=true;';
  const style = 'html,body{height:100%}';
  fs.writeFileSync(
    path.join(dir, 'index.html'),
    `<!DOCTYPE html><html><head><style id="reset">${style}</style><script type="module">${script}</script>` +
      `<script src="/entry.js" defer></script></head><body><div style="width:2px"></div></body></html>`,
  );
  fs.mkdirSync(path.join(dir, 'meter-runs'));
  fs.writeFileSync(path.join(dir, 'meter-runs', '[id].html'), '<html><script>window.deep=1</script></html>');
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  const app = express();
  app.get('/api/ping', (_req, res) => res.json({ ok: true }));
  serveWebClient(app, dir);
  /** The hash a browser computes for an inline block (CSP Level 3 "hash-source"), computed here independently. */
  const hash = (text: string) => `'sha256-${crypto.createHash('sha256').update(text).digest('base64')}'`;

  const directives = async (url: string) => {
    const res = await request(app).get(url);
    expect(res.status).toBe(200);
    const header = res.headers['content-security-policy'] as string;
    return new Map(
      header
        .split(';')
        .map((d) => d.trim().split(/\s+/))
        .map(([name, ...values]) => [name, values]),
    );
  };

  it('allows only its own origin, with the inline blocks of the export by hash and never unsafe-inline scripts', async () => {
    const policy = await directives('/');
    expect(policy.get('default-src')).toEqual(["'self'"]);
    expect(policy.get('script-src')!.sort()).toEqual(["'self'", hash(script), hash('window.deep=1')].sort());
    expect(policy.get('style-src-elem')!.sort()).toEqual(["'self'", hash(style)].sort());
    expect(policy.get('img-src')).toEqual(["'self'", 'data:', 'blob:']);
    expect(policy.get('connect-src')).toEqual(["'self'"]);
    expect(policy.get('frame-ancestors')).toEqual(["'none'"]);
    expect(policy.get('object-src')).toEqual(["'none'"]);
    expect(policy.get('base-uri')).toEqual(["'self'"]);
    expect([...policy.values()].flat()).not.toContain("'unsafe-eval'");
    expect(policy.get('script-src')).not.toContain("'unsafe-inline'");
  });

  it('sends the same policy with a deep link answered by a pattern page', async () => {
    expect(await directives('/meter-runs/42')).toEqual(await directives('/'));
  });

  it('leaves API answers to the API', async () => {
    const res = await request(app).get('/api/ping');
    expect(res.headers['content-security-policy']).toBeUndefined();
  });
});

describe('Compression and caching of the web client files', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyrun-web-'));
  const script = `globalThis.rows = [${Array.from({ length: 2000 }, (_, i) => i).join(',')}];`;
  const hashed = 'entry-0123456789abcdef0123456789abcdef.js';
  const page = `<!DOCTYPE html><html><head><script src="/${hashed}" defer></script></head><body>${'<p>Tallyrun</p>'.repeat(200)}</body></html>`;
  fs.writeFileSync(path.join(dir, 'index.html'), page);
  fs.writeFileSync(path.join(dir, hashed), script);
  fs.writeFileSync(path.join(dir, 'manifest.json'), JSON.stringify({ name: 'x'.repeat(2000) }));
  precompressWebClient(dir);
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  const app = express();
  serveWebClient(app, dir);
  let server: http.Server;
  let port = 0;
  beforeAll(async () => {
    server = http.createServer(app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    port = (server.address() as AddressInfo).port;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  /** A raw GET: node:http leaves the body as sent, so the encoding is checked on the bytes themselves. */
  const get = (url: string, acceptEncoding?: string) =>
    new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
      const headers = acceptEncoding === undefined ? {} : { 'Accept-Encoding': acceptEncoding };
      http
        .get({ host: '127.0.0.1', port, path: url, headers }, (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (chunk: Buffer) => chunks.push(chunk));
          res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
        })
        .on('error', reject);
    });

  it('answers a request with Accept-Encoding br with the brotli copy, its own Content-Type and Vary', async () => {
    const res = await get(`/${hashed}`, 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['vary']).toMatch(/Accept-Encoding/);
    expect(res.headers['content-type']).toMatch(/^(application|text)\/javascript/);
    expect(zlib.brotliDecompressSync(res.body).toString('utf8')).toBe(script);
    expect(res.body.length).toBeLessThan(Buffer.byteLength(script) / 2);
  });

  it('answers a request that accepts only gzip with the gzip copy and Vary', async () => {
    const res = await get(`/${hashed}`, 'gzip');
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['vary']).toMatch(/Accept-Encoding/);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(zlib.gunzipSync(res.body).toString('utf8')).toBe(script);
  });

  it('answers a request without Accept-Encoding, or with identity only, with the plain file and Vary', async () => {
    for (const acceptEncoding of [undefined, 'identity']) {
      const res = await get(`/${hashed}`, acceptEncoding);
      expect(res.headers['content-encoding']).toBeUndefined();
      expect(res.headers['vary']).toMatch(/Accept-Encoding/);
      expect(res.body.toString('utf8')).toBe(script);
    }
  });

  it('compresses the pages too, keeping their HTML Content-Type', async () => {
    const res = await get('/', 'br');
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(zlib.brotliDecompressSync(res.body).toString('utf8')).toBe(page);
    expect((await get('/manifest.json', 'gzip')).headers['content-type']).toMatch(/^application\/json/);
  });

  it('marks a file whose name carries a content hash immutable for a year', async () => {
    const res = await get(`/${hashed}`, 'br');
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('makes index.html and files without a hash in their name revalidate', async () => {
    for (const url of ['/', '/index.html', '/manifest.json']) {
      expect((await get(url, 'gzip')).headers['cache-control']).toBe('no-cache');
    }
  });

  it('never serves the compressed copies or dotfiles as files of their own', async () => {
    fs.writeFileSync(path.join(dir, '.export-stamp'), 'x');
    expect((await get(`/${hashed}.br`)).headers['content-type']).toMatch(/^text\/html/);
    expect((await get('/.export-stamp')).body.toString('utf8')).not.toBe('x');
    expect((await get('/..%2f..%2fetc%2fpasswd')).body.toString('utf8')).not.toMatch(/root:/);
  });
});
