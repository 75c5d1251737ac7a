// Prints a locus summary for each loop of the invented demo company, using the built engine exactly as
// an outside script would (import by package name). Run after `npm run build`.
import { readFileSync } from 'node:fs';
import { closedLoop, designGains, locus } from '@polewright/locus-core';

const scenario = JSON.parse(readFileSync(new URL('../demo/scenario.json', import.meta.url), 'utf8'));
const fmt = (x) => (x === null ? '∞' : Number(x.toPrecision(5)).toString());
const ranges = (list) => (list.length ? list.map((r) => `(${fmt(r.from)}, ${fmt(r.to)})`).join(' ∪ ') : 'none');

console.log(`Polewright — demo loops of ${scenario.company} (invented)\n`);
for (const loop of scenario.loops) {
  const result = locus({ plant: loop.plant });
  const design = designGains({ plant: loop.plant, targets: { minDampingRatio: 0.45 }, dominantOnly: true, dampingLines: [0.707] });
  console.log(`■ ${loop.name}`);
  console.log(`  plant: ${loop.plant.expression}${loop.plant.deadTime ? `, dead time ${loop.plant.deadTime} s` : ''}${loop.plant.discretize ? `, sampled every ${loop.plant.discretize.sampleTime} s` : ''} → ${result.domain}-plane, order ${result.normalizedPlant.denominator.length - 1}`);
  console.log(`  stable for K in ${ranges(result.stableGainRanges)}`);
  if (result.crossings.length) console.log(`  stability boundary crossed at K = ${[...new Set(result.crossings.map((c) => fmt(c.gain)))].join(', ')}`);
  if (result.breakPoints.length) console.log(`  break points: ${result.breakPoints.map((b) => `${fmt(b.point.re)}${b.point.im ? (b.point.im > 0 ? '+' : '') + fmt(b.point.im) + 'j' : ''} (K=${fmt(b.gain)})`).join(', ')}`);
  console.log(`  dominant pair ζ ≥ 0.45 for K in ${ranges(design.gainRanges)}; ζ = 0.707 line crossed at K = ${design.dampingLineGains[0].gains.map(fmt).join(', ') || 'never'}`);
  const pick = design.gainRanges[0];
  if (pick) {
    const k = pick.to === null ? 2 * pick.from || 1 : (pick.from + pick.to) / 2;
    const cl = closedLoop({ plant: loop.plant, gain: k });
    const s = cl.step;
    console.log(`  at K = ${fmt(k)}: overshoot ${fmt(s.overshootPct ?? NaN)} %, rise ${fmt(s.riseTime ?? NaN)} s, 2 % settling ${fmt(s.settlingTime ?? NaN)} s`);
  }
  for (const w of result.warnings) console.log(`  ! ${w.message}`);
  console.log('');
}
console.log(`Caution: ${locus({ plant: scenario.loops[0].plant }).caution}`);
