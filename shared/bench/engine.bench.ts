/**
 * `npm run bench:engine`: evaluations per second of the flow engine on one core, against the
 * goals (≥ 2M/s cone and venturi with fixed properties, ≥ 500k/s orifice with the Re_D
 * iteration, ≥ 100k/s AGA 8 density solves). Timed with process.hrtime.bigint after a warm-up,
 * about 1.5 s per case. Inputs vary from call to call so nothing is hoisted out of the loop.
 */
import { detailMolarDensityMolPerM3, fluidState, cachedDetailMixture } from '../fluids';
import { evaluateFlow, type FlowFluidProperties } from '../flow/evaluate-flow';
import { prepareElement } from '../flow/prepare-element';

const WARM_UP_NS = 300_000_000n;
const MEASURE_NS = 1_500_000_000n;
const BATCH = 1024;

/** Gulf Coast gas of AGA 8 (TRADE.md §4), mole fractions. */
const GULF_COAST = {
  methane: 0.965222,
  nitrogen: 0.002595,
  'carbon-dioxide': 0.005956,
  ethane: 0.018186,
  propane: 0.004596,
  isobutane: 0.000977,
  'n-butane': 0.001007,
  isopentane: 0.000473,
  'n-pentane': 0.000324,
  'n-hexane': 0.000664,
};

const dps = Float64Array.from({ length: BATCH }, (_, i) => 5000 + 40 * i);
const pressures = Float64Array.from({ length: BATCH }, (_, i) => 5.5e6 + 1000 * i);
const temperatures = Float64Array.from({ length: BATCH }, (_, i) => 283.15 + (i % 64) * 0.5);
let sink = 0;

/** Runs fn(i) in batches until the time is up; returns evaluations per second. */
function measure(fn: (i: number) => number): number {
  const run = (budget: bigint): { count: number; ns: bigint } => {
    const start = process.hrtime.bigint();
    let count = 0;
    let now = start;
    while (now - start < budget) {
      for (let i = 0; i < BATCH; i++) sink += fn(i);
      count += BATCH;
      now = process.hrtime.bigint();
    }
    return { count, ns: now - start };
  };
  run(WARM_UP_NS);
  const { count, ns } = run(MEASURE_NS);
  return (count * 1e9) / Number(ns);
}

const gas: FlowFluidProperties = {
  densityKgPerM3: 46.7,
  viscosityPaS: 1.1e-5,
  isentropicExponent: 1.3,
  compressible: true,
};
const cone = prepareElement(
  { kind: 'cone', pipeDiameterM: 0.2, coneDiameterM: 0.14, dischargeCoefficient: 0.82 },
  293.15,
);
const venturi = prepareElement(
  { kind: 'venturi', venturiType: 'machined', pipeDiameterM: 0.2, boreDiameterM: 0.1 },
  293.15,
);
const orifice = prepareElement({ kind: 'orifice', taps: 'flange', pipeDiameterM: 0.2, boreDiameterM: 0.1 }, 293.15);
const mixture = cachedDetailMixture(GULF_COAST);

const cases: { name: string; goal: number | null; fn: (i: number) => number }[] = [
  {
    name: 'cone, fixed properties',
    goal: 2e6,
    fn: (i) => evaluateFlow(cone, dps[i], pressures[i], gas).massFlowKgPerS,
  },
  {
    name: 'venturi, fixed properties',
    goal: 2e6,
    fn: (i) => evaluateFlow(venturi, dps[i], pressures[i], gas).massFlowKgPerS,
  },
  {
    name: 'orifice, Re_D iteration',
    goal: 5e5,
    fn: (i) => evaluateFlow(orifice, dps[i], pressures[i], gas).massFlowKgPerS,
  },
  {
    name: 'water: IF97 fluidState + orifice',
    goal: null,
    fn: (i) => {
      const s = fluidState({ kind: 'water' }, 1e6 + pressures[i] / 10, temperatures[i]);
      return evaluateFlow(orifice, dps[i], 1e6 + pressures[i] / 10, s).massFlowKgPerS;
    },
  },
  {
    name: 'AGA 8 DETAIL density solve',
    goal: 1e5,
    fn: (i) => detailMolarDensityMolPerM3(mixture, pressures[i], temperatures[i]),
  },
  {
    name: 'natural gas: fluidState (AGA 8) + orifice',
    goal: null,
    fn: (i) => {
      const s = fluidState(
        { kind: 'natural-gas', composition: GULF_COAST, viscosityPaS: 1.1e-5 },
        pressures[i],
        temperatures[i],
      );
      return evaluateFlow(orifice, dps[i], pressures[i], s).massFlowKgPerS;
    },
  },
];

const fmt = (x: number) => (x >= 1e6 ? `${(x / 1e6).toFixed(2)}M` : `${(x / 1e3).toFixed(0)}k`);
console.log(`flow engine benchmark — node ${process.version}, one core, ${Number(MEASURE_NS) / 1e9} s per case`);
console.log(`${'case'.padEnd(44)}${'evals/s'.padStart(12)}${'goal'.padStart(10)}${'ratio'.padStart(9)}`);
for (const c of cases) {
  const rate = measure(c.fn);
  const ratio = c.goal ? `${(rate / c.goal).toFixed(2)}×` : '—';
  console.log(
    `${c.name.padEnd(44)}${fmt(rate).padStart(12)}${(c.goal ? fmt(c.goal) : '—').padStart(10)}${ratio.padStart(9)}`,
  );
}
if (!Number.isFinite(sink)) console.log('(non-finite result seen)');
