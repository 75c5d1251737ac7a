// Engine benchmark: prints figures, asserts nothing. Run after `npm run build` (npm run bench does both).
// - per gain point: warm-started tracking (`trace`) vs a cold eigenvalue solve of the companion matrix
//   (ml-matrix) at the same gains, for plants of degree 4, 8, 12 and 20;
// - a whole `locus` call on a degree-10 plant (median of many runs).
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { characteristic, fromRoots, gainScaleOf, locus, regionOf, roots, trace } from '@polewright/locus-core';

function rng(seed) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * A plant of the given degree: stable, partly lightly damped poles and ⌊n/2⌋ real zeros, spread so that
 * the expanded polynomials stay reasonably conditioned (clustered roots at high degree measure the
 * conditioning, not the tracker).
 */
function plantOfDegree(n, seed) {
  const random = rng(seed);
  const poles = [];
  while (poles.length < n) {
    const re = -0.2 - 9 * random();
    if (n - poles.length >= 2 && random() < 0.6) {
      const im = 0.5 + 8 * random();
      poles.push({ re, im }, { re, im: -im });
    } else poles.push({ re, im: 0 });
  }
  const zeros = [];
  for (let i = 0; i < Math.floor(n / 2); i++) zeros.push({ re: -0.5 - (12 * (i + random())) / Math.floor(n / 2), im: 0 });
  return { numerator: fromRoots(zeros), denominator: fromRoots(poles) };
}

function companionEigen(p) {
  const n = p.length - 1;
  const m = Matrix.zeros(n, n);
  for (let j = 0; j < n; j++) m.set(0, j, -p[j + 1] / p[0]);
  for (let i = 1; i < n; i++) m.set(i, i - 1, 1);
  const e = new EigenvalueDecomposition(m, { assumeSymmetric: false });
  return [e.realEigenvalues, e.imaginaryEigenvalues];
}

/** Median over 7 rounds of the mean time per call within a round of at least `minMs`. */
function timeIt(fn, minMs = 150) {
  fn();
  const rounds = [];
  for (let round = 0; round < 7; round++) {
    let runs = 0;
    const start = performance.now();
    let elapsed = 0;
    while (elapsed < minMs) {
      fn();
      runs++;
      elapsed = performance.now() - start;
    }
    rounds.push(elapsed / runs);
  }
  rounds.sort((a, b) => a - b);
  return rounds[3];
}

console.log('Polewright engine benchmark (Node ' + process.version + ')');
console.log('degree | gain points | tracking µs/point | cold companion-eigen µs/point | cold Aberth µs/point | eigen / tracking');
for (const n of [4, 8, 12, 20]) {
  const { numerator, denominator } = plantOfDegree(n, 1000 + n);
  const poles = roots(denominator);
  const zeros = roots(numerator);
  const region = regionOf([...poles, ...zeros], 's');
  const gainScale = gainScaleOf(numerator, denominator, region, poles);
  // the gain span `locus` itself would choose for this plant
  const end = locus({ plant: { numerator, denominator } }).gainSpan.max;
  const options = { scale: region.scale, center: region.center, gainScale };
  const once = trace(numerator, denominator, poles, end, [], options);
  const gains = once.gains;
  const trackMs = timeIt(() => trace(numerator, denominator, poles, end, [], options));
  const eigMs = timeIt(() => {
    for (const g of gains) companionEigen(characteristic(numerator, denominator, g));
  });
  const aberthMs = timeIt(() => {
    for (const g of gains) roots(characteristic(numerator, denominator, g));
  });
  const per = (ms) => ((ms * 1000) / gains.length).toFixed(2);
  console.log(`${String(n).padStart(6)} | ${String(gains.length).padStart(11)} | ${per(trackMs).padStart(17)} | ${per(eigMs).padStart(29)} | ${per(aberthMs).padStart(20)} | ${(eigMs / trackMs).toFixed(1)}×`);
}

const ten = plantOfDegree(10, 77);
const request = { plant: { numerator: ten.numerator, denominator: ten.denominator } };
const samples = [];
locus(request);
for (let i = 0; i < 200; i++) {
  const t0 = performance.now();
  locus(request);
  samples.push(performance.now() - t0);
}
samples.sort((a, b) => a - b);
const result = locus(request);
console.log(`whole locus, degree 10: median ${samples[100].toFixed(2)} ms, p90 ${samples[180].toFixed(2)} ms (${result.branches[0].points.length} gain points × ${result.branches.length} branches)`);
console.log('targets: ≥ 5× faster than the cold solve at degree 8, never slower at degree 20, whole degree-10 locus < 10 ms');
