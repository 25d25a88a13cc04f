/**
 * Cross-check of this IAPWS-IF97 / R12-08 implementation against an independent one:
 * Debian's python3-iapws (package python3-iapws, module iapws 1.5.x, by J.J. Gómez Romera),
 * run once per test file with every point batched as JSON through /usr/bin/python3.
 * Expected values come from that library at run time, never from this code.
 */
import { execFileSync } from 'child_process';
import { waterStatePT } from './water-state-pt';
import { region1State } from './region1';
import { region2State } from './region2';
import { region3StateRhoT } from './region3';
import { saturationPressurePa, saturationTemperatureK } from './saturation';
import { waterViscosityPaS } from './water-viscosity';
import { boundary23PressurePa } from './boundary23';
import {
  REGION_1_TABLE_5,
  REGION_2_TABLE_15,
  REGION_3_TABLE_33,
  REGION_5_TABLE_42,
  SATURATION_PRESSURE_TABLE_35,
  SATURATION_TEMPERATURE_TABLE_36,
  VISCOSITY_TABLE_4,
} from './release-verification-tables';

const PYTHON = '/usr/bin/python3';

// Reads {pt:[[pMPa,T]], sat:[T], tsat:[pMPa], visc:[[rho,T]], r3:[[rho,T]]} and answers in SI-ish
// units of the library (MPa, kJ/kg, kJ/(kg K), m/s, Pa s).
const SCRIPT = String.raw`
import json, sys
from iapws import IAPWS97
from iapws.iapws97 import _PSat_T, _TSat_P, _Region3
from iapws._iapws import _Viscosity
req = json.load(sys.stdin)
def props(s):
    return {"rho": s.rho, "h": s.h, "s": s.s, "cp": s.cp, "cv": s.cv, "w": s.w, "mu": s.mu, "region": s.region}
out = {"pt": [], "satL": [], "satV": [], "psat": [], "tsat": [], "visc": [], "r3": []}
for p, t in req["pt"]:
    out["pt"].append(props(IAPWS97(P=p, T=t)))
for t in req["sat"]:
    out["psat"].append(_PSat_T(t))
    if t <= 623.15:
        l = IAPWS97(T=t, x=0).Liquid
        v = IAPWS97(T=t, x=1).Vapor
        out["satL"].append({"rho": l.rho, "h": l.h, "s": l.s, "cp": l.cp, "w": l.w})
        out["satV"].append({"rho": v.rho, "h": v.h, "s": v.s, "cp": v.cp, "w": v.w})
for p in req["tsat"]:
    out["tsat"].append(_TSat_P(p))
for rho, t in req["visc"]:
    out["visc"].append(_Viscosity(rho, t))
for rho, t in req["r3"]:
    r = _Region3(rho, t)
    out["r3"].append({"P": r["P"], "h": r["h"], "s": r["s"], "cp": r["cp"], "w": r["w"], "u": r["h"] - r["P"] * 1000 * r["v"]})
json.dump(out, sys.stdout)
`;

interface Props {
  rho: number;
  h: number;
  s: number;
  cp: number;
  cv: number;
  w: number;
  mu: number;
  region: number;
}
interface Answer {
  pt: Props[];
  satL: Array<Omit<Props, 'cv' | 'mu' | 'region'>>;
  satV: Array<Omit<Props, 'cv' | 'mu' | 'region'>>;
  psat: number[];
  tsat: number[];
  visc: number[];
  r3: Array<{ P: number; h: number; s: number; cp: number; w: number; u: number }>;
}

function askPythonIapws(request: object): Answer {
  try {
    const stdout = execFileSync(PYTHON, ['-c', SCRIPT], {
      input: JSON.stringify(request),
      encoding: 'utf8',
      maxBuffer: 64 << 20,
    });
    return JSON.parse(stdout) as Answer;
  } catch (e) {
    throw new Error(
      `python3-iapws reference not available: ${PYTHON} could not run the iapws library ` +
        `(install it with "apt-get install -y python3-iapws"). Cause: ${(e as Error).message}`,
      { cause: e },
    );
  }
}

