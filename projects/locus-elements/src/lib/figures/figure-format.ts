const plain = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 4 });
const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

/**
 * A figure for display with four significant digits, as m×10ⁿ (three digits) beyond 1e6 or below 1e-3;
 * `—` for null or a non-finite value.
 * Example: formatFigure(14269.96) = '14,270'; formatFigure(3.2e-5) = '3.2×10⁻⁵'.
 */
export function formatFigure(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const size = Math.abs(value);
  if (size < 1e6 && size >= 1e-3) return plain.format(value).replace(/^-/, '−');
  const [mantissa, exponent] = value.toExponential(2).split('e');
  const digits = String(Number(mantissa)).replace(/^-/, '−');
  return `${digits}×10${[...String(Number(exponent))].map((c) => SUPERSCRIPT[c] ?? c).join('')}`;
}

/**
 * A complex value as `a ± bj` (or `a + bj` / `a − bj` when `paired` is false); the real part alone when real.
 * Example: formatComplex({ re: -1, im: 2 }, true) = '−1 ± 2j'.
 */
export function formatComplex(value: { re: number; im: number }, paired = false): string {
  const re = formatFigure(value.re);
  if (value.im === 0) return re;
  const sign = paired ? '±' : value.im > 0 ? '+' : '−';
  return `${re} ${sign} ${formatFigure(Math.abs(value.im))}j`;
}

/** A ratio in decibels of amplitude, 20·log10(ratio). Example: decibels(10) = 20. */
export function decibels(ratio: number): number {
  return 20 * Math.log10(ratio);
}
