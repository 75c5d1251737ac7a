import type { Complex, DesignResult, Domain } from '@polewright/locus-core';
import type { Extent } from './plot-frame';

/** The design region as the core applied it (`DesignResult.region`). */
export type TargetRegion = DesignResult['region'];

/** Samples along each curved edge of the region. */
const SAMPLES = 72;

/**
 * The outline (plane coordinates, closed) of the part of the plane meeting the targets, or null when the
 * targets constrain nothing or leave nothing. In s: ζ ≥ ζmin (a wedge about the negative real axis,
 * half-angle acos ζmin), −Re s ≥ σmin (decay rate), ωmin ≤ |s| ≤ ωmax. Written in polar form about the
 * origin, s = −r·e^{∓jφ}: for each |φ| ≤ φmax the radius runs from max(ωmin, σmin / cos φ) to ωmax — one
 * simple polygon. An open outer edge (no ωmax) is drawn at a radius beyond the view. In z the same region,
 * kept to the primary strip |Im s| ≤ π/T, is mapped through z = exp(sT).
 * Example: ζmin = 0.5, σmin = 1 and no band give the wedge of half-angle 60° left of Re s = −1.
 */
export function targetRegion(region: TargetRegion, domain: Domain, sampleTime: number | null, view: Extent): Complex[] | null {
  const zetaMin = clamp(region.minDampingRatio ?? 0, 0, 1);
  const sigmaMin = Math.max(region.minDecayRate ?? 0, 0);
  const wMin = Math.max(region.naturalFrequency.min ?? 0, 0);
  const wMaxGiven = region.naturalFrequency.max;
  if (zetaMin === 0 && sigmaMin === 0 && wMin === 0 && wMaxGiven === null) return null;
  const T = domain === 'z' ? (sampleTime ?? 1) : 0;
  const far =
    domain === 's'
      ? 3 * Math.max(Math.abs(view.minRe), Math.abs(view.maxRe), Math.abs(view.minIm), Math.abs(view.maxIm), 1)
      : (3 * Math.PI) / T; // past the strip; the strip cut below bounds it
  const wMax = wMaxGiven ?? far;
  // φ beyond which the inner edge passes the outer one: σmin / cos φ ≤ ωmax
  const phiDamping = Math.acos(zetaMin);
  const phiDecay = sigmaMin > 0 ? Math.acos(Math.min(1, sigmaMin / wMax)) : Math.PI / 2;
  const phiMax = Math.min(phiDamping, phiDecay, Math.PI / 2);
  if (wMax <= wMin || wMax <= sigmaMin) return null;
  const outer: Complex[] = [];
  const inner: Complex[] = [];
  for (let i = 0; i <= SAMPLES; i++) {
    const phi = -phiMax + (2 * phiMax * i) / SAMPLES;
    const c = Math.cos(phi);
    const rIn = Math.max(wMin, c > 1e-12 ? sigmaMin / c : sigmaMin > 0 ? Infinity : 0);
    const rOut = wMax;
    outer.push({ re: -rOut * c, im: rOut * Math.sin(phi) });
    inner.push({ re: -Math.min(rIn, rOut) * c, im: Math.min(rIn, rOut) * Math.sin(phi) });
  }
  const sOutline = [...outer, ...inner.reverse()];
  if (domain === 's') return sOutline;
  return mapToZ(clipToStrip(sOutline, Math.PI / T), T);
}

/** Keeps a polygon to the strip |Im s| ≤ h (Sutherland–Hodgman against the two edges). */
export function clipToStrip(polygon: readonly Complex[], h: number): Complex[] {
  const clipEdge = (points: readonly Complex[], inside: (p: Complex) => boolean, limit: number): Complex[] => {
    const out: Complex[] = [];
    for (let i = 0; i < points.length; i++) {
      const a = points[i];
      const b = points[(i + 1) % points.length];
      const aIn = inside(a);
      const bIn = inside(b);
      if (aIn) out.push(a);
      if (aIn !== bIn) {
        const t = (limit - a.im) / (b.im - a.im);
        out.push({ re: a.re + t * (b.re - a.re), im: limit });
      }
    }
    return out;
  };
  return clipEdge(clipEdge(polygon, (p) => p.im <= h, h), (p) => p.im >= -h, -h);
}

/** Maps an s-polygon through z = exp(sT), densifying its edges so that straight edges bend correctly. */
export function mapToZ(polygon: readonly Complex[], T: number): Complex[] {
  const out: Complex[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const a = polygon[i];
    const b = polygon[(i + 1) % polygon.length];
    // about one sample per 0.02 rad of sT, so that long straight edges become smooth curves
    const steps = Math.min(400, Math.max(1, Math.ceil((Math.hypot(b.re - a.re, b.im - a.im) * T) / 0.02)));
    for (let k = 0; k < steps; k++) {
      const t = k / steps;
      const re = (a.re + t * (b.re - a.re)) * T;
      const im = (a.im + t * (b.im - a.im)) * T;
      const r = Math.exp(re);
      out.push({ re: r * Math.cos(im), im: r * Math.sin(im) });
    }
  }
  return out;
}

function clamp(v: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, v));
}
