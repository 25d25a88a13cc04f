/**
 * The API client against a real HTTP server (node:http on a free port) and the real fetch: the
 * bearer token, the query string, the server's `{ error: { code, message, field } }` bodies and
 * the fallbacks for bodies that are not the API's.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { z } from 'zod';

import type * as clientModule from './client';

type Client = typeof clientModule;

interface Seen {
  method?: string;
  url?: string;
  authorization?: string;
  contentType?: string;
  body: string;
}

let server: Server;
let baseUrl: string;
let client: Client;
let seen: Seen;
let unauthorizedCalls: number;
let token: string | null;

/** What the test server answers, by path. */
function answer(req: IncomingMessage, res: ServerResponse): void {
  const path = (req.url ?? '').split('?')[0];
  const json = (status: number, body: unknown) => {
    res.writeHead(status, { 'Content-Type': 'application/json' });
    res.end(JSON.stringify(body));
  };
  if (path === '/api/things') return json(200, { id: '7', name: 'Meter run 7' });
  if (path === '/api/echo') return json(200, { ok: true });
  if (path === '/api/empty') return void res.writeHead(204).end();
  if (path === '/api/invalid')
    return json(400, { error: { code: 'invalid_body', message: 'name: is required', field: 'name' } });
  if (path === '/api/conflict') return json(409, { error: { code: 'already_acknowledged', message: 'Already.' } });
  if (path === '/api/forbidden') return void res.writeHead(403).end();
  if (path === '/api/unauthorized') return json(401, { error: { code: 'unauthorized', message: 'Token expired.' } });
  if (path === '/api/bad-gateway') {
    res.writeHead(502, { 'Content-Type': 'text/html' });
    return void res.end('<html><body>Bad gateway</body></html>');
  }
  if (path === '/api/teapot') return json(418, { error: { code: 42, message: '' } });
  // Never answers: the request is aborted first, and afterAll closes the connection.
  if (path === '/api/slow') return;
  json(404, { error: { code: 'not_found', message: 'Not found.' } });
}

