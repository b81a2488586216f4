/**
 * Timing of the hot special functions (ns per call). Run: node --import tsx bench/special.ts
 *
 * Each loop calls one function over a fixed array of arguments (so the call site is monomorphic)
 * and is timed by CPU time of this process (process.cpuUsage) as well as wall time: on a shared,
 * loaded machine the CPU figure is the steadier one. Math.exp is timed the same way as a yardstick.
 * Garbage collections during each timed loop are counted (PerformanceObserver 'gc'): 0 means the
 * function allocated nothing that needed collecting.
 */
import { PerformanceObserver } from 'node:perf_hooks';
import { createRng } from '../core/random/index.js';
import { gammaPInv, logGammaP, logGammaQ, normalLogCdf, normalLogSf } from '../core/special/index.js';

let gcCount = 0;
const obs = new PerformanceObserver((list) => {
  gcCount += list.getEntries().length;
});
obs.observe({ entryTypes: ['gc'] });

const N = 4096;
const rows: { name: string; cpuNs: number; wallNs: number; gcs: number }[] = [];
let sink = 0;

function time(name: string, callsPerRun: number, run: () => number, minCalls = 2e6): void {
  for (let i = 0; i < 20; i++) sink += run(); // warm up (optimize)
  const runs = Math.max(1, Math.ceil(minCalls / callsPerRun));
  const gc0 = gcCount;
  const c0 = process.cpuUsage();
  const w0 = process.hrtime.bigint();
  for (let r = 0; r < runs; r++) sink += run();
  const wall = Number(process.hrtime.bigint() - w0);
  const c = process.cpuUsage(c0);
  const calls = runs * callsPerRun;
  rows.push({ name, cpuNs: ((c.user + c.system) * 1000) / calls, wallNs: wall / calls, gcs: gcCount - gc0 });
}

const rng = createRng(20240601);
const zBulk = new Float64Array(N).map(() => rng.normal());
const zWide = new Float64Array(N).map(() => -40 + 80 * rng.uniform());
const uGrid = new Float64Array(N).map((_, i) => (i + 0.5) / N);

time('Math.exp (yardstick)', N, () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += Math.exp(zBulk[i] as number);
  return s;
});
time('normalLogCdf, z ~ N(0,1)', N, () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += normalLogCdf(zBulk[i] as number);
  return s;
});
time('normalLogCdf, z uniform on [-40, 40]', N, () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += normalLogCdf(zWide[i] as number);
  return s;
});
time('normalLogSf, z ~ N(0,1)', N, () => {
  let s = 0;
  for (let i = 0; i < N; i++) s += normalLogSf(zBulk[i] as number);
  return s;
});

for (const a of [0.7, 2.5, 9, 150]) {
  // x spread over the distribution itself: its quantiles at a uniform grid of probabilities.
  const xs = uGrid.map((u) => gammaPInv(a, u));
  time(`logGammaP, a = ${a}, x at gamma quantiles`, N, () => {
    let s = 0;
    for (let i = 0; i < N; i++) s += logGammaP(a, xs[i] as number);
    return s;
  }, 1e6);
  time(`logGammaQ, a = ${a}, x at gamma quantiles`, N, () => {
    let s = 0;
    for (let i = 0; i < N; i++) s += logGammaQ(a, xs[i] as number);
    return s;
  }, 1e6);
}
{
  // a changing on every call: the per-shape memo never hits (worst case, as in a shape search).
  const as = new Float64Array(N).map(() => 0.5 + 200 * rng.uniform());
  const xs = as.map((a, i) => gammaPInv(a, uGrid[i] as number));
  time('logGammaQ, a uniform on [0.5, 200.5] changing every call', N, () => {
    let s = 0;
    for (let i = 0; i < N; i++) s += logGammaQ(as[i] as number, xs[i] as number);
    return s;
  }, 5e5);
}
for (const a of [0.7, 2.5, 9, 150]) {
  time(`gammaPInv, a = ${a}, p on a uniform grid`, N, () => {
    let s = 0;
    for (let i = 0; i < N; i++) s += gammaPInv(a, uGrid[i] as number);
    return s;
  }, 2e5);
}

obs.disconnect();
const w = Math.max(...rows.map((r) => r.name.length));
console.log(`${'function'.padEnd(w)}  cpu ns/call  wall ns/call  GCs`);
for (const r of rows) {
  console.log(`${r.name.padEnd(w)}  ${r.cpuNs.toFixed(1).padStart(11)}  ${r.wallNs.toFixed(1).padStart(12)}  ${String(r.gcs).padStart(3)}`);
}
if (sink === 42) console.log('');
