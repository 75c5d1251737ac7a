import { CAUTION } from '../caution';
import type { Complex } from '../complex/complex';
import { ValidationError } from '../errors';
import { normalizePlant } from '../plant/normalize';
import { roots } from '../polynomial/roots';
import type { Warning } from '../types/plant';
import type { LocusPoint, LocusRequest, LocusResult } from '../types/results';
import { departureAndArrivalAngles } from './angles';
import { asymptotes } from './asymptotes';
import { breakPoints } from './break-points';
import { automaticEndGain } from './gain-span';
import { conditioningWarnings } from './conditioning';
import { missedCrossings } from './missed-crossings';
import { gainScaleOf, regionOf } from './region';
import { boundaryCrossings, illPosedGain, positiveStableRanges, stableRanges } from './stable-ranges';
import { trace, type Trace } from './track';

/**
 * Root locus of 1 + K·N/D = 0: the branches traced over the gain span with every feature an engineer
 * reads off a locus and the exact stable gain ranges. Throws `ValidationError` for a bad request.
 * Example: locus({ plant: { expression: "1/(s*(s+2))" } }) has a break point at −1 with K = 1 and is
 * stable for every K > 0.
 */
export function locus(request: LocusRequest): LocusResult {
  const options = readOptions(request);
  const plant = normalizePlant(request.plant);
  const { numerator, denominator, domain } = plant;
  const warnings: Warning[] = [...plant.warnings];
  const poles = roots(denominator);
  const zeros = roots(numerator);
  const rawBreaks = breakPoints(numerator, denominator, zeros);
  const allCrossings = boundaryCrossings(numerator, denominator, domain);
  const asymptote = asymptotes(numerator, denominator);

  // the region frames what will be drawn: break points and crossings at negative gain only when traced
  const drawn = (gain: number): boolean => gain >= 0 || options.includeNegative || (options.min !== undefined && options.min < 0);
  const featurePoints: Complex[] = [...poles, ...zeros, ...rawBreaks.filter((b) => drawn(b.gain)).map((b) => b.point), ...allCrossings.filter((c) => drawn(c.gain)).map((c) => c.point)];
  if (asymptote) featurePoints.push({ re: asymptote.centroid, im: 0 });
  const region = regionOf(featurePoints, domain);
  const gainScale = gainScaleOf(numerator, denominator, region, poles);
  const negligible = 1e-12 * gainScale;
  let crossings = allCrossings.filter((c) => Math.abs(c.gain) > negligible);
  // a break point at (numerically) zero gain is a multiple open-loop pole: its gain is exactly 0
  const breaks = rawBreaks.map((b) => (Math.abs(b.gain) <= negligible ? { point: b.point, gain: 0 } : b));
  const featureGains = [...breaks.map((b) => b.gain), ...crossings.map((c) => c.gain)].filter((g) => g !== 0);

  const singular = illPosedGain(numerator, denominator);
  const endFor = (sign: 1 | -1, given: number | undefined): number => {
    const largestFeature = Math.max(0, ...featureGains.filter((g) => g * sign > 0).map((g) => Math.abs(g)));
    let end = given ?? automaticEndGain(numerator, denominator, zeros, region, gainScale, 1.5 * largestFeature, sign);
    if (singular !== null && singular * sign > 0 && Math.abs(end) >= Math.abs(singular)) {
      end = singular * (1 - 1e-3);
      warnings.push({
        code: 'ill-posed-gain',
        message: `At K = ${singular.toPrecision(6)} the loop is not well posed (1 + K·G(∞) = 0): a closed-loop pole passes through infinity. The traced span stops just short of it.`,
      });
    }
    return end;
  };
  // gains far beyond any physical meaning only make D + K·N overflow; refuse them with the reason
  const limit = 1e15 * gainScale;
  if (options.max !== undefined && options.max > limit) throw ValidationError.at('/gainRange/max', `is beyond 1e15 times this loop's gain scale (${gainScale.toPrecision(3)}); no closed-loop pole moves noticeably past ${limit.toPrecision(3)}`);
  if (options.min !== undefined && options.min < -limit) throw ValidationError.at('/gainRange/min', `is beyond −1e15 times this loop's gain scale (${gainScale.toPrecision(3)})`);
  const maxGain = endFor(1, options.max !== undefined && options.max > 0 ? options.max : undefined);
  const traceNegative = options.includeNegative || (options.min !== undefined && options.min < 0);
  const minGain = traceNegative ? endFor(-1, options.min !== undefined && options.min < 0 ? options.min : undefined) : Math.max(0, options.min ?? 0);

  const traceOptions = { scale: region.scale, center: region.center, gainScale };
  const positive = trace(numerator, denominator, poles, maxGain, [...featureGains.filter((g) => g > 0), ...(minGain > 0 ? [minGain] : [])], traceOptions);
  const negative = traceNegative ? trace(numerator, denominator, poles, minGain, featureGains.filter((g) => g < 0), traceOptions) : null;
  warnings.push(...conditioningWarnings(denominator, poles, region.scale), ...conditioningWarnings(numerator, zeros, region.scale, 'zero'));
  if (positive.isCoarse || negative?.isCoarse) {
    warnings.push({ code: 'coarse-tracking', message: 'The poles move too erratically to follow step by step within the work budget (a badly conditioned loop); part of the path was covered by independent solves at coarse gain steps, so branch identity there is by nearest distance.' });
  }
  if (positive.fallbacks + (negative?.fallbacks ?? 0) > 0) {
    warnings.push({ code: 'tracking-fallback', message: `The tracker fell back to a cold solve at ${positive.fallbacks + (negative?.fallbacks ?? 0)} gain step(s) (clustered roots); branch identity there is by nearest distance.` });
  }

  const missed = [positive, ...(negative ? [negative] : [])].flatMap((path) => missedCrossings(numerator, denominator, domain, path, crossings));
  if (missed.length > 0) {
    crossings = [...crossings, ...missed].sort((a, b) => a.gain - b.gain);
    warnings.push({
      code: 'crossing-found-by-tracking',
      message: `${missed.length / 2} stability-boundary crossing(s) were found by following the poles rather than by the algebraic search (a very high-order or badly scaled loop); their gains are polished but deserve a second look.`,
    });
  }

  const low = Math.min(minGain, 0);
  const inSpan = (g: number): boolean => g >= low - negligible && g <= maxGain + negligible;
  const stable = positiveStableRanges(numerator, denominator, domain, crossings, warnings);
  const negativeStable = traceNegative ? stableRanges(numerator, denominator, domain, crossings, -1, warnings) : undefined;
  const angles = departureAndArrivalAngles(numerator, denominator, poles, zeros);

  return {
    domain,
    sampleTime: plant.sampleTime,
    normalizedPlant: { numerator: [...numerator], denominator: [...denominator] },
    gainSpan: { min: minGain, max: maxGain },
    branches: buildBranches(positive, negative, minGain),
    openLoop: { poles, zeros },
    asymptotes: asymptote,
    breakPoints: breaks.filter((b) => inSpan(b.gain)),
    crossings: crossings.filter((c) => inSpan(c.gain)).map((c) => ({ point: c.point, gain: c.gain })),
    departureAngles: angles.departureAngles,
    arrivalAngles: angles.arrivalAngles,
    stableGainRanges: stable,
    ...(negativeStable ? { negativeStableGainRanges: negativeStable.map((r) => ({ ...r, to: r.to as number })) } : {}),
    warnings,
    caution: CAUTION,
  };
}