// ---- the points -------------------------------------------------------------------------
const pt: Array<[number, number]> = []; // [p MPa, T K]
const region1Temps = [273.16, 280, 300, 325, 350, 375, 400, 450, 500, 550, 600, 620, 623.15];
const region1Pressures = [0.1, 0.5, 1, 3, 5, 10, 20, 30, 50, 80, 100];
for (const t of region1Temps) {
  for (const p of region1Pressures) if (p * 1e6 > saturationPressurePa(t) * 1.001) pt.push([p, t]);
}
const region2Temps = [300, 350, 400, 450, 500, 550, 600, 623.15, 650, 700, 750, 800, 863.15, 900, 1000, 1073.15];
const region2Pressures = [0.001, 0.01, 0.05, 0.1, 0.5, 1, 2, 5, 10, 16, 20, 30, 50, 80, 100];
for (const t of region2Temps) {
  for (const p of region2Pressures) {
    // Keep 0.1 % away from the saturation line and the B23 boundary, where the region is ambiguous.
    const limit = (t <= 623.15 ? saturationPressurePa(t) : boundary23PressurePa(t)) * 0.999;
    if (p * 1e6 < limit) pt.push([p, t]);
  }
}
const region5Points: Array<[number, number]> = [
  [0.1, 1200],
  [1, 1500],
  [10, 1800],
  [30, 2000],
  [50, 2273.15],
];
pt.push(...region5Points);
// Region 3: python3-iapws starts from the supplementary backward equations v(p,T) (IAPWS
// SR5-05(2016)) and refines with the basic equation; this code solves the basic equation
// directly from a bracketing scan: two different routes to the same root.
const region3Points: Array<[number, number]> = [
  [25, 650],
  [30, 660],
  [40, 700],
  [50, 750],
  [100, 800],
  [20, 640],
  [18, 630],
  [22, 645],
  [60, 680],
  [100, 855],
];
const sat = [273.16, 280, 300, 325, 350, 375, 400, 425, 450, 475, 500, 525, 550, 575, 600, 623.15, 630, 640, 645, 647];
const tsat = [0.001, 0.005, 0.01, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10, 15, 20, 22];

const answer = askPythonIapws({
  pt: [...pt, ...region3Points],
  sat,
  tsat,
  visc: [...VISCOSITY_TABLE_4.map((r) => [r.densityKgPerM3, r.temperatureK])],
  r3: REGION_3_TABLE_33.map((r) => [r.densityKgPerM3, r.temperatureK]),
});
const tablePoints = [...REGION_1_TABLE_5, ...REGION_2_TABLE_15, ...REGION_5_TABLE_42];
const tableAnswer = askPythonIapws({
  pt: tablePoints.map((r) => [r.pressureMPa, r.temperatureK]),
  sat: SATURATION_PRESSURE_TABLE_35.map((r) => r.temperatureK),
  tsat: SATURATION_TEMPERATURE_TABLE_36.map((r) => r.pressureMPa),
  visc: [],
  r3: [],
});

const rel = (a: number, b: number) => Math.abs(a / b - 1);
/**
 * Enthalpy and entropy pass through 0 at the triple-point reference state: compare relative to
 * max(|b|, 1 kJ/kg or 1 kJ/(kg K)) so that values near zero are held to an absolute 1e-9.
 */
const relS = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1);

