import type { Complex } from '@polewright/locus-core';
import { scaleLinear } from 'd3-scale';
import type { Extent } from './plot-frame';

/** A guide curve of the plane (plane coordinates) with the label drawn at its `labelAt` point. */
export interface Guide {
  readonly kind: 'damping' | 'frequency' | 'unit-circle';
  readonly points: readonly Complex[];
  readonly label: string;
  readonly labelAt: Complex | null;
  /** How the label's text is anchored at `labelAt`. */
  readonly anchor?: 'start' | 'end';
  /** Whether the label sits below its point (the s-plane ωn labels keep off branches on the real axis). */
  readonly below?: boolean;
}

/** The damping ratios drawn as guides (rays in s, spirals in z). */
export const GUIDE_DAMPING = [0.2, 0.4, 0.6, 0.8] as const;

/** Samples per guide curve: smooth at any zoom the fit allows. */
const SAMPLES = 90;

/**
 * s-plane guides: constant-damping rays from the origin into the left half-plane, at angle acos ζ from
 * the negative real axis (s = ωn(−ζ ± j√(1−ζ²))), and natural-frequency half-circles |s| = ωn at round
 * values of ωn for the visible part of the plane.
 * Example: the ζ = 0.6 ray passes through −3 ± 4j.
 */
export function sPlaneGuides(view: Extent): Guide[] {
  const reach = 2 * Math.max(Math.hypot(view.minRe, view.minIm), Math.hypot(view.minRe, view.maxIm), Math.hypot(view.maxRe, view.maxIm), Math.hypot(view.maxRe, view.minIm));
  const guides: Guide[] = [];
  for (const zeta of GUIDE_DAMPING) {
    const d = Math.sqrt(1 - zeta * zeta);
    for (const sign of [1, -1]) {
      const end = { re: -zeta * reach, im: sign * d * reach };
      guides.push({ kind: 'damping', points: [{ re: 0, im: 0 }, end], label: sign > 0 ? `ζ ${zeta}` : '', labelAt: sign > 0 ? rayLabel(zeta, view) : null });
    }
  }
  const visibleRadius = Math.max(Math.abs(view.minRe), Math.abs(view.minIm), Math.abs(view.maxIm));
  for (const wn of scaleLinear().domain([0, visibleRadius]).nice().ticks(4)) {
    if (wn <= 0) continue;
    const points: Complex[] = [];
    for (let i = 0; i <= SAMPLES; i++) {
      const theta = Math.PI / 2 + (Math.PI * i) / SAMPLES;
      points.push({ re: wn * Math.cos(theta), im: wn * Math.sin(theta) });
    }
    guides.push({ kind: 'frequency', points, label: `ωn ${formatFigure(wn)}`, labelAt: { re: -wn, im: 0 }, below: true });
  }
  return guides;
}

/**
 * z-plane guides, the images of the s-plane ones under z = exp(sT): the unit circle (|z| = 1), the
 * constant-damping spirals z = exp(−ζθ/√(1−ζ²))·e^{jθ} for θ = ωd·T in [0, π], and the constant
 * natural-frequency curves z = exp(ωn·T·e^{jφ}) for φ in [π/2, π] at ωn·T = kπ/5. These curves do not
 * depend on T; only their labels do (they read in units of π/T).
 * Example: the ζ = 0 spiral is the unit circle; ωn·T = π ends at z = exp(−π) ≈ 0.0432 on the real axis.
 */
export function zPlaneGuides(): Guide[] {
  const guides: Guide[] = [];
  const circle: Complex[] = [];
  for (let i = 0; i <= 2 * SAMPLES; i++) {
    const t = (2 * Math.PI * i) / (2 * SAMPLES);
    circle.push({ re: Math.cos(t), im: Math.sin(t) });
  }
  guides.push({ kind: 'unit-circle', points: circle, label: '|z| = 1', labelAt: null });
  for (const zeta of GUIDE_DAMPING) {
    const k = zeta / Math.sqrt(1 - zeta * zeta);
    for (const sign of [1, -1]) {
      const points: Complex[] = [];
      for (let i = 0; i <= SAMPLES; i++) {
        const theta = (Math.PI * i) / SAMPLES;
        const r = Math.exp(-k * theta);
        points.push({ re: r * Math.cos(theta), im: sign * r * Math.sin(theta) });
      }
      // labelled where the spiral crosses the positive imaginary axis (θ = π/2): the labels then stack apart
      const onAxis = points[Math.round(SAMPLES / 2)];
      guides.push({ kind: 'damping', points, label: sign > 0 ? `ζ ${zeta}` : '', labelAt: sign > 0 ? onAxis : null });
    }
  }
  for (let k = 1; k <= 5; k++) {
    const a = (k * Math.PI) / 5;
    for (const sign of [1, -1]) {
      const points: Complex[] = [];
      for (let i = 0; i <= SAMPLES; i++) {
        const phi = Math.PI / 2 + (Math.PI / 2) * (i / SAMPLES);
        const re = a * Math.cos(phi);
        const im = sign * a * Math.sin(phi);
        const r = Math.exp(re);
        points.push({ re: r * Math.cos(im), im: r * Math.sin(im) });
      }
      const label = k === 5 ? 'ωn π/T' : `ωn ${k / 5}π/T`;
      // labelled just outside the unit circle where the curve starts (z = e^{jωnT})
      const start = { re: 1.05 * points[0].re, im: 1.05 * points[0].im };
      guides.push({ kind: 'frequency', points, label: sign > 0 ? label : '', labelAt: sign > 0 ? start : null, anchor: a > Math.PI / 2 ? 'end' : 'start' });
    }
  }
  return guides;
}

/** A number for a guide label: up to three significant digits, no trailing zeros. */
export function formatFigure(value: number): string {
  if (value === 0) return '0';
  const abs = Math.abs(value);
  if (abs >= 1e4 || abs < 1e-3) return value.toExponential(1).replace('e+', 'e');
  return String(Number(value.toPrecision(3)));
}

// a damping ray's label sits where the ray meets the top of the view (or the left edge if it leaves there)
function rayLabel(zeta: number, view: Extent): Complex {
  const d = Math.sqrt(1 - zeta * zeta);
  const tTop = view.maxIm > 0 ? (view.maxIm * 0.94) / d : Infinity;
  const tLeft = view.minRe < 0 ? (-view.minRe * 0.94) / zeta : Infinity;
  const t = Math.min(tTop, tLeft);
  return Number.isFinite(t) ? { re: -zeta * t, im: d * t } : { re: 0, im: 0 };
}
