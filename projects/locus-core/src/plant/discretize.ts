import { exp } from '../complex/complex';
import { solveComplex } from '../numeric/complex-solve';
import { evaluateComplex } from '../polynomial/evaluate';
import { fromRoots } from '../polynomial/from-roots';
import type { Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import { realizeCascade } from './cascade';
import { heldStep, multiplyVector } from './zero-order-hold';

/** A z-domain transfer function, highest power first. */
export interface SampledTransferFunction {
  readonly numerator: number[];
  readonly denominator: number[];
}

/**
 * Zero-order-hold equivalent of the continuous plant N(s)/D(s)·e^{−s·delay} at sampling period T,
 * exact for the linear model (no approximation of the delay): with delay = d·T + θ (0 ≤ θ < T)
 *   x[k+1] = Φx[k] + Γ₀u[k−d] + Γ₁u[k−d−1],  Γ₀ = ∫₀^{T−θ} e^{Aη}dη·B,  Γ₁ = e^{A(T−θ)}∫₀^{θ} e^{Aη}dη·B
 * (the modified z-transform; e.g. G. F. Franklin, J. D. Powell, M. Workman, "Digital Control of
 * Dynamic Systems", 3rd ed., section 4.3.4 — recalled from memory).
 * The denominator is Π(z − e^{pᵢT}) over the poles of D; the numerator is interpolated from the
 * state-space model at n + 1 points on a circle enclosing every pole (a discrete Fourier transform).
 * Example: 1/(s+1) at T = 0.1 gives (1 − e^{−0.1}) / (z − e^{−0.1}).
 */
export function zeroOrderHoldEquivalent(
  numerator: Polynomial,
  denominator: Polynomial,
  sampleTime: number,
  delay = 0,
): SampledTransferFunction {
  const n = denominator.length - 1;
  const wholeSamples = Math.floor(delay / sampleTime + 1e-12);
  let theta = delay - wholeSamples * sampleTime;
  if (theta < 1e-12 * sampleTime) theta = 0;
  const extra = theta > 0 ? 1 : 0;
  const sPoles = roots(denominator);
  const model = realizeCascade(numerator[0] / denominator[0], roots(numerator), sPoles);
  const zPoles = sPoles.map((p) => exp({ re: p.re * sampleTime, im: p.im * sampleTime }));
  const denZ = fromRoots(zPoles);
  const first = heldStep(model, sampleTime - theta);
  const gamma0 = first.gamma;
  let gamma1 = new Array<number>(n).fill(0);
  if (theta > 0) gamma1 = multiplyVector(first.phi, heldStep(model, theta).gamma);
  const phi = theta > 0 ? heldStep(model, sampleTime).phi : first.phi;

  // H(z) = C(zI − Φ)⁻¹(Γ₀·z^extra + Γ₁) + D; G(z) = H(z) / z^{d + extra}
  let radius = 1;
  for (const z of zPoles) radius = Math.max(radius, Math.hypot(z.re, z.im));
  radius *= 1.5;
  const count = n + 1;
  const valuesRe: number[] = [];
  const valuesIm: number[] = [];
  for (let k = 0; k < count; k++) {
    const angle = (2 * Math.PI * k) / count;
    const z = { re: radius * Math.cos(angle), im: radius * Math.sin(angle) };
    let hr = model.d;
    let hi = 0;
    if (n > 0) {
      const ar = phi.map((row, i) => row.map((v, j) => (i === j ? z.re : 0) - v));
      const ai = phi.map((row, i) => row.map((_, j) => (i === j ? z.im : 0)));
      const zr = extra ? z.re : 1;
      const zi = extra ? z.im : 0;
      const br = gamma0.map((g, i) => g * zr + gamma1[i]);
      const bi = gamma0.map((g) => g * zi);
      const x = solveComplex(ar, ai, br, bi);
      if (x) {
        for (let i = 0; i < n; i++) {
          hr += model.c[i] * x.re[i];
          hi += model.c[i] * x.im[i];
        }
      }
    }
    const dz = evaluateComplex(denZ, z);
    valuesRe.push(hr * dz.re - hi * dz.im);
    valuesIm.push(hr * dz.im + hi * dz.re);
  }
  // inverse DFT: coefficient of power j = (1/count)·Σ_k v_k·ω^{−jk} / radius^j
  const byPower: number[] = [];
  for (let j = 0; j < count; j++) {
    let sr = 0;
    for (let k = 0; k < count; k++) {
      const angle = (-2 * Math.PI * j * k) / count;
      sr += valuesRe[k] * Math.cos(angle) - valuesIm[k] * Math.sin(angle);
    }
    byPower.push(sr / count / radius ** j);
  }
  // the z^n coefficient is known exactly: D, plus C·Γ₀ when the fractional delay adds a sample
  byPower[n] = model.d + (extra ? model.c.reduce((acc, c, i) => acc + c * gamma0[i], 0) : 0);
  const num = byPower.reverse();
  const den = [...denZ, ...new Array<number>(wholeSamples + extra).fill(0)];
  let start = 0;
  while (start < num.length - 1 && num[start] === 0) start++;
  return { numerator: num.slice(start), denominator: den };
}
