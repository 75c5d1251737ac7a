import type { Type } from '@angular/core';
import { GainControl, LocusPlot, LoopStudio, PoleTable, StabilitySummary, StepPlot } from '@polewright/elements';

/**
 * Every custom element of the bundle: tag → component. Adding an element: export the component from the
 * library's public-api.ts, add one line here, document its attributes and events in the README.
 */
export const ELEMENTS: readonly (readonly [string, Type<unknown>])[] = [
  ['pw-locus-plot', LocusPlot],
  ['pw-gain-control', GainControl],
  ['pw-step-plot', StepPlot],
  ['pw-pole-table', PoleTable],
  ['pw-stability-summary', StabilitySummary],
  ['pw-loop-studio', LoopStudio],
];
