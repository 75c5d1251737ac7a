import type { Complex } from '../complex/complex';
import { hasCompleteConjugatePairs } from '../complex/conjugate-pairs';
import { ValidationError, type FieldIssue } from '../errors';
import { fromRoots } from '../polynomial/from-roots';
import { multiply, scale, trim } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import type { Domain, NormalizedPlant, Plant, Warning } from '../types/plant';
import { cancellationWarnings } from './cancellations';
import { zeroOrderHoldEquivalent } from './discretize';
import { parseExpression } from './expression';
import { DEFAULT_PADE_ORDER, MAX_DEGREE, MAX_PADE_ORDER } from './limits';
import { pade } from './pade';

export { DEFAULT_PADE_ORDER, MAX_DEGREE, MAX_PADE_ORDER };

/**
 * Checks a plant in any of its three forms and reduces it to numerator and denominator coefficients
 * (denominator monic) in its working domain, applying dead time and discretisation.
 * Throws `ValidationError` naming every field at fault; `pointer` is where the plant sits in the request.
 */
export function normalizePlant(plant: unknown, pointer = '/plant'): NormalizedPlant {
  if (!isObject(plant)) throw ValidationError.at(pointer, 'must be an object describing the plant');
  const issues: FieldIssue[] = [];
  const common = checkCommon(plant, pointer, issues);
  if (issues.length) throw new ValidationError(issues);

  const sourceVariable: Domain = common.discretizeTime !== null ? 's' : common.domain;
  let { numerator, denominator } = readForm(plant, pointer, sourceVariable);
  const formPointer = 'expression' in plant ? `${pointer}/expression` : 'numerator' in plant ? `${pointer}/numerator` : `${pointer}/zeros`;
  const denominatorPointer = 'expression' in plant ? `${pointer}/expression` : 'denominator' in plant ? `${pointer}/denominator` : `${pointer}/poles`;
  numerator = trim(numerator);
  denominator = trim(denominator);
  if (denominator.length === 0) throw ValidationError.at(denominatorPointer, 'is zero; the denominator must be a non-zero polynomial');
  if (numerator.length === 0) throw ValidationError.at(formPointer, 'is zero, so the loop gain is zero at every frequency and there is nothing to trace');
  if (numerator.length > denominator.length) {
    throw ValidationError.at(
      formPointer,
      `has degree ${numerator.length - 1}, above the denominator's ${denominator.length - 1}: the plant must be proper (a physical loop cannot have more zeros than poles)`,
    );
  }
  if (denominator.length - 1 > MAX_DEGREE) {
    throw ValidationError.at(denominatorPointer, `has degree ${denominator.length - 1}; at most ${MAX_DEGREE} is supported`);
  }

  const warnings: Warning[] = [];
  let domain: Domain = common.domain;
  let sampleTime: number | null = common.domain === 'z' ? common.sampleTime : null;
  if (common.discretizeTime !== null) {
    const delaySamples = Math.ceil(common.deadTime / common.discretizeTime);
    if (delaySamples + denominator.length - 1 > MAX_DEGREE) {
      throw ValidationError.at(`${pointer}/deadTime`, `spans ${delaySamples} sampling periods; the sampled plant's degree would pass ${MAX_DEGREE}`);
    }
    const sampled = zeroOrderHoldEquivalent(numerator, denominator, common.discretizeTime, common.deadTime);
    if (![...sampled.numerator, ...sampled.denominator].every(Number.isFinite)) {
      throw ValidationError.at(`${pointer}/discretize/sampleTime`, "is too long for this plant's dynamics: e^(pole·T) overflows double precision");
    }
    numerator = sampled.numerator;
    denominator = sampled.denominator;
    domain = 'z';
    sampleTime = common.discretizeTime;
    if (denominator.length - 1 > MAX_DEGREE) {
      throw ValidationError.at(`${pointer}/deadTime`, `makes the sampled plant of degree ${denominator.length - 1}; at most ${MAX_DEGREE} is supported`);
    }
  } else if (common.deadTime > 0 && domain === 's') {
    const approximant = pade(common.deadTime, common.padeOrder);
    if (![...approximant.numerator, ...approximant.denominator].every(Number.isFinite)) {
      throw ValidationError.at(`${pointer}/deadTime`, `is too long for an order-${common.padeOrder} Padé approximant in double precision; give it in a larger time unit (e.g. minutes) together with the plant`);
    }
    numerator = multiply(numerator, approximant.numerator);
    denominator = multiply(denominator, approximant.denominator);
    if (denominator.length - 1 > MAX_DEGREE) {
      throw ValidationError.at(`${pointer}/padeOrder`, `makes the plant of degree ${denominator.length - 1}; at most ${MAX_DEGREE} is supported`);
    }
    warnings.push({
      code: 'dead-time-approximated',
      message:
        `The dead time of ${common.deadTime} s is replaced by an order-${common.padeOrder} Padé approximant; ` +
        `its poles and zeros are part of the plot, and the locus is trustworthy only well below about ` +
        `${Number((common.padeOrder / common.deadTime).toPrecision(3))} rad/s (a rule of thumb, not a bound).`,
    });
  } else if (common.deadTime > 0 && domain === 'z') {
    const samples = Math.round(common.deadTime / (sampleTime as number));
    if (samples + denominator.length - 1 > MAX_DEGREE) {
      throw ValidationError.at(`${pointer}/deadTime`, `adds ${samples} samples of delay; the plant's degree would pass ${MAX_DEGREE}`);
    }
    denominator = [...denominator, ...new Array<number>(samples).fill(0)];
  }

  const lead = denominator[0];
  numerator = trim(numerator.map((c) => c / lead));
  denominator = denominator.map((c) => c / lead);
  if (![...numerator, ...denominator].every(Number.isFinite) || numerator.length === 0) {
    throw ValidationError.at(
      formPointer,
      'has coefficients whose ratios to the leading denominator coefficient overflow or vanish in double precision; rescale the time unit or the gain so that they stay within about 1e±300',
    );
  }
  warnings.push(...cancellationWarnings(roots(denominator), roots(numerator), domain));
  return { numerator, denominator, domain, sampleTime, warnings };
}

