/**
 * A small client of the running server that `npm test` started (TALLYRUN_BASE_URL), for
 * cross-package tests that go through HTTP, the broker and the history worker for real.
 */
export const baseUrl = process.env.TALLYRUN_BASE_URL ?? 'http://127.0.0.1:8080';
export const mqttPort = Number(process.env.TALLYRUN_MQTT_PORT ?? 1883);
export const demoPassword = process.env.TALLYRUN_DEMO_PASSWORD ?? 'tallyrun-demo';

export interface Answer<T = any> {
  status: number;
  body: T;
}

export async function signIn(email: string, password = demoPassword): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email}: ${res.status}`);
  return (await res.json()).token;
}

export function client(token: string, serverUrl = baseUrl) {
  const call = async <T = any>(method: string, path: string, body?: unknown): Promise<Answer<T>> => {
    const res = await fetch(`${serverUrl}${path}`, {
      method,
      headers: {
        Authorization: `Bearer ${token}`,
        ...(body !== undefined && !(body instanceof FormData) ? { 'content-type': 'application/json' } : {}),
      },
      body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body),
    });
    const text = await res.text();
    return { status: res.status, body: text ? JSON.parse(text) : null };
  };
  return {
    get: <T = any>(path: string) => call<T>('GET', path),
    post: <T = any>(path: string, body?: unknown) => call<T>('POST', path, body ?? {}),
    patch: <T = any>(path: string, body?: unknown) => call<T>('PATCH', path, body ?? {}),
    /** Uploads a CSV as multipart form field "file". */
    upload: <T = any>(path: string, filename: string, csv: string, fields: Record<string, string> = {}) => {
      const form = new FormData();
      for (const [k, v] of Object.entries(fields)) form.append(k, v);
      form.append('file', new Blob([csv], { type: 'text/csv' }), filename);
      return call<T>('POST', path, form);
    },
  };
}

export type Client = ReturnType<typeof client>;

export const unique = () => Math.random().toString(36).slice(2, 8).toUpperCase();

export async function until<T>(
  what: string,
  probe: () => Promise<T | null | undefined | false>,
  timeoutMs = 30_000,
): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Waits until the history worker has no hour of this meter run left to recompute. */
export async function settled(api: Client, meterRunId: string, timeoutMs = 60_000) {
  await until(
    `meter run ${meterRunId} to settle`,
    async () => (await api.get(`/api/meter-runs/${meterRunId}/recompute-status`)).body.pendingHours === 0,
    timeoutMs,
  );
}

/**
 * A site, a meter run and its DP, static pressure and temperature transmitters, made through
 * the API as an engineer would, with unique codes so tests can share the database. The orifice
 * is TRADE.md's O2 geometry (pvtlib): D = 0.3 m, d = 0.1 m, flange taps; the gas is an ideal
 * gas with fixed properties, so the engine's rate for a constant input is easy to reason about.
 */
export async function createMeterRun(
  api: Client,
  options: { timeZone?: string; contractHour?: number; maxGapS?: number; holdLimitS?: number } = {},
) {
  const id = unique();
  const site = await api.post('/api/sites', {
    code: `T${id}`,
    name: `Test site ${id}`,
    timeZone: options.timeZone ?? 'America/Denver',
    contractHour: options.contractHour ?? 9,
    basePressurePa: 101325,
    baseTemperatureK: 288.15,
    atmosphericPressurePa: 101325,
  });
  if (site.status !== 201) throw new Error(`site: ${site.status} ${JSON.stringify(site.body)}`);
  const element = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 };
  const fluid = {
    kind: 'ideal-gas',
    molarMassKgPerMol: 0.01804,
    compressibility: 1,
    isentropicExponent: 1.2,
    viscosityPaS: 1.12e-5,
  };
  const run = await api.post('/api/meter-runs', {
    siteId: site.body.id,
    tag: `MR-${id}`,
    name: `Test meter run ${id}`,
    element,
    fluid,
    holdLimitS: options.holdLimitS ?? 3600,
    maxGapS: options.maxGapS ?? 900,
    effectiveFrom: '2020-01-01T00:00:00Z',
  });
  if (run.status !== 201) throw new Error(`meter run: ${run.status} ${JSON.stringify(run.body)}`);
  const transmitter = async (suffix: string, body: Record<string, unknown>) => {
    const res = await api.post('/api/transmitters', { meterRunId: run.body.id, tag: `MR-${id}-${suffix}`, ...body });
    if (res.status !== 201) throw new Error(`transmitter ${suffix}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body as { id: string; tag: string };
  };
  const dp = await transmitter('DP', { measures: 'differential-pressure', unit: 'kPa', lowerRange: 0, upperRange: 50 });
  const pt = await transmitter('PT', {
    measures: 'static-pressure',
    unit: 'MPa',
    pressureReference: 'absolute',
    lowerRange: 0,
    upperRange: 4,
  });
  const tt = await transmitter('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 });
  return {
    site: site.body as { id: string; code: string },
    meterRun: run.body as { id: string; tag: string },
    element,
    fluid,
    dp,
    pt,
    tt,
  };
}

/** The engine's mass flow for a constant input, from the server's own calculation endpoint. */
export async function engineRate(
  api: Client,
  element: unknown,
  fluid: unknown,
  dpPa: number,
  pPa: number,
  tK: number,
): Promise<number> {
  const res = await api.post('/api/calculations/flow', {
    element,
    fluid,
    conditions: { differentialPressurePa: dpPa, staticPressurePa: pPa, temperatureK: tK },
  });
  if (res.status !== 200) throw new Error(`calculation: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.massFlowKgPerS;
}