beforeAll(async () => {
  server = createServer((req, res) => {
    let body = '';
    req.on('data', (chunk) => (body += chunk));
    req.on('end', () => {
      seen = {
        method: req.method,
        url: req.url,
        authorization: req.headers.authorization,
        contentType: req.headers['content-type'],
        body,
      };
      answer(req, res);
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  // constants/config.ts reads the API base once, when it is first imported.
  process.env.EXPO_PUBLIC_API_URL = `${baseUrl}/api/`;
  client = await import('./client');
});

afterAll(async () => {
  delete process.env.EXPO_PUBLIC_API_URL;
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
});

beforeEach(() => {
  unauthorizedCalls = 0;
  token = 'token-123';
  client.configureApiClient({ getToken: () => token, onUnauthorized: () => unauthorizedCalls++ });
});

const thing = z.object({ id: z.string(), name: z.string() });
const ok = z.object({ ok: z.literal(true) });

/** The ApiError a request fails with. */
async function failure(request: Parameters<Client['apiRequest']>[0]) {
  try {
    await client.apiRequest(request);
  } catch (error) {
    return error as InstanceType<Client['ApiError']>;
  }
  throw new Error(`expected ${request.path} to fail`);
}

describe('ApiError and isApiError', () => {
  it('carries the status, the stable code, the message and the field', () => {
    const error = new client.ApiError(400, 'invalid_body', 'name: is required', 'name');
    expect(error).toBeInstanceOf(Error);
    expect(error).toMatchObject({ name: 'ApiError', status: 400, code: 'invalid_body', field: 'name' });
    expect(error.message).toBe('name: is required');
  });

  it('tells an ApiError of a given status from any other error', () => {
    const conflict = new client.ApiError(409, 'already_acknowledged', 'Already.');
    expect(client.isApiError(conflict)).toBe(true);
    expect(client.isApiError(conflict, 409)).toBe(true);
    expect(client.isApiError(conflict, 400)).toBe(false);
    expect(client.isApiError(new Error('409'), 409)).toBe(false);
    expect(client.isApiError({ status: 409, code: 'x' }, 409)).toBe(false);
  });
});

describe('apiRequest', () => {
  it('returns the body parsed by the schema and sends the bearer token', async () => {
    await expect(client.apiRequest({ path: '/things', schema: thing })).resolves.toEqual({
      id: '7',
      name: 'Meter run 7',
    });
    expect(seen).toMatchObject({ method: 'GET', url: '/api/things', authorization: 'Bearer token-123' });
  });

  it('sends no token on a request marked unauthenticated, such as sign-in', async () => {
    await client.apiRequest({ path: '/echo', schema: ok, authenticated: false });
    expect(seen.authorization).toBeUndefined();
  });

  it('sends no token when no one is signed in', async () => {
    token = null;
    await client.apiRequest({ path: '/echo', schema: ok });
    expect(seen.authorization).toBeUndefined();
  });

  it('writes the query string, leaving out parameters that are undefined', async () => {
    await client.apiRequest({ path: '/echo', schema: ok, query: { site: 3, state: 'active', meterRun: undefined } });
    expect(seen.url).toBe('/api/echo?site=3&state=active');
  });

  it('sends a body as JSON with its content type', async () => {
    await client.apiRequest({ method: 'POST', path: '/echo', schema: ok, body: { name: 'Run 1', beta: 0.5 } });
    expect(seen).toMatchObject({ method: 'POST', contentType: 'application/json' });
    expect(JSON.parse(seen.body)).toEqual({ name: 'Run 1', beta: 0.5 });
  });

  it('reads a 204 as no body', async () => {
    await expect(client.apiRequest({ method: 'DELETE', path: '/empty', schema: z.null() })).resolves.toBeNull();
  });

  it('turns the server’s error body into an ApiError naming the field', async () => {
    const error = await failure({ method: 'POST', path: '/invalid', schema: ok, body: {} });
    expect(error).toMatchObject({ status: 400, code: 'invalid_body', message: 'name: is required', field: 'name' });
  });

  it('keeps the server’s stable code of a conflict', async () => {
    expect(await failure({ path: '/conflict', schema: ok })).toMatchObject({
      status: 409,
      code: 'already_acknowledged',
      message: 'Already.',
      field: undefined,
    });
  });

  it('says what a status means when the body has no message', async () => {
    expect(await failure({ path: '/forbidden', schema: ok })).toMatchObject({
      status: 403,
      code: 'http_403',
      message: 'Your role does not allow this.',
    });
  });

  it('falls back to the status for a body that is not JSON, such as a proxy’s error page', async () => {
    expect(await failure({ path: '/bad-gateway', schema: ok })).toMatchObject({
      status: 502,
      code: 'http_502',
      message: 'The server answered 502.',
    });
  });

  it('ignores an error body whose code is not text and whose message is empty', async () => {
    expect(await failure({ path: '/teapot', schema: ok })).toMatchObject({
      status: 418,
      code: 'http_418',
      message: 'The server answered 418.',
    });
  });

  it('ends the session on a 401 to a request that carried a token', async () => {
    expect(await failure({ path: '/unauthorized', schema: ok })).toMatchObject({ status: 401, code: 'unauthorized' });
    expect(unauthorizedCalls).toBe(1);
  });

  it('leaves the session alone on a 401 to sign-in, which carries no token', async () => {
    await failure({ method: 'POST', path: '/unauthorized', schema: ok, authenticated: false });
    expect(unauthorizedCalls).toBe(0);
  });

  it('refuses an answer of the wrong shape, naming the request', async () => {
    expect(await failure({ path: '/echo', schema: thing })).toMatchObject({
      status: 200,
      code: 'unexpected_response',
      message: "The server's answer to GET /echo was not in the expected shape.",
    });
  });

  it('says the server cannot be reached when nothing listens, with status 0', async () => {
    const closed = createServer();
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', resolve));
    const port = (closed.address() as AddressInfo).port;
    await new Promise((resolve) => closed.close(resolve));
    const original = process.env.EXPO_PUBLIC_API_URL;
    let isolated: Client | undefined;
    process.env.EXPO_PUBLIC_API_URL = `http://127.0.0.1:${port}/api`;
    jest.isolateModules(() => {
      isolated = jest.requireActual<Client>('./client');
    });
    process.env.EXPO_PUBLIC_API_URL = original;
    const error = await isolated!.apiRequest({ path: '/things', schema: thing }).catch((e: unknown) => e);
    expect(error).toMatchObject({
      status: 0,
      code: 'network_error',
      message: 'Cannot reach the Tallyrun server. Check the connection and try again.',
    });
  });

  it('lets an abort through as it is, so a cancelled query is not shown as an error', async () => {
    const controller = new AbortController();
    const pending = client.apiRequest({ path: '/slow', schema: ok, signal: controller.signal });
    controller.abort();
    await expect(pending).rejects.toMatchObject({ name: 'AbortError' });
  });
});