interface CommonFields {
  domain: Domain;
  sampleTime: number;
  deadTime: number;
  padeOrder: number;
  discretizeTime: number | null;
}

function checkCommon(plant: Record<string, unknown>, pointer: string, issues: FieldIssue[]): CommonFields {
  const forms = ['numerator' in plant || 'denominator' in plant, 'zeros' in plant || 'poles' in plant || 'gain' in plant, 'expression' in plant].filter(Boolean).length;
  if (forms === 0) issues.push({ pointer, detail: 'must give either numerator and denominator, or zeros, poles and gain, or expression' });
  if (forms > 1) issues.push({ pointer, detail: 'mixes plant forms; give only one of: numerator/denominator, zeros/poles/gain, expression' });

  const domain = plant['domain'] ?? 's';
  if (domain !== 's' && domain !== 'z') issues.push({ pointer: `${pointer}/domain`, detail: 'must be "s" (continuous) or "z" (sampled)' });
  let sampleTime = NaN;
  if (plant['sampleTime'] !== undefined) {
    if (!isPositive(plant['sampleTime'])) issues.push({ pointer: `${pointer}/sampleTime`, detail: 'must be a positive number of seconds' });
    else sampleTime = plant['sampleTime'] as number;
  }
  if (domain === 'z' && plant['sampleTime'] === undefined) {
    issues.push({ pointer: `${pointer}/sampleTime`, detail: 'is required for a z-domain plant (the sampling period in seconds)' });
  }
  let deadTime = 0;
  if (plant['deadTime'] !== undefined) {
    const value = plant['deadTime'];
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      issues.push({ pointer: `${pointer}/deadTime`, detail: 'must be a number of seconds, zero or more' });
    } else deadTime = value;
  }
  let padeOrder = DEFAULT_PADE_ORDER;
  if (plant['padeOrder'] !== undefined) {
    const value = plant['padeOrder'];
    if (typeof value !== 'number' || !Number.isInteger(value) || value < 1 || value > MAX_PADE_ORDER) {
      issues.push({ pointer: `${pointer}/padeOrder`, detail: `must be a whole number from 1 to ${MAX_PADE_ORDER}` });
    } else padeOrder = value;
  }
  let discretizeTime: number | null = null;
  if (plant['discretize'] !== undefined) {
    const value = plant['discretize'];
    if (!isObject(value) || !isPositive(value['sampleTime'])) {
      issues.push({ pointer: `${pointer}/discretize/sampleTime`, detail: 'must be a positive number of seconds' });
    } else if (domain === 'z') {
      issues.push({ pointer: `${pointer}/discretize`, detail: 'applies to continuous (s-domain) plants only; this plant is already sampled' });
    } else {
      discretizeTime = value['sampleTime'] as number;
      if (plant['sampleTime'] !== undefined && plant['sampleTime'] !== discretizeTime) {
        issues.push({ pointer: `${pointer}/sampleTime`, detail: 'differs from discretize.sampleTime; give the sampling period once' });
      }
    }
  }
  if (domain === 'z' && deadTime > 0 && Number.isFinite(sampleTime)) {
    const samples = deadTime / sampleTime;
    if (Math.abs(samples - Math.round(samples)) > 1e-9 * Math.max(1, samples)) {
      issues.push({ pointer: `${pointer}/deadTime`, detail: 'must be a whole number of sampling periods for a z-domain plant' });
    }
  }
  return { domain: domain as Domain, sampleTime, deadTime, padeOrder, discretizeTime };
}