describe('IAPWS-IF97 against Debian python3-iapws (independent implementation)', () => {
  it(`covers at least 50 points in regions 1 and 2 and 20 on the saturation line (${pt.length} p,T points)`, () => {
    expect(pt.length).toBeGreaterThanOrEqual(50);
    expect(sat.length + tsat.length).toBeGreaterThanOrEqual(20);
  });

  it.each(pt.map((point, i) => [point[0], point[1], i] as const))(
    'agrees at %s MPa and %s K: region, density to 1e-10, h, s, cp, cv, w to 1e-9, viscosity to 1e-9',
    (p, t, i) => {
      const ref = answer.pt[i];
      const s = waterStatePT(p * 1e6, t);
      expect(s.region).toBe(ref.region);
      expect(rel(s.densityKgPerM3, ref.rho)).toBeLessThan(1e-10);
      expect(relS(s.specificEnthalpyJPerKg / 1e3, ref.h)).toBeLessThan(1e-9);
      expect(relS(s.specificEntropyJPerKgK / 1e3, ref.s)).toBeLessThan(1e-9);
      expect(rel(s.isobaricHeatCapacityJPerKgK, ref.cp * 1e3)).toBeLessThan(1e-9);
      expect(rel(s.isochoricHeatCapacityJPerKgK, ref.cv * 1e3)).toBeLessThan(1e-9);
      expect(rel(s.speedOfSoundMPerS, ref.w)).toBeLessThan(1e-9);
      expect(rel(waterViscosityPaS(s.densityKgPerM3, t), ref.mu)).toBeLessThan(1e-9);
    },
  );

  it.each(region3Points.map((point, i) => [point[0], point[1], pt.length + i] as const))(
    'agrees in region 3 at %s MPa and %s K: density and enthalpy to 1e-10',
    (p, t, i) => {
      const ref = answer.pt[i];
      const s = waterStatePT(p * 1e6, t);
      expect(s.region).toBe(3);
      expect(ref.region).toBe(3);
      expect(rel(s.densityKgPerM3, ref.rho)).toBeLessThan(1e-10);
      expect(rel(s.specificEnthalpyJPerKg, ref.h * 1e3)).toBeLessThan(1e-10);
    },
  );

  it.each(sat.map((t, i) => [t, i] as const))('gives the same saturation pressure at %s K (to 1e-12)', (t, i) => {
    expect(rel(saturationPressurePa(t), answer.psat[i] * 1e6)).toBeLessThan(1e-12);
  });

  it.each(tsat.map((p, i) => [p, i] as const))('gives the same saturation temperature at %s MPa (to 1e-12)', (p, i) => {
    expect(rel(saturationTemperatureK(p * 1e6), answer.tsat[i])).toBeLessThan(1e-12);
  });

  it.each(sat.filter((t) => t <= 623.15).map((t, i) => [t, i] as const))(
    'gives the same saturated liquid and vapour at %s K (regions 1 and 2 at psat)',
    (t, i) => {
      const p = saturationPressurePa(t);
      const l = region1State(p, t);
      const v = region2State(p, t);
      expect(rel(l.densityKgPerM3, answer.satL[i].rho)).toBeLessThan(1e-10);
      expect(rel(v.densityKgPerM3, answer.satV[i].rho)).toBeLessThan(1e-10);
      expect(relS(l.specificEnthalpyJPerKg / 1e3, answer.satL[i].h)).toBeLessThan(1e-9);
      expect(rel(v.specificEnthalpyJPerKg, answer.satV[i].h * 1e3)).toBeLessThan(1e-9);
      expect(rel(l.speedOfSoundMPerS, answer.satL[i].w)).toBeLessThan(1e-9);
      expect(rel(v.speedOfSoundMPerS, answer.satV[i].w)).toBeLessThan(1e-9);
    },
  );

  it.each(REGION_3_TABLE_33.map((r, i) => [r.densityKgPerM3, r.temperatureK, i] as const))(
    'gives the same region-3 basic-equation values at %s kg/m³ and %s K',
    (rho, t, i) => {
      const s = region3StateRhoT(rho, t);
      const ref = answer.r3[i];
      expect(rel(s.pressurePa, ref.P * 1e6)).toBeLessThan(1e-10);
      expect(rel(s.specificEnthalpyJPerKg, ref.h * 1e3)).toBeLessThan(1e-10);
      expect(rel(s.isobaricHeatCapacityJPerKgK, ref.cp * 1e3)).toBeLessThan(1e-10);
      expect(rel(s.speedOfSoundMPerS, ref.w)).toBeLessThan(1e-10);
    },
  );
});

describe('the remembered release verification tables agree with python3-iapws', () => {
  // Confirms the [mem] values of release-verification-tables.ts independently of this code.
  it.each(tablePoints.map((r, i) => [r.table, r.temperatureK, r.pressureMPa, i] as const))(
    '%s at %s K and %s MPa: v, h, s, cp, w',
    (_table, _t, _p, i) => {
      const row = tablePoints[i];
      const ref = tableAnswer.pt[i];
      expect(rel(1 / ref.rho, row.v)).toBeLessThan(1e-8);
      expect(rel(ref.h, row.h)).toBeLessThan(1e-8);
      expect(rel(ref.s, row.s)).toBeLessThan(1e-8);
      expect(rel(ref.cp, row.cp)).toBeLessThan(1e-8);
      expect(rel(ref.w, row.w)).toBeLessThan(1e-8);
    },
  );

  it('R7-97(2012) Tables 35 and 36 (saturation)', () => {
    SATURATION_PRESSURE_TABLE_35.forEach((r, i) => expect(rel(tableAnswer.psat[i], r.pressureMPa)).toBeLessThan(1e-8));
    SATURATION_TEMPERATURE_TABLE_36.forEach((r, i) =>
      expect(rel(tableAnswer.tsat[i], r.temperatureK)).toBeLessThan(1e-8),
    );
  });

  it('R12-08 Table 4 (viscosity)', () => {
    VISCOSITY_TABLE_4.forEach((r, i) =>
      expect(Math.abs(answer.visc[i] * 1e6 - r.viscosityMicroPaS)).toBeLessThan(1e-6),
    );
  });

  it('R7-97(2012) Table 33 (region 3)', () => {
    REGION_3_TABLE_33.forEach((r, i) => {
      expect(rel(answer.r3[i].P, r.pressureMPa)).toBeLessThan(1e-8);
      expect(rel(answer.r3[i].h, r.h)).toBeLessThan(1e-8);
      expect(rel(answer.r3[i].u, r.u)).toBeLessThan(1e-8);
      expect(rel(answer.r3[i].s, r.s)).toBeLessThan(1e-8);
      expect(rel(answer.r3[i].cp, r.cp)).toBeLessThan(1e-8);
      expect(rel(answer.r3[i].w, r.w)).toBeLessThan(1e-8);
    });
  });
});
