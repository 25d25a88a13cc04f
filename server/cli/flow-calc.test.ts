/**
 * Spawns `tsx server/cli/flow-calc.ts` (what `npm run --silent flow-calc` runs) with cases on stdin.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');

function run(stdin: string): { status: number | null; json: any; stdout: string } {
  const p = spawnSync(tsx, ['server/cli/flow-calc.ts'], { cwd: root, input: stdin, encoding: 'utf8', timeout: 60000 });
  let json: unknown;
  try {
    json = JSON.parse(p.stdout);
  } catch {
    json = null;
  }
  return { status: p.status, json, stdout: p.stdout };
}

/** R = 8.314462618 J/(mol·K) (CODATA 2018, exact): molar mass chosen so the ideal gas has ρ = 15 kg/m³ at 2 MPa, 300 K. */
const molarMassFor15 = (15 * 8.314462618 * 300) / 2e6;

const o2Case = {
  element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1, referenceTemperatureK: 300 },
  fluid: {
    kind: 'ideal-gas',
    molarMassKgPerMol: molarMassFor15,
    compressibility: 1,
    isentropicExponent: 1.2,
    viscosityPaS: 1.12e-5,
  },
  conditions: { differentialPressurePa: 28000, staticPressurePa: 2e6, temperatureK: 300 },
};

describe('flow-calc CLI', () => {
  it('gives the same result for carbon dioxide written "carbon dioxide", "CO2" or "Carbon Dioxide" as for "carbon-dioxide", echoing the canonical names', () => {
    const gasCase = (carbonDioxide: string) =>
      JSON.stringify({
        element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
        fluid: { kind: 'natural-gas', composition: { methane: 0.95, [carbonDioxide]: 0.02, nitrogen: 0.03 } },
        conditions: { differentialPressurePa: 25000, staticPressurePa: 5e6, temperatureK: 290 },
      });
    const kebab = run(gasCase('carbon-dioxide'));
    expect(kebab.status).toBe(0);
    expect(kebab.json.composition).toEqual({ methane: 0.95, 'carbon-dioxide': 0.02, nitrogen: 0.03 });
    for (const spelling of ['carbon dioxide', 'CO2', 'Carbon Dioxide'])
      expect(run(gasCase(spelling)).json).toEqual(kebab.json);
  });

  it('refuses an unknown component naming fluid.composition.<name>, with close matches, and exits 2', () => {
    const r = run(
      JSON.stringify({
        element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
        fluid: { kind: 'natural-gas', composition: { methane: 0.98, nitrogn: 0.02 } },
        conditions: { differentialPressurePa: 25000, staticPressurePa: 5e6, temperatureK: 290 },
      }),
    );
    expect(r.status).toBe(2);
    expect(r.json.error.field).toBe('fluid.composition.nitrogn');
    expect(r.json.error.message).toMatch(/did you mean nitrogen/);
  });

  it('prints the O2 result (qm = 15555.29024 kg/h, C = 0.599031, ε = 0.9958616; TRADE.md §3 O2, pvtlib) pretty with 2 spaces and exits 0', () => {
    const r = run(JSON.stringify(o2Case));
    expect(r.status).toBe(0);
    expect(r.stdout.startsWith('{\n  "beta"')).toBe(true);
    expect(r.json.densityKgPerM3).toBeCloseTo(15, 9);
    expect(r.json.massFlowKgPerS * 3600).toBeCloseTo(15555.29024, 3);
    expect(r.json.dischargeCoefficient).toBeCloseTo(0.599031, 6);
    expect(r.json.expansibility).toBeCloseTo(0.9958616, 7);
    for (const key of [
      'beta',
      'reynoldsNumber',
      'compressibility',
      'baseDensityKgPerM3',
      'volumeFlowM3PerS',
      'standardVolumeFlowM3PerS',
    ]) {
      expect(r.json).toHaveProperty(key);
    }
    expect(Array.isArray(r.json.warnings)).toBe(true);
  });

  it('answers invalid JSON with an error body and exit code 2', () => {
    const r = run('{ not json');
    expect(r.status).toBe(2);
    expect(r.json.error.code).toBe('invalid_case');
    expect(r.json.error).toHaveProperty('field');
    expect(typeof r.json.error.message).toBe('string');
  });

  it('answers a schema failure with the field path (bore not below the pipe → element.boreDiameterM) and exit code 2', () => {
    const r = run(JSON.stringify({ ...o2Case, element: { ...o2Case.element, boreDiameterM: 0.4 } }));
    expect(r.status).toBe(2);
    expect(r.json.error).toEqual(expect.objectContaining({ code: 'invalid_case', field: 'element.boreDiameterM' }));
    expect(r.json).not.toHaveProperty('massFlowKgPerS');
  });

  it('answers a natural gas without composition with field fluid.composition and exit code 2', () => {
    const r = run(JSON.stringify({ ...o2Case, fluid: { kind: 'natural-gas' } }));
    expect(r.status).toBe(2);
    expect(r.json.error.field).toBe('fluid.composition');
  });

  it('answers an unknown gas component with an error body naming fluid.composition.<name> and exit code 2', () => {
    const r = run(
      JSON.stringify({ ...o2Case, fluid: { kind: 'natural-gas', composition: { methane: 0.9, unobtainium: 0.1 } } }),
    );
    expect(r.status).toBe(2);
    expect(r.json.error.code).toBe('invalid_case');
    expect(r.json.error.message).toMatch(/unobtainium/);
    // Issue 13 item 1: the boundary names the component (it used to be found by the engine, as fluid.composition).
    expect(r.json.error.field).toBe('fluid.composition.unobtainium');
  });
});

describe('npm run --silent flow-calc', () => {
  it('is wired to the same command: the O2 case through npm prints only the result JSON', () => {
    const p = spawnSync('npm', ['run', '--silent', 'flow-calc'], {
      cwd: root,
      input: JSON.stringify(o2Case),
      encoding: 'utf8',
      timeout: 60000,
    });
    expect(p.status).toBe(0);
    expect(JSON.parse(p.stdout).massFlowKgPerS * 3600).toBeCloseTo(15555.29024, 3);
  });
});