function readForm(plant: Record<string, unknown>, pointer: string, variable: Domain): { numerator: number[]; denominator: number[] } {
  if ('expression' in plant) {
    if (typeof plant['expression'] !== 'string') throw ValidationError.at(`${pointer}/expression`, 'must be a string');
    return parseExpression(plant['expression'], variable, `${pointer}/expression`);
  }
  if ('numerator' in plant || 'denominator' in plant) {
    const issues: FieldIssue[] = [];
    const numerator = readNumbers(plant['numerator'], `${pointer}/numerator`, issues);
    const denominator = readNumbers(plant['denominator'], `${pointer}/denominator`, issues);
    if (issues.length) throw new ValidationError(issues);
    return { numerator, denominator };
  }
  const issues: FieldIssue[] = [];
  const zeros = readComplexList(plant['zeros'] ?? [], `${pointer}/zeros`, issues);
  const poles = readComplexList(plant['poles'], `${pointer}/poles`, issues);
  const gain = plant['gain'] ?? 1;
  if (typeof gain !== 'number' || !Number.isFinite(gain) || gain === 0) {
    issues.push({ pointer: `${pointer}/gain`, detail: 'must be a finite, non-zero number' });
  }
  if (issues.length) throw new ValidationError(issues);
  if (!hasCompleteConjugatePairs(zeros)) issues.push({ pointer: `${pointer}/zeros`, detail: 'has a complex zero without its conjugate; complex zeros of a real plant come in pairs a ± bj' });
  if (!hasCompleteConjugatePairs(poles)) issues.push({ pointer: `${pointer}/poles`, detail: 'has a complex pole without its conjugate; complex poles of a real plant come in pairs a ± bj' });
  if (poles.length > MAX_DEGREE) issues.push({ pointer: `${pointer}/poles`, detail: `lists ${poles.length} poles; at most ${MAX_DEGREE} are supported` });
  if (issues.length) throw new ValidationError(issues);
  return { numerator: scale(fromRoots(zeros), gain as number), denominator: fromRoots(poles) };
}

function readNumbers(value: unknown, pointer: string, issues: FieldIssue[]): number[] {
  if (!Array.isArray(value) || value.length === 0) {
    issues.push({ pointer, detail: 'must be a non-empty array of coefficients, highest power first' });
    return [];
  }
  if (value.length > MAX_DEGREE + 1 + 64) {
    issues.push({ pointer, detail: `has ${value.length} coefficients; the degree may be at most ${MAX_DEGREE}` });
    return [];
  }
  value.forEach((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) issues.push({ pointer: `${pointer}/${i}`, detail: 'must be a finite number' });
  });
  return value as number[];
}

function readComplexList(value: unknown, pointer: string, issues: FieldIssue[]): Complex[] {
  if (!Array.isArray(value)) {
    issues.push({ pointer, detail: 'must be an array of complex numbers { "re": …, "im": … }' });
    return [];
  }
  if (value.length > MAX_DEGREE + 64) {
    issues.push({ pointer, detail: `lists ${value.length} values; at most ${MAX_DEGREE} are supported` });
    return [];
  }
  const out: Complex[] = [];
  value.forEach((v, i) => {
    if (!isObject(v) || typeof v['re'] !== 'number' || !Number.isFinite(v['re']) || (v['im'] !== undefined && (typeof v['im'] !== 'number' || !Number.isFinite(v['im'])))) {
      issues.push({ pointer: `${pointer}/${i}`, detail: 'must be { "re": number, "im": number } with finite numbers' });
      return;
    }
    out.push({ re: v['re'] as number, im: (v['im'] as number | undefined) ?? 0 });
  });
  return out;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function isPositive(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value) && value > 0;
}
