import type { Complex } from '../complex/complex';
import type { Domain, Warning } from '../types/plant';

/** Relative distance under which a pole and a zero are reported as (nearly) cancelling. */
export const CANCELLATION_TOLERANCE = 1e-6;

/**
 * Warnings for open-loop poles that coincide (or nearly) with zeros. The engine keeps both: the
 * common factor stays in the characteristic polynomial, so a cancelled unstable pole still shows up
 * as an unstable closed-loop pole at every gain — which is what it is, a hidden mode.
 */
export function cancellationWarnings(poles: readonly Complex[], zeros: readonly Complex[], domain: Domain): Warning[] {
  const warnings: Warning[] = [];
  const usedZeros = new Set<number>();
  for (const p of poles) {
    if (p.im < 0) continue; // report each conjugate pair once
    const scale = Math.max(1, Math.hypot(p.re, p.im));
    for (let j = 0; j < zeros.length; j++) {
      if (usedZeros.has(j)) continue;
      const z = zeros[j];
      const gap = Math.hypot(p.re - z.re, p.im - z.im);
      if (gap > CANCELLATION_TOLERANCE * scale) continue;
      usedZeros.add(j);
      const where = p.im === 0 ? `${format(p.re)}` : `${format(p.re)} ± ${format(Math.abs(p.im))}j`;
      const unstable = domain === 's' ? p.re >= 0 : Math.hypot(p.re, p.im) >= 1;
      if (unstable) {
        warnings.push({
          code: 'hidden-unstable-mode',
          message:
            `The open-loop pole at ${where} is cancelled by a zero, and it is not a stable pole: it is a hidden ` +
            `unstable mode. No feedback gain moves it, so the loop stays internally unstable whatever the plot of ` +
            `the remaining poles suggests. Remove the instability in the plant or the compensator instead of cancelling it.`,
        });
      } else {
        // computed roots of a common simple factor agree to rounding, so "exact" means equal to
        // working precision (a repeated common factor agrees less well and is reported as near)
        const exact = gap <= 1e-10 * scale;
        warnings.push({
          code: exact ? 'pole-zero-cancellation' : 'near-pole-zero-cancellation',
          message:
            `The open-loop pole at ${where} is ${exact ? 'cancelled' : 'almost cancelled'} by a zero; the closed loop ` +
            `keeps a pole there at every gain, and a small model error moves it.`,
        });
      }
      break;
    }
  }
  return warnings;
}

function format(x: number): string {
  return Number(x.toPrecision(6)).toString();
}
