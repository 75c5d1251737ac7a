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
  if (result.breakPoints.length) {
    const where = (b) => `${fmt(b.point.re)}${b.point.im ? (b.point.im > 0 ? '+' : '') + fmt(b.point.im) + 'j' : ''}`;
    console.log(`  break points: ${result.breakPoints.map((b) => (b.gain === 0 ? `${where(b)} (repeated open-loop pole)` : `${where(b)} (K = ${fmt(b.gain)})`)).join(', ')}`);
  }
  const isStableGain = (k) => result.stableGainRanges.some((r) => k > r.from && (r.to === null || k < r.to));
  const lineGains = design.dampingLineGains[0].gains.filter(isStableGain);
  console.log(`  dominant pair ζ ≥ 0.45 for K in ${ranges(design.gainRanges)}`);
  console.log(`  ζ = 0.707 line: ${lineGains.length ? `crossed at K = ${lineGains.map(fmt).join(', ')}` : 'not crossed within the stable range'}`);
  const pick = design.gainRanges[0];
  if (pick) {
    const k = pick.to === null ? 2 * pick.from || 1 : (pick.from + pick.to) / 2;
    const s = closedLoop({ plant: loop.plant, gain: k }).step;
    const short = (x, unit) => (x === null ? 'n/a' : `${Number(x.toPrecision(3))} ${unit}`);
    console.log(`  example, middle of that range, K = ${fmt(k)}: overshoot ${short(s.overshootPct, '%')}, rise ${short(s.riseTime, 's')}, 2 % settling ${short(s.settlingTime, 's')}`);
  }
  for (const w of result.warnings) console.log(`  ! ${w.message}`);
  console.log('');
}
console.log(`Caution: ${locus({ plant: scenario.loops[0].plant }).caution}`);
