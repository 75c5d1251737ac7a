/*
 * Public API of @polewright/locus-core: the pole-path engine shared by the elements, the console and
 * the server. Framework-free; coefficient lists are highest power first throughout.
 */
export { locus } from './locus/locus';
export { closedLoop } from './response/closed-loop';
export { designGains } from './design/design-gains';
export { normalizePlant, MAX_DEGREE, MAX_PADE_ORDER, DEFAULT_PADE_ORDER } from './plant/normalize';
export { ValidationError, type FieldIssue } from './errors';
export { loopPlant, plantNotes, readCompensator, MAX_COMPENSATOR_ROOTS, type Compensator, type LoopParts } from './plant/compensator';
export { CAUTION } from './caution';
export type { Complex } from './complex/complex';
export type { Plant, CoefficientPlant, FactoredPlant, ExpressionPlant, PlantCommon, Domain, NormalizedPlant, Warning } from './types/plant';
export type {
  GainRange,
  NegativeGainRange,
  LocusPoint,
  GainPoint,
  LocusRequest,
  LocusResult,
  ClosedLoopRequest,
  ClosedLoopResult,
  ClosedLoopPole,
  StepResponse,
  DesignTargets,
  DesignRequest,
  DesignResult,
} from './types/results';
// building blocks, for the elements and for tests that check them against outside references
export { roots, refineRoots } from './polynomial/roots';
export { evaluate, evaluateComplex, scaledResidual } from './polynomial/evaluate';
export { fromRoots } from './polynomial/from-roots';
export { multiply } from './polynomial/polynomial';
export { routh } from './stability/routh';
export { jury } from './stability/jury';
export { bilinear, bilinearStability } from './stability/bilinear';
export { stabilityOf, type StabilityTest } from './stability/is-stable';
export { pade } from './plant/pade';
export { zeroOrderHoldEquivalent } from './plant/discretize';
export { trace, type Trace, type TraceOptions } from './locus/track';
export { characteristic } from './locus/stable-ranges';
export { regionOf, gainScaleOf, type Region } from './locus/region';
export { poleFigures } from './response/pole-figures';
