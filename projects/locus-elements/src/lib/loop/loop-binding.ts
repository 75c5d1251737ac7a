import { computed, effect, ElementRef, inject, untracked, type Signal } from '@angular/core';
import type { DesignTargets } from '@polewright/locus-core';
import { dispatchHostEvent } from './host-events';
import { describeError } from './loop-message';
import { readModel } from './loop-model';
import { LoopRegistry } from './loop-registry';
import type { LoopState } from './loop-state';

/** The inputs every element shares, as the element's signal inputs. */
export interface LoopInputs {
  /** `loop`: the shared key; blank or absent gives the element a private loop. */
  readonly loop: Signal<string | null | undefined>;
  /** `model`: JSON text or an expression (attribute), or an object (property). Wins over `model-id`. */
  readonly model?: Signal<unknown>;
  readonly modelId?: Signal<string | null | undefined>;
  /** `api-base`, default `/api`. */
  readonly apiBase?: Signal<string | null | undefined>;
  readonly token?: Signal<string | null | undefined>;
  /** `gain`: NaN or absent leaves the loop's gain alone. */
  readonly gain?: Signal<number | null | undefined>;
  /** `targets`: DesignTargets as JSON text or an object. */
  readonly targets?: Signal<unknown>;
}

/** What an element gets from `bindLoop`. */
export interface LoopBinding {
  /** The loop this element shows (changes when its `loop` input does). */
  readonly state: Signal<LoopState>;
  readonly loopKey: Signal<string | null>;
  /** This element's id as a gain source. */
  readonly sourceId: string;
  /** Why the `targets` input was refused, else null. */
  readonly targetsError: Signal<string | null>;
  /** Sets the loop's gain from a user action in this element and sends `pw-gain-change`. */
  setGainByUser(gain: number): boolean;
}

let nextSource = 1;

/**
 * Binds an element's inputs to its LoopState, so that every element reads and applies them alike:
 * `model` (parsed; a bad one puts the loop in error with the reason and sends `pw-load-error`), or
 * `model-id` + `api-base` + `token` (loaded from the API), `gain` and `targets`. Call in the constructor.
 */
export function bindLoop(inputs: LoopInputs): LoopBinding {
  const registry = inject(LoopRegistry);
  const host = inject(ElementRef).nativeElement as HTMLElement;
  const sourceId = `pw-element-${nextSource++}`;
  let privateState: LoopState | null = null;

  const loopKey = computed(() => inputs.loop()?.trim() || null);
  const state = computed(() => {
    const key = loopKey();
    if (key) return registry.loop(key);
    return (privateState ??= registry.loop(null));
  });
  const loadError = (message: string): void => dispatchHostEvent(host, 'pw-load-error', { message });

  effect(() => {
    const s = state();
    const raw = inputs.model?.();
    if (raw === undefined || raw === null || raw === '') return;
    untracked(() => {
      try {
        s.setModel(readModel(raw));
      } catch (error) {
        const message = describeError(error);
        s.reportError(message);
        loadError(message);
      }
    });
  });

  effect(() => {
    const s = state();
    const raw = inputs.model?.();
    const modelId = inputs.modelId?.()?.trim();
    if (!modelId || (raw !== undefined && raw !== null && raw !== '')) return;
    const apiBase = inputs.apiBase?.()?.trim() || '/api';
    const token = inputs.token?.()?.trim() ?? '';
    const keepGain = Number.isFinite(inputs.gain?.() ?? NaN);
    untracked(() => {
      if (!token) {
        const message = `model-id ${modelId} is set but token is missing: give the embed token issued for this page.`;
        s.reportError(message);
        loadError(message);
        return;
      }
      void s.loadFromApi({ apiBase, modelId, token }, { keepGain }).then((outcome) => {
        if (!outcome.ok && !outcome.superseded) loadError(outcome.message);
      });
    });
  });

  effect(() => {
    const s = state();
    const gain = inputs.gain?.();
    if (typeof gain === 'number' && Number.isFinite(gain)) untracked(() => s.setGain(gain, sourceId));
  });

  const targetsRead = computed<{ targets: DesignTargets | null; error: string | null }>(() => readTargets(inputs.targets?.()));
  effect(() => {
    const s = state();
    const read = targetsRead();
    if (inputs.targets?.() === undefined) return;
    untracked(() => s.setTargets(read.targets));
  });

  // Host pages get a method as well as the `gain` property: a property set to the value it already holds is
  // ignored (input semantics), so a dashboard putting the gain back after the user moved it calls setGain(k).
  // Like a property change it sends no pw-gain-change (that event is for the user's moves).
  Object.assign(host, { setGain: (gain: number): boolean => state().setGain(gain, null) });

  return {
    state,
    loopKey,
    sourceId,
    targetsError: computed(() => targetsRead().error),
    setGainByUser(gain: number): boolean {
      const applied = state().setGain(gain, sourceId);
      if (applied) dispatchHostEvent(host, 'pw-gain-change', { gain, loop: loopKey() });
      return applied;
    },
  };
}

function readTargets(value: unknown): { targets: DesignTargets | null; error: string | null } {
  if (value === undefined || value === null || value === '') return { targets: null, error: null };
  let parsed = value;
  if (typeof value === 'string') {
    try {
      parsed = JSON.parse(value);
    } catch (error) {
      return { targets: null, error: `targets is not valid JSON (${(error as Error).message}).` };
    }
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
    return { targets: null, error: 'targets must be an object such as {"minDampingRatio": 0.5, "maxSettlingTime": 4}.' };
  }
  return { targets: parsed as DesignTargets, error: null };
}
