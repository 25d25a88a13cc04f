import { DETAIL_GAS_CONSTANT as R } from './detail-constants';
import { type DetailMixture } from './prepare-detail-mixture';
import { AR, D1, D2, D3, T1, T11, T2, detailResidualDerivatives } from './detail-residual';
import { detailMolarDensityMolPerM3 } from './detail-molar-density';

/** Thermodynamic properties of a natural gas from AGA 8 DETAIL (SI units). */
export interface DetailProperties {
  pressurePa: number;
  temperatureK: number;
  molarDensityMolPerM3: number;
  densityKgPerM3: number;
  molarMassKgPerMol: number;
  compressibility: number;
  /** (∂P/∂D)_T, Pa per mol/m³ (= J/mol). */
  dPdDPaM3PerMol: number;
  /** (∂²P/∂D²)_T, Pa per (mol/m³)². */
  d2PdD2PaM6PerMol2: number;
  /** (∂P/∂T)_D, Pa/K. */
  dPdTPaPerK: number;
  internalEnergyJPerMol: number;
  enthalpyJPerMol: number;
  entropyJPerMolK: number;
  gibbsEnergyJPerMol: number;
  isochoricHeatCapacityJPerMolK: number;
  isobaricHeatCapacityJPerMolK: number;
  speedOfSoundMPerS: number;
  /** Joule–Thomson coefficient, K/Pa. */
  jouleThomsonKPerPa: number;
  /** Isentropic exponent as ISO 5167 uses it, κ = w²ρ/p = (cp/cv)(D/P)(∂P/∂D)_T. */
  isentropicExponent: number;
}

const r = new Float64Array(7);

/**
 * Ideal-gas Helmholtz energy and its temperature derivatives for the mixture (data sheet §6):
 * returns [A⁰, ∂A⁰/∂T, T ∂²A⁰/∂T²] in J/mol, J/(mol K), J/(mol K).
 */
function idealGasPart(mix: DetailMixture, t: number, d: number): [number, number, number] {
  const lnT = Math.log(t);
  const lnD = d > 1e-15 ? Math.log(d) : Math.log(1e-15);
  let a = 0;
  let dadt = 0;
  let tdadt2 = 0;
  for (let k = 0; k < mix.idealCount; k++) {
    const x = mix.idealX[k];
    const n = k * 7;
    const th = k * 4;
    const n1 = mix.idealN[n];
    const n2 = mix.idealN[n + 1];
    const n3 = mix.idealN[n + 2];
    const lnxd = Math.log(x) + lnD;
    let sa = lnxd + n1 + n2 / t - n3 * lnT;
    let st = lnxd + n1 - n3 * (1 + lnT);
    let stt = n3;
    for (let m = 0; m < 4; m++) {
      const theta = mix.idealTheta[th + m];
      if (theta === 0) continue;
      const nk = mix.idealN[n + 3 + m];
      const y = theta / t;
      if (m % 2 === 0) {
        // k = 4, 6: sinh terms
        const sh = Math.sinh(y);
        const lnsh = Math.log(Math.abs(sh));
        sa += nk * lnsh;
        st += nk * (lnsh - y / Math.tanh(y));
        stt += nk * (y / sh) * (y / sh);
      } else {
        // k = 5, 7: cosh terms
        const ch = Math.cosh(y);
        const lnch = Math.log(ch);
        sa -= nk * lnch;
        st -= nk * (lnch - y * Math.tanh(y));
        stt += nk * (y / ch) * (y / ch);
      }
    }
    a += x * sa;
    dadt += x * st;
    tdadt2 += x * stt;
  }
  return [R * t * a, R * dadt, -R * tdadt2];
}

/**
 * All DETAIL properties at a given temperature and molar density (data sheet §7, NIST's
 * PropertiesDetail), no density iteration.
 *
 * @param mix prepared mixture
 * @param temperatureK temperature, K
 * @param molarDensityMolPerM3 molar density, mol/m³
 * @returns the properties (pressure follows from the equation)
 */
export function detailPropertiesTD(
  mix: DetailMixture,
  temperatureK: number,
  molarDensityMolPerM3: number,
): DetailProperties {
  const t = temperatureK;
  const d = molarDensityMolPerM3 / 1000; // mol/dm³
  detailResidualDerivatives(mix, t, d, r);
  const rt = R * t;
  const m = mix.molarMassGPerMol;
  const z = 1 + r[D1];
  const p = d * rt * z; // kPa
  const dpdd = rt * (1 + 2 * r[D1] + r[D2]);
  const d2pdd2 = d > 1e-15 ? (rt * (2 * r[D1] + 4 * r[D2] + r[D3])) / d : 0;
  const dpdt = d * R * (1 + r[D1] + r[T11]);
  const [a0, da0dt, td2a0dt2] = idealGasPart(mix, t, d);
  const ar = rt * r[AR];
  const dardt = R * (r[AR] + r[T1]);
  const td2ardt2 = R * (2 * r[T1] + r[T2]);
  const a = a0 + ar;
  const s = -da0dt - dardt;
  const u = a + t * s;
  const cv = -(td2a0dt2 + td2ardt2);
  let h: number;
  let g: number;
  let cp: number;
  let jt: number;
  if (d > 1e-15) {
    h = u + p / d;
    g = a + p / d;
    cp = cv + (t * (dpdt / d) * (dpdt / d)) / dpdd;
    jt = (((t / d) * dpdt) / dpdd - 1) / cp / d;
  } else {
    h = u + rt;
    g = a + rt;
    cp = cv + R;
    jt = 1e20;
  }
  const w2 = (((1000 * cp) / cv) * dpdd) / m;
  const w = w2 > 0 ? Math.sqrt(w2) : 0;
  return {
    pressurePa: p * 1000,
    temperatureK: t,
    molarDensityMolPerM3,
    densityKgPerM3: d * m,
    molarMassKgPerMol: mix.molarMassKgPerMol,
    compressibility: z,
    dPdDPaM3PerMol: dpdd,
    d2PdD2PaM6PerMol2: d2pdd2 / 1000,
    dPdTPaPerK: dpdt * 1000,
    internalEnergyJPerMol: u,
    enthalpyJPerMol: h,
    entropyJPerMolK: s,
    gibbsEnergyJPerMol: g,
    isochoricHeatCapacityJPerMolK: cv,
    isobaricHeatCapacityJPerMolK: cp,
    speedOfSoundMPerS: w,
    jouleThomsonKPerPa: jt / 1000,
    isentropicExponent: (cp / cv) * (d / p) * dpdd,
  };
}

/**
 * All DETAIL properties at a given pressure and temperature: density by
 * detailMolarDensityMolPerM3, then detailPropertiesTD.
 *
 * @param mix prepared mixture (prepareDetailMixture)
 * @param pressurePa absolute pressure, Pa (> 0)
 * @param temperatureK temperature, K (> 0)
 * @returns the properties
 * @throws Error naming the field for bad input or when no gas-phase density exists
 */
export function detailPropertiesPT(mix: DetailMixture, pressurePa: number, temperatureK: number): DetailProperties {
  const dm = detailMolarDensityMolPerM3(mix, pressurePa, temperatureK);
  const props = detailPropertiesTD(mix, temperatureK, dm);
  // Report the requested pressure (the equation's round trip differs by ~1e-15 relative).
  props.pressurePa = pressurePa;
  return props;
}
