import type { Complex, Plant } from '@polewright/locus-core';
import type { Compensator } from './loop-model';

/** `pw-gain-change`: the user moved the gain in this element. */
export interface GainChangeDetail {
  readonly gain: number;
  /** The element's `loop` key, or null for a private loop. */
  readonly loop: string | null;
}

/** `pw-pole-pick`: the user picked a closed-loop pole on a branch. */
export interface PolePickDetail {
  readonly pole: Complex;
  readonly gain: number;
  readonly branch: number;
}

/** `pw-model-edit`: the user edited the compensator; the edited model. */
export interface ModelEditDetail {
  readonly plant: Plant;
  readonly compensator: Compensator | null;
}

/** `pw-load-error`: the element's model could not be read or loaded. */
export interface LoadErrorDetail {
  readonly message: string;
}

/** The events the elements send to the host page, by name. */
export interface HostEvents {
  'pw-gain-change': GainChangeDetail;
  'pw-pole-pick': PolePickDetail;
  'pw-model-edit': ModelEditDetail;
  'pw-load-error': LoadErrorDetail;
}

/**
 * Sends a host-page event from an element: a `CustomEvent` with the payload in `detail` that bubbles and
 * crosses shadow roots (`composed`), so that a listener on `document` hears every element.
 */
export function dispatchHostEvent<K extends keyof HostEvents>(host: EventTarget, name: K, detail: HostEvents[K]): void {
  host.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
}
