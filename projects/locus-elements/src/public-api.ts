/*
 * Public API of @polewright/elements: the pw- plot components as standalone Angular components
 * (signal inputs, OnPush, Shadow DOM). The element bundle (projects/elements-bundle) registers each of
 * them as a custom element; Angular apps import them directly.
 */
export { LocusPlot } from './lib/locus-plot/locus-plot';
export { GainControl } from './lib/gain-control/gain-control';
export { StepPlot } from './lib/step-plot/step-plot';
export { PoleTable } from './lib/pole-table/pole-table';
export { StabilitySummary } from './lib/stability-summary/stability-summary';
export { LoopStudio } from './lib/loop-studio/loop-studio';
export { LoopElement, type ElementTheme } from './lib/loop/loop-element';
// the shared loop store (one state per `loop` key) and the host-page events
export { type LoopModel, type Compensator, parseModelInput, readModel, loopPlant, plantNotes } from './lib/loop/loop-model';
export { LoopState, type LoopStatus, type GainChange, type LoadOutcome, DEFAULT_GAIN, STEP_POINTS } from './lib/loop/loop-state';
export { LoopRegistry, LOOP_RETRY_POLICY } from './lib/loop/loop-registry';
export { bindLoop, type LoopBinding, type LoopInputs } from './lib/loop/loop-binding';
export { type ApiModelRequest, type RetryPolicy, DEFAULT_RETRY, modelUrl } from './lib/loop/model-loader';
export { describeError } from './lib/loop/loop-message';
export { dispatchHostEvent, type HostEvents, type GainChangeDetail, type PolePickDetail, type ModelEditDetail, type LoadErrorDetail } from './lib/loop/host-events';
