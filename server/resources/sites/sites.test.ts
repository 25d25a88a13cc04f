import { testApp } from '../../test-support/app';

let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
});
afterAll(() => t.close());

const site = (over: Record<string, unknown> = {}) => ({
  code: `S${t.unique()}`,
  name: 'Test site',
  timeZone: 'America/Denver',
  contractHour: 9,
  basePressurePa: 101560, // 14.73 psia
  baseTemperatureK: 288.7055556, // 60 °F
  atmosphericPressurePa: 84000,
  ...over,
});

describe('/api/sites', () => {
  it('keeps the display units when a PATCH leaves them out (the create default is not applied to a change)', async () => {
    const auth = `Bearer ${engineer.token}`;
    const created = await t
      .http()
      .post('/api/sites')
      .set('Authorization', auth)
      .send(site({ displayUnits: 'us' }));
    expect(created.status).toBe(201);
    const patched = await t.http().patch(`/api/sites/${created.body.id}`).set('Authorization', auth).send({});
    expect(patched.status).toBe(200);
    expect(patched.body.displayUnits).toBe('us');
  });

  it('creates a site and returns it with its id', async () => {
    const body = site();
    const res = await t.http().post('/api/sites').set('Authorization', `Bearer ${engineer.token}`).send(body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ ...body, id: expect.any(String) });
  });

  it.each([
    [{ timeZone: 'Mountain Time' }, 'timeZone'],
    [{ contractHour: 24 }, 'contractHour'],
    [{ contractHour: 8.5 }, 'contractHour'],
    [{ basePressurePa: 14.73 }, 'basePressurePa'],
    [{ baseTemperatureK: 60 }, 'baseTemperatureK'],
    [{ code: 'has space' }, 'code'],
  ])('refuses %j with 400 naming %s', async (over, field) => {
    const res = await t.http().post('/api/sites').set('Authorization', `Bearer ${engineer.token}`).send(site(over));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  });

  it('refuses a second site with the same code with 409', async () => {
    const body = site();
    await t.http().post('/api/sites').set('Authorization', `Bearer ${engineer.token}`).send(body);
    const again = await t.http().post('/api/sites').set('Authorization', `Bearer ${engineer.token}`).send(body);
    expect(again.status).toBe(409);
    expect(again.body.error.field).toBe('code');
  });
});

describe('/api/meter-runs and /api/transmitters', () => {
  let siteId: string;
  beforeAll(async () => {
    siteId = (await t.http().post('/api/sites').set('Authorization', `Bearer ${engineer.token}`).send(site())).body.id;
  });
  const run = (over: Record<string, unknown> = {}) => ({
    siteId,
    tag: `MR-${t.unique()}`,
    name: 'Pad wellhead',
    element: { kind: 'cone', pipeDiameterM: 0.0493, coneDiameterM: 0.0412, dischargeCoefficient: 0.82 },
    fluid: { kind: 'natural-gas', composition: { methane: 0.95, ethane: 0.03, nitrogen: 0.02 } },
    ...over,
  });

  it('creates a meter run with its first configuration version', async () => {
    const res = await t.http().post('/api/meter-runs').set('Authorization', `Bearer ${engineer.token}`).send(run());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ siteId, element: { kind: 'cone' }, holdLimitS: 60, maxGapS: 300 });
    const versions = await t
      .http()
      .get(`/api/meter-runs/${res.body.id}/config-versions`)
      .set('Authorization', `Bearer ${engineer.token}`);
    expect(versions.body).toHaveLength(1);
  });

  it('stores a composition typed in the usual spellings (Methane, CO2, carbon dioxide) under the canonical names', async () => {
    const res = await t
      .http()
      .post('/api/meter-runs')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send(run({ fluid: { kind: 'natural-gas', composition: { Methane: 0.95, Ethane: 0.03, N2: 0.02 } } }));
    expect(res.status).toBe(201);
    const versions = await t
      .http()
      .get(`/api/meter-runs/${res.body.id}/config-versions`)
      .set('Authorization', `Bearer ${engineer.token}`);
    expect(versions.body[0].fluid.composition).toEqual({ methane: 0.95, ethane: 0.03, nitrogen: 0.02 });
  });

  it('refuses a composition naming the same component twice under two spellings, naming the field', async () => {
    const res = await t
      .http()
      .post('/api/meter-runs')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send(run({ fluid: { kind: 'natural-gas', composition: { methane: 0.96, CO2: 0.02, 'carbon dioxide': 0.02 } } }));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('fluid.composition.carbon dioxide');
  });

  it.each([
    [{ siteId: '999999' }, 'siteId'],
    [{ element: { kind: 'orifice', pipeDiameterM: 0.1, boreDiameterM: 0.05 } }, 'element.taps'],
    [{ element: { kind: 'cone', pipeDiameterM: 0.05, coneDiameterM: 0.06 } }, 'element.coneDiameterM'],
    [{ fluid: { kind: 'natural-gas' } }, 'fluid.composition'],
    [{ holdLimitS: -5 }, 'holdLimitS'],
  ])('refuses a meter run with %j naming %s', async (over, field) => {
    const res = await t.http().post('/api/meter-runs').set('Authorization', `Bearer ${engineer.token}`).send(run(over));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  });

  it.each([
    [{ measures: 'temperature', unit: 'kPa' }, 'unit'],
    [{ measures: 'differential-pressure', unit: 'inH2O' }, 'unit'],
    [{ measures: 'differential-pressure', unit: 'inH2O-60F', lowerRange: 250, upperRange: 0 }, 'upperRange'],
    [{ measures: 'static-pressure', unit: 'psi', stackRole: 'low' }, 'stackRole'],
  ])('refuses a transmitter with %j naming %s', async (over, field) => {
    const meterRunId = (
      await t.http().post('/api/meter-runs').set('Authorization', `Bearer ${engineer.token}`).send(run())
    ).body.id;
    const res = await t
      .http()
      .post('/api/transmitters')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send({ meterRunId, tag: `TX-${t.unique()}`, lowerRange: 0, upperRange: 100, ...over });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  });

  it('refuses a second low-range transmitter on one meter run with 409', async () => {
    const meterRunId = (
      await t.http().post('/api/meter-runs').set('Authorization', `Bearer ${engineer.token}`).send(run())
    ).body.id;
    const low = {
      meterRunId,
      measures: 'differential-pressure',
      unit: 'inH2O-60F',
      lowerRange: 0,
      upperRange: 25,
      stackRole: 'low',
    };
    expect(
      (
        await t
          .http()
          .post('/api/transmitters')
          .set('Authorization', `Bearer ${engineer.token}`)
          .send({ ...low, tag: `L1-${t.unique()}` })
      ).status,
    ).toBe(201);
    const second = await t
      .http()
      .post('/api/transmitters')
      .set('Authorization', `Bearer ${engineer.token}`)
      .send({ ...low, tag: `L2-${t.unique()}` });
    expect(second.status).toBe(409);
    expect(second.body.error.field).toBe('stackRole');
  });
});
