import { client, createMeterRun, engineRate, settled, signIn, until, type Client } from '../support/api';

/**
 * Element care records through the real server (issue 11 §2, §3): a gas analysis and a
 * laboratory calibration each become a configuration version dated at the sample or the
 * calibration, and the history worker recomputes from there. Masses are checked as in
 * config-history.test.ts (constant input: an hour is the engine's rate × 3600 s); the
 * uncertainty against ISO 5167-1:2003 §8 by hand (C enters with sensitivity 1).
 */
let api: Client;
let operator: Client;
beforeAll(async () => {
  api = client(await signIn('engineer@demo.tallyrun'));
  operator = client(await signIn('operator@demo.tallyrun'));
});

const hourMs = 3_600_000;
const relative = (a: number, b: number) => Math.abs(a / b - 1);
/** The gas of the demo scenario (SCENARIO.md, Kestrel Flats), mole fractions. */
const scenarioGas = {
  kind: 'natural-gas',
  composition: {
    methane: 0.9137,
    ethane: 0.0421,
    propane: 0.0112,
    isobutane: 0.0021,
    'n-butane': 0.0028,
    isopentane: 0.0008,
    'n-pentane': 0.0007,
    'n-hexane': 0.0006,
    nitrogen: 0.0148,
    'carbon-dioxide': 0.0112,
  },
};

type Hour = { start: string; massKg: number; flags: string[]; uncertaintyPercent: number | null };

/** A meter run on natural gas with six hours of constant readings from h0 (25 kPa, 2 MPa, 300 K). */
async function meterRunWithSixHours(h0: number) {
  const f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0, maxGapS: 900 });
  const gas = await api.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
    effectiveFrom: new Date(h0 - 24 * hourMs).toISOString(),
    element: f.element,
    fluid: scenarioGas,
    reason: 'natural gas from the day before the readings',
  });
  expect(gas.status).toBe(201);
  const lines = ['time,tag,value,quality'];
  for (let t = h0; t < h0 + 6 * hourMs; t += 10 * 60_000) {
    const iso = new Date(t).toISOString();
    lines.push(`${iso},${f.dp.tag},25,good`, `${iso},${f.pt.tag},2,good`, `${iso},${f.tt.tag},300,good`);
  }
  const started = await api.upload('/api/imports', 'readings.csv', lines.join('\n') + '\n');
  expect(started.status).toBe(202);
  await until('the import to finish', async () => {
    const r = await api.get(`/api/imports/${started.body.id}`);
    return r.body.status !== 'running' ? r.body : null;
  });
  await settled(api, f.meterRun.id);
  const hours = async () =>
    (
      await api.get(
        `/api/meter-runs/${f.meterRun.id}/hourly-records?from=${new Date(h0).toISOString()}&to=${new Date(h0 + 6 * hourMs).toISOString()}`,
      )
    ).body as Hour[];
  return { ...f, hours };
}