function buildBranches(positive: Trace, negative: Trace | null, minGain: number): { points: LocusPoint[] }[] {
  const count = positive.re[0]?.length ?? 0;
  const branches: { points: LocusPoint[] }[] = [];
  const firstPositive = minGain > 0 ? positive.gains.findIndex((g) => g >= minGain) : 0;
  for (let i = 0; i < count; i++) {
    const points: LocusPoint[] = [];
    if (negative) {
      for (let k = negative.gains.length - 1; k >= 1; k--) points.push({ gain: negative.gains[k], re: negative.re[k][i], im: negative.im[k][i] });
    }
    for (let k = Math.max(0, firstPositive); k < positive.gains.length; k++) points.push({ gain: positive.gains[k], re: positive.re[k][i], im: positive.im[k][i] });
    branches.push({ points });
  }
  return branches;
}

function readOptions(request: LocusRequest): { min?: number; max?: number; includeNegative: boolean } {
  if (typeof request !== 'object' || request === null || Array.isArray(request)) throw ValidationError.at('', 'the request must be an object with a "plant"');
  if (!('plant' in request)) throw ValidationError.at('/plant', 'is required');
  const range = request.gainRange;
  let min: number | undefined;
  let max: number | undefined;
  if (range !== undefined) {
    if (typeof range !== 'object' || range === null || Array.isArray(range)) throw ValidationError.at('/gainRange', 'must be an object { "min": number, "max": number }');
    if (range.min !== undefined && (typeof range.min !== 'number' || !Number.isFinite(range.min))) throw ValidationError.at('/gainRange/min', 'must be a finite number');
    if (range.max !== undefined && (typeof range.max !== 'number' || !Number.isFinite(range.max) || range.max <= 0)) throw ValidationError.at('/gainRange/max', 'must be a positive finite number');
    min = range.min;
    max = range.max;
    if (min !== undefined && max !== undefined && min >= max) throw ValidationError.at('/gainRange/min', 'must be below gainRange.max');
  }
  const includeNegative = request.includeNegativeGains ?? false;
  if (typeof includeNegative !== 'boolean') throw ValidationError.at('/includeNegativeGains', 'must be true or false');
  return { min, max, includeNegative };
}
