import type { Polynomial } from '../polynomial/polynomial';

/**
 * Asymptotes of the branches that leave for infinity: centroid σ = (Σpᵢ − Σzⱼ)/(n − m), computed from
 * the coefficients (Σpᵢ = −d₁/d₀, Σzⱼ = −n₁/n₀), and angles θ_l with (n − m)·θ_l ≡ ∠c − 180° (mod 360°)
 * for K > 0 (∠c − 0° for K < 0), where c = n₀/d₀ is the ratio of leading coefficients. Angles are in
 * degrees in (−180°, 180°], ascending; `null` when n = m.
 * Example: N = 1, D = s(s + 1)(s + 2) gives centroid −1 and angles −60°, 60°, 180°.
 */
export function asymptotes(numerator: Polynomial, denominator: Polynomial, negativeGain = false): { centroid: number; anglesDeg: number[] } | null {
  const n = denominator.length - 1;
  const m = numerator.length - 1;
  const count = n - m;
  if (count <= 0) return null;
  const poleSum = n >= 1 ? -denominator[1] / denominator[0] : 0;
  const zeroSum = m >= 1 ? -numerator[1] / numerator[0] : 0;
  const centroid = (poleSum - zeroSum) / count;
  const leadAngle = numerator[0] / denominator[0] > 0 ? 0 : 180;
  const base = leadAngle - (negativeGain ? 0 : 180);
  const anglesDeg: number[] = [];
  for (let l = 0; l < count; l++) anglesDeg.push(normalizeDegrees((base + 360 * l) / count));
  anglesDeg.sort((a, b) => a - b);
  return { centroid, anglesDeg };
}

/** An angle in degrees brought into (−180°, 180°]. */
export function normalizeDegrees(angle: number): number {
  let a = angle % 360;
  if (a <= -180) a += 360;
  if (a > 180) a -= 360;
  // keep exact multiples tidy (e.g. 59.99999999999999 → 60)
  const rounded = Math.round(a * 1e9) / 1e9;
  return rounded === -180 ? 180 : rounded;
}