describe('a gas analysis dated last week', () => {
  const h0 = Math.floor((Date.now() - 7 * 24 * hourMs) / hourMs) * hourMs;
  let f: Awaited<ReturnType<typeof meterRunWithSixHours>>;
  const sample = { methane: 95, ethane: 3, propane: 0.5, N2: 1, CO2: 0.5 };
  const composition = { methane: 0.95, ethane: 0.03, propane: 0.005, nitrogen: 0.01, 'carbon-dioxide': 0.005 };

  beforeAll(async () => {
    f = await meterRunWithSixHours(h0);
  });

  it('recomputes from its sample date, no hour before, and the configuration history shows it', async () => {
    const before = await f.hours();
    expect(before).toHaveLength(6);
    const sampledAt = new Date(h0 + 2 * hourMs).toISOString();
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/gas-analyses`, {
      sampledAt,
      laboratory: 'Test gas laboratory',
      certificate: 'GA-0001',
      components: sample,
    });
    expect(res.status).toBe(201);
    expect(res.body).toEqual(
      expect.objectContaining({ sampledAt, laboratory: 'Test gas laboratory', composition, components: sample }),
    );
    expect(res.body.configVersion.effectiveFrom).toBe(sampledAt);
    // h0+2 … h0+5 hold readings, and the last one (h0+5:50) still feeds the first seconds of h0+6
    // under the hold limit, so that hour is a record too: five hours from the sample on.
    expect(res.body.configVersion.recompute).toEqual({ from: sampledAt, hours: 5 });
    expect(res.body.configVersion.fluid).toEqual({ kind: 'natural-gas', composition });
    expect(res.body.configVersion.element).toEqual(f.element);

    const history = (await api.get(`/api/meter-runs/${f.meterRun.id}/config-versions`)).body as {
      id: string;
      effectiveFrom: string;
      changes: { path: string }[];
    }[];
    const shown = history.find((v) => v.id === res.body.configVersionId);
    expect(shown?.effectiveFrom).toBe(sampledAt);
    expect(shown?.changes.map((c) => c.path)).toContain('fluid.composition.methane');

    await settled(api, f.meterRun.id);
    const after = await f.hours();
    const newRate = await engineRate(api, f.element, { kind: 'natural-gas', composition }, 25_000, 2e6, 300);
    for (let i = 0; i < 2; i++) expect(after[i].massKg).toBe(before[i].massKg);
    for (let i = 2; i < 6; i++) {
      expect(after[i].massKg).not.toBe(before[i].massKg);
      expect(relative(after[i].massKg, newRate * 3600)).toBeLessThan(1e-9);
    }

    const listed = await operator.get(`/api/meter-runs/${f.meterRun.id}/gas-analyses`);
    expect(listed.status).toBe(200);
    expect(listed.body.map((a: { id: string }) => a.id)).toEqual([res.body.id]);
  });

  it('refuses a composition that does not sum to 1 within the tolerance, naming components, and records nothing', async () => {
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/gas-analyses`, {
      sampledAt: new Date(h0 + 3 * hourMs).toISOString(),
      laboratory: 'Test gas laboratory',
      components: { methane: 0.95, ethane: 0.0498 },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('components');
    const listed = await api.get(`/api/meter-runs/${f.meterRun.id}/gas-analyses`);
    expect(listed.body).toHaveLength(1);
  });
});

describe('a laboratory calibration of the primary element', () => {
  const h0 = Math.floor((Date.now() - 5 * 24 * hourMs) / hourMs) * hourMs;
  let f: Awaited<ReturnType<typeof meterRunWithSixHours>>;

  beforeAll(async () => {
    f = await meterRunWithSixHours(h0);
  });

  it("takes U(C) from its certificate and flags the hours whose Re_D lies outside the certificate's range", async () => {
    const before = await f.hours();
    expect(before[0].flags).not.toContain('outside-calibration-range');
    const calibratedAt = new Date(h0 + 3 * hourMs).toISOString();
    // Re_D of 25 kPa of this gas through D = 0.3 m, β = 1/3 is far above 2e4: every hour is outside the curve.
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/element-calibrations`, {
      calibratedAt,
      laboratory: 'Test flow laboratory',
      certificate: 'FC-0001',
      uncertaintyPercent: 2,
      pointsCsv: 'reynoldsNumber,dischargeCoefficient\n1e3,0.601\n2e4,0.603\n',
    });
    expect(res.status).toBe(201);
    // h0+3 … h0+5, and h0+6 fed by the last reading under the hold limit.
    expect(res.body.configVersion.recompute).toEqual({ from: calibratedAt, hours: 4 });
    expect(res.body.configVersion.element).toEqual({
      ...f.element,
      calibration: [
        { reynoldsNumber: 1000, dischargeCoefficient: 0.601 },
        { reynoldsNumber: 20000, dischargeCoefficient: 0.603 },
      ],
      calibrationUncertaintyPercent: 2,
    });
    await settled(api, f.meterRun.id);
    const after = await f.hours();
    for (let i = 0; i < 3; i++) expect(after[i]).toEqual(before[i]);
    for (let i = 3; i < 6; i++) {
      expect(after[i].flags).toContain('outside-calibration-range');
      // ISO 5167-2:2003 §5.3.3.1: U(C) = 0.5 % for β = 1/3, D = 300 mm (no small-pipe or low-Re_D term);
      // the certificate says 2 %, every other term is the same: U² grows by 2² − 0.5² = 3.75 %².
      expect(after[i].uncertaintyPercent! ** 2 - before[i].uncertaintyPercent! ** 2).toBeCloseTo(3.75, 6);
    }
  });

  it('names the CSV line of a bad point and the points field when both or neither are given', async () => {
    const at = new Date(h0 + 4 * hourMs).toISOString();
    const base = { calibratedAt: at, laboratory: 'Test flow laboratory', uncertaintyPercent: 0.5 };
    const bad = await api.post(`/api/meter-runs/${f.meterRun.id}/element-calibrations`, {
      ...base,
      pointsCsv: 'reynoldsNumber,dischargeCoefficient\n1e5,0.8\n2e5,x\n',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('pointsCsv');
    expect(bad.body.error.message).toMatch(/line 3/);
    const neither = await api.post(`/api/meter-runs/${f.meterRun.id}/element-calibrations`, base);
    expect(neither.status).toBe(400);
    expect(neither.body.error.field).toBe('points');
  });
});

describe('an inspection of the primary element', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  beforeAll(async () => {
    f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0 });
  });

  it('is a record only when the element was found as configured', async () => {
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/inspections`, {
      inspectedAt: '2026-03-02T10:00:00Z',
      kind: 'orifice-plate',
      measured: { boreDiameterM: 0.1, edgeSharp: true, flatnessMm: 0.1 },
      condition: 'clean, edge sharp',
    });
    expect(res.status).toBe(201);
    expect(res.body.configVersion).toBeNull();
    expect(res.body.configVersionId).toBeNull();
  });

  it('turns a measured bore that differs into a configuration version from the inspection date', async () => {
    const inspectedAt = '2026-03-09T10:00:00.000Z';
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/inspections`, {
      inspectedAt,
      kind: 'orifice-plate',
      measured: { boreDiameterM: 0.1003, edgeSharp: false },
      condition: 'edge rounded',
    });
    expect(res.status).toBe(201);
    expect(res.body.configVersion.effectiveFrom).toBe(inspectedAt);
    expect(res.body.configVersion.changes).toEqual([{ path: 'element.boreDiameterM', before: 0.1, after: 0.1003 }]);
    const listed = await api.get(`/api/meter-runs/${f.meterRun.id}/inspections`);
    expect(listed.body.map((i: { inspectedAt: string }) => i.inspectedAt)).toEqual([
      inspectedAt,
      '2026-03-02T10:00:00.000Z',
    ]);
  });

  it('refuses an inspection of another kind of element than the one in force, naming kind', async () => {
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/inspections`, {
      inspectedAt: '2026-03-10T10:00:00Z',
      kind: 'cone',
      measured: { coneDiameterM: 0.2 },
      condition: 'fine',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('kind');
  });
});

describe('a calibration of the element in reverse flow', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  /** The reverse constants: the same plate seen from its downstream face (its bore measured the other way). */
  const reverseElement = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1002 };
  beforeAll(async () => {
    f = await createMeterRun(api, { timeZone: 'UTC', contractHour: 0 });
  });

  it('is refused on a one-way meter run, naming direction, and records nothing', async () => {
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/element-calibrations`, {
      calibratedAt: '2026-02-01T00:00:00Z',
      laboratory: 'Test flow laboratory',
      uncertaintyPercent: 0.6,
      pointsCsv: 'reynoldsNumber,dischargeCoefficient\n1e5,0.6010\n1e6,0.6030\n',
      direction: 'reverse',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('direction');
    expect((await api.get(`/api/meter-runs/${f.meterRun.id}/element-calibrations`)).body).toEqual([]);
  });

  it('lands in reverseElement, leaves the forward constants alone, and its record says reverse', async () => {
    const bidirectional = await api.post(`/api/meter-runs/${f.meterRun.id}/config-versions`, {
      effectiveFrom: '2026-03-01T00:00:00Z',
      element: f.element,
      fluid: f.fluid,
      reverseElement,
      reason: 'bi-directional from March',
    });
    expect(bidirectional.status).toBe(201);
    const calibratedAt = '2026-03-15T00:00:00.000Z';
    const res = await api.post(`/api/meter-runs/${f.meterRun.id}/element-calibrations`, {
      calibratedAt,
      laboratory: 'Test flow laboratory',
      certificate: 'FC-R-0001',
      uncertaintyPercent: 0.6,
      pointsCsv: 'reynoldsNumber,dischargeCoefficient\n1e6,0.6030\n1e5,0.6010\n',
      direction: 'reverse',
    });
    expect(res.status).toBe(201);
    expect(res.body.direction).toBe('reverse');
    expect(res.body.configVersion.element).toEqual(f.element);
    expect(res.body.configVersion.reverseElement).toEqual({
      ...reverseElement,
      calibration: [
        { reynoldsNumber: 100000, dischargeCoefficient: 0.601 },
        { reynoldsNumber: 1000000, dischargeCoefficient: 0.603 },
      ],
      calibrationUncertaintyPercent: 0.6,
    });
    expect(res.body.configVersion.directionSource).toBe('dp-sign');

    const forward = await api.post(`/api/meter-runs/${f.meterRun.id}/element-calibrations`, {
      calibratedAt: '2026-03-20T00:00:00.000Z',
      laboratory: 'Test flow laboratory',
      uncertaintyPercent: 0.5,
      pointsCsv: 'reynoldsNumber,dischargeCoefficient\n1e5,0.6000\n1e6,0.6020\n',
    });
    expect(forward.status).toBe(201);
    expect(forward.body.direction).toBe('forward');
    // The forward curve keeps the reverse one in force: the run stays bi-directional.
    expect(forward.body.configVersion.reverseElement).toEqual(res.body.configVersion.reverseElement);

    const listed = (await api.get(`/api/meter-runs/${f.meterRun.id}/element-calibrations`)).body as {
      calibratedAt: string;
      direction: string;
    }[];
    expect(listed.map((c) => [c.calibratedAt, c.direction])).toEqual([
      ['2026-03-20T00:00:00.000Z', 'forward'],
      [calibratedAt, 'reverse'],
    ]);
  });
});
