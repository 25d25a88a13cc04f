/**
 * POST /api/calculations/flow against the running server (real PostgreSQL, real broker): gas
 * component names in the spellings the fluids module accepts (issue 13 item 1).
 */
import { client, signIn, type Client } from '../support/api';

let api: Client;
beforeAll(async () => {
  api = client(await signIn('operator@demo.tallyrun'));
});

const gasCase = (composition: Record<string, number>) => ({
  element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
  fluid: { kind: 'natural-gas', composition },
  conditions: { differentialPressurePa: 25000, staticPressurePa: 5e6, temperatureK: 290 },
});

describe('POST /api/calculations/flow: gas component names', () => {
  it('gives the same result for "carbon dioxide", "CO2" and "Carbon Dioxide" as for "carbon-dioxide", with the canonical names echoed', async () => {
    const kebab = await api.post(
      '/api/calculations/flow',
      gasCase({ methane: 0.95, 'carbon-dioxide': 0.02, nitrogen: 0.03 }),
    );
    expect(kebab.status).toBe(200);
    expect(kebab.body.composition).toEqual({ methane: 0.95, 'carbon-dioxide': 0.02, nitrogen: 0.03 });
    for (const spelling of ['carbon dioxide', 'CO2', 'Carbon Dioxide']) {
      const other = await api.post('/api/calculations/flow', gasCase({ Methane: 0.95, [spelling]: 0.02, N2: 0.03 }));
      expect(other.status).toBe(200);
      expect(other.body).toEqual(kebab.body);
    }
  });

  it('answers 400 naming fluid.composition.<name> for an unknown component, listing close matches', async () => {
    const res = await api.post('/api/calculations/flow', gasCase({ methane: 0.98, 'carbon dioxid': 0.02 }));
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_case', field: 'fluid.composition.carbon dioxid' });
    expect(res.body.error.message).toMatch(/did you mean carbon-dioxide/);
  });

  it('answers 400 for one component given twice under two spellings', async () => {
    const res = await api.post('/api/calculations/flow', gasCase({ methane: 0.96, CO2: 0.02, 'carbon-dioxide': 0.02 }));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('fluid.composition.carbon-dioxide');
    expect(res.body.error.message).toMatch(/carbon-dioxide is given twice \("CO2" and "carbon-dioxide"\)/);
  });
});
