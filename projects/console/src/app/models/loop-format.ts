import type { Complex, DesignTargets, Plant } from '../api/api-types';

/**
 * A number as an engineer reads it: `digits` significant figures when given (trailing zeros dropped),
 * otherwise exactly as stored. Very large or small values use an exponent.
 * Example: formatNumber(2.4617, 3) = '2.46'; formatNumber(0.00005) = '5e-5'; formatNumber(1234567, 4) = '1.235e+6'.
 */
export function formatNumber(value: number, digits?: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e6) return digits === undefined ? String(value) : String(Number(value.toPrecision(digits)));
  const [mantissa, exponent] = (digits === undefined ? value.toExponential() : value.toExponential(digits - 1)).split('e');
  return `${String(Number(mantissa))}e${exponent ?? ''}`;
}

/**
 * A time in seconds with a unit that keeps the number readable.
 * Example: formatSeconds(0.00005) = '50 µs'; formatSeconds(0.02) = '20 ms'; formatSeconds(0.8) = '0.8 s'.
 */
export function formatSeconds(seconds: number): string {
  const magnitude = Math.abs(seconds);
  if (magnitude > 0 && magnitude < 1e-3) return `${formatNumber(Number((seconds * 1e6).toPrecision(6)))} µs`;
  if (magnitude > 0 && magnitude < 0.1) return `${formatNumber(Number((seconds * 1e3).toPrecision(6)))} ms`;
  return `${formatNumber(seconds)} s`;
}

/** One complex value (`im` absent means 0): `-2`, `-0.45 + 7.2j`. */
export function formatComplex(value: Complex): string {
  const im = value.im ?? 0;
  if (im === 0) return formatNumber(value.re);
  return `${formatNumber(value.re)} ${im < 0 ? '−' : '+'} ${formatNumber(Math.abs(im))}j`;
}

/**
 * A list of poles or zeros, conjugate pairs written once with ±; 'none' for an empty list.
 * Example: formatRoots([{re:-1,im:0},{re:-0.5,im:2},{re:-0.5,im:-2}]) = '-1, -0.5 ± 2j'.
 */
export function formatRoots(values: readonly Complex[] | undefined): string {
  if (!values || values.length === 0) return 'none';
  const used = new Set<number>();
  const parts: string[] = [];
  values.forEach((value, i) => {
    if (used.has(i)) return;
    used.add(i);
    const im = value.im ?? 0;
    const partner = im === 0 ? -1 : values.findIndex((other, j) => !used.has(j) && other.re === value.re && (other.im ?? 0) === -im);
    if (partner < 0) return void parts.push(formatComplex(value));
    used.add(partner);
    parts.push(`${formatNumber(value.re)} ± ${formatNumber(Math.abs(im))}j`);
  });
  return parts.join(', ');
}

/** A coefficient list, highest power first: `[1, 3.2, 52]`. */
export function formatCoefficients(values: readonly number[]): string {
  return `[${values.map((v) => formatNumber(v)).join(', ')}]`;
}

/** How the loop is sampled: its plane and, for z, the sampling period and where it came from. */
export interface LoopDomain {
  readonly plane: 's' | 'z';
  /** 's', 'z · T = 2 s', 'z · T = 2 s (ZOH of an s-plant)'. */
  readonly label: string;
  /** Dead time of an s-plant, for a second line ('dead time 0.8 s'), or ''. */
  readonly note: string;
}

/** The plane a plant lives in, with its sampling period and dead time, as the library and model page show it. */
export function loopDomain(plant: Plant): LoopDomain {
  const deadTime = plant.deadTime ? `dead time ${formatSeconds(plant.deadTime)}` : '';
  if (plant.domain === 'z') return { plane: 'z', label: `z · T = ${plant.sampleTime === undefined ? '?' : formatSeconds(plant.sampleTime)}`, note: deadTime };
  if (plant.discretize) return { plane: 'z', label: `z · T = ${formatSeconds(plant.discretize.sampleTime)}`, note: ['ZOH of an s-plant', deadTime].filter(Boolean).join(', ') };
  return { plane: 's', label: 's', note: deadTime };
}

/** The transfer function as one line: the expression, the coefficient ratio or the factored form. */
export function plantFormula(plant: Plant): string {
  if ('expression' in plant) return plant.expression;
  if ('numerator' in plant) return `${formatCoefficients(plant.numerator)} / ${formatCoefficients(plant.denominator)}`;
  return `gain ${formatNumber(plant.gain ?? 1)}, zeros ${formatRoots(plant.zeros)}, poles ${formatRoots(plant.poles)}`;
}

/**
 * Design targets in a few words: 'ζ ≥ 0.4, Ts ≤ 8 s'; 'none' without targets.
 * Example: targetsText({ minDampingRatio: 0.4, naturalFrequency: { min: 1 } }) = 'ζ ≥ 0.4, ωn ≥ 1 rad/s'.
 */
export function targetsText(targets: DesignTargets | null | undefined): string {
  if (!targets) return 'none';
  const parts: string[] = [];
  if (targets.minDampingRatio !== undefined) parts.push(`ζ ≥ ${formatNumber(targets.minDampingRatio)}`);
  if (targets.maxSettlingTime !== undefined) parts.push(`Ts ≤ ${formatSeconds(targets.maxSettlingTime)}`);
  if (targets.maxOvershootPct !== undefined) parts.push(`overshoot ≤ ${formatNumber(targets.maxOvershootPct)} %`);
  const band = targets.naturalFrequency;
  if (band?.min !== undefined && band.max !== undefined) parts.push(`${formatNumber(band.min)} ≤ ωn ≤ ${formatNumber(band.max)} rad/s`);
  else if (band?.min !== undefined) parts.push(`ωn ≥ ${formatNumber(band.min)} rad/s`);
  else if (band?.max !== undefined) parts.push(`ωn ≤ ${formatNumber(band.max)} rad/s`);
  return parts.length ? parts.join(', ') : 'none';
}

/** The design gain as the library shows it (4 significant figures), or 'not set'. */
export function gainText(gain: number | null | undefined, digits?: number): string {
  return gain === null || gain === undefined ? 'not set' : formatNumber(gain, digits);
}
