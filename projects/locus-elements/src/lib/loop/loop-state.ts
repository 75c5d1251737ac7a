import type { HttpClient } from '@angular/common/http';
import { computed, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  closedLoop,
  designGains,
  locus,
  type ClosedLoopResult,
  type DesignResult,
  type DesignTargets,
  type LocusResult,
  type Plant,
} from '@polewright/locus-core';
import { BehaviorSubject, distinctUntilChanged, map, type Observable, type Subscription } from 'rxjs';
import { describeError } from './loop-message';
import { loopPlant, plantNotes, type LoopModel } from './loop-model';
import { DEFAULT_RETRY, fetchModel, loadErrorMessage, type ApiModelRequest, type RetryPolicy } from './model-loader';

/** Where a loop stands: nothing given yet, fetching from the API, computed, or refused with a message. */
export type LoopStatus = 'idle' | 'loading' | 'ready' | 'error';

/** One change of gain and who made it (an element's id, or null for the host page or a default). */
export interface GainChange {
  readonly gain: number;
  readonly source: string | null;
}

/** How a request to the API ended. */
export type LoadOutcome = { readonly ok: true; readonly model: LoopModel } | { readonly ok: false; readonly message: string; readonly superseded?: boolean };

/** The gain a loop starts with: the plant exactly as given. */
export const DEFAULT_GAIN = 1;

/** Samples of the step response: enough for a smooth curve, few enough to follow a dragged gain. */
export const STEP_POINTS = 800;

interface Source {
  readonly status: LoopStatus;
  readonly error: string | null;
}

/**
 * The state of one loop, shared by every element bound to it. RxJS subjects hold the inputs (model, gain,
 * targets, load state); signals read them, and the engine's results are `computed()` here, once per state,
 * so that every element on the loop reads the same result. Nothing here throws: a bad model or a failed
 * load sets `status` to `'error'` and `error` to a readable message.
 */
export class LoopState {
  private readonly model$ = new BehaviorSubject<LoopModel | null>(null);
  private readonly gainChange$ = new BehaviorSubject<GainChange>({ gain: DEFAULT_GAIN, source: null });
  private readonly targets$ = new BehaviorSubject<DesignTargets | null>(null);
  private readonly source$ = new BehaviorSubject<Source>({ status: 'idle', error: null });
  private loading: Subscription | null = null;
  private loadSequence = 0;

  /** Every gain change with its source (replays the current one). */
  readonly gainChanges$: Observable<GainChange> = this.gainChange$.asObservable();
  /** The gain, each distinct value once (replays the current one). */
  readonly gain$: Observable<number> = this.gainChange$.pipe(map((c) => c.gain), distinctUntilChanged());

  readonly model: Signal<LoopModel | null> = toSignal(this.model$, { requireSync: true, manualCleanup: true });
  readonly gainChange: Signal<GainChange> = toSignal(this.gainChange$, { requireSync: true, manualCleanup: true });
  readonly gain: Signal<number> = computed(() => this.gainChange().gain);
  readonly targets: Signal<DesignTargets | null> = toSignal(this.targets$, { requireSync: true, manualCleanup: true });
  private readonly source: Signal<Source> = toSignal(this.source$, { requireSync: true, manualCleanup: true });

  /** The plant the engine sees (compensator × plant), or the reason it cannot be formed. */
  private readonly plantOutcome = computed(() => attempt(() => { const m = this.model(); return m ? loopPlant(m) : null; }));
  readonly plant: Signal<Plant | null> = computed(() => this.plantOutcome().result);
  private readonly locusOutcome = computed(() =>
    attempt(() => {
      const plant = this.plant();
      if (!plant) return null;
      const result = locus({ plant });
      // as the API does: the plant's own notes (e.g. the Padé one) stay with a compensated loop
      const notes = plantNotes(this.model() as LoopModel).filter((n) => !result.warnings.some((w) => w.code === n.code));
      return notes.length ? { ...result, warnings: [...notes, ...result.warnings] } : result;
    }),
  );
  private readonly closedLoopOutcome = computed(() => {
    const plant = this.locus() ? this.plant() : null;
    const gain = this.gain();
    return attempt(() => (plant ? closedLoop({ plant, gain, step: { points: STEP_POINTS } }) : null));
  });
  private readonly designOutcome = computed(() => {
    const targets = this.targets();
    const plant = this.locus() ? this.plant() : null;
    return attempt(() => (plant && targets ? designGains({ plant, targets }) : null));
  });

  /** The root locus of the loop (null until a model is ready, or when it was refused). */
  readonly locus: Signal<LocusResult | null> = computed(() => this.locusOutcome().result);
  /** Closed-loop poles and step response at the current gain. */
  readonly closedLoop: Signal<ClosedLoopResult | null> = computed(() => this.closedLoopOutcome().result);
  /** Why the closed loop could not be formed at this gain (e.g. an ill-posed gain), else null. */
  readonly closedLoopError: Signal<string | null> = computed(() => this.closedLoopOutcome().error);
  /** Gain ranges meeting the targets, when targets are set. */
  readonly design: Signal<DesignResult | null> = computed(() => this.designOutcome().result);
  /** Why the targets could not be applied, else null. */
  readonly designError: Signal<string | null> = computed(() => this.designOutcome().error);

  readonly status: Signal<LoopStatus> = computed(() => {
    const source = this.source();
    if (source.status !== 'ready') return source.status;
    if (this.model() === null) return 'idle';
    return this.plantOutcome().error || this.locusOutcome().error ? 'error' : 'ready';
  });
  readonly error: Signal<string | null> = computed(() => this.source().error ?? this.plantOutcome().error ?? this.locusOutcome().error);

  /**
   * @param key the shared key (`loop` attribute), or null for an element's private state
   * @param http the client used by `loadFromApi` (null: loading from the API is refused with a message)
   */
  constructor(
    readonly key: string | null,
    private readonly http: HttpClient | null = null,
    private readonly retryPolicy: RetryPolicy = DEFAULT_RETRY,
  ) {}

  /** Replaces the model (null clears it); stops any load in flight. */
  setModel(model: LoopModel | null): void {
    this.cancelLoad();
    this.model$.next(model);
    this.source$.next({ status: model ? 'ready' : 'idle', error: null });
  }

  /** Sets the gain; refuses (returns false) anything but a finite number. */
  setGain(gain: number, source: string | null = null): boolean {
    if (typeof gain !== 'number' || !Number.isFinite(gain)) return false;
    if (gain !== this.gainChange$.value.gain) this.gainChange$.next({ gain, source });
    return true;
  }

  /** Sets the design targets (null removes them). */
  setTargets(targets: DesignTargets | null): void {
    this.targets$.next(targets);
  }

  /** Puts the loop in the error state with this message (e.g. a `model` attribute that does not parse). */
  reportError(message: string): void {
    this.cancelLoad();
    this.source$.next({ status: 'error', error: message });
  }

  /**
   * Loads a saved model from the API with an embed token; a newer call supersedes an older one. On success
   * the model replaces the current one, and the saved gain and targets are applied unless `keepGain`.
   */
  loadFromApi(request: ApiModelRequest, options: { keepGain?: boolean } = {}): Promise<LoadOutcome> {
    this.cancelLoad();
    const sequence = ++this.loadSequence;
    if (!this.http) return Promise.resolve(this.fail('Loading from the API is not available here (no HttpClient).'));
    this.source$.next({ status: 'loading', error: null });
    return new Promise<LoadOutcome>((resolve) => {
      const settle = (outcome: LoadOutcome): void => {
        this.loading = null;
        resolve(outcome);
      };
      this.loading = fetchModel(this.http as HttpClient, request, this.retryPolicy).subscribe({
        next: (loaded) => {
          if (sequence !== this.loadSequence) return;
          this.model$.next(loaded.model);
          if (!options.keepGain && loaded.gain !== null) this.setGain(loaded.gain);
          if (loaded.targets !== null) this.targets$.next(loaded.targets);
          this.source$.next({ status: 'ready', error: null });
          settle({ ok: true, model: loaded.model });
        },
        error: (error: unknown) => settle(sequence === this.loadSequence ? this.fail(loadErrorMessage(error, request, this.retryPolicy)) : { ok: false, message: 'superseded', superseded: true }),
      });
      // a load cancelled by a newer one or by setModel resolves as superseded
      this.loading?.add(() => sequence !== this.loadSequence && resolve({ ok: false, message: 'superseded', superseded: true }));
    });
  }

  private fail(message: string): LoadOutcome {
    this.source$.next({ status: 'error', error: message });
    return { ok: false, message };
  }

  private cancelLoad(): void {
    this.loadSequence++;
    this.loading?.unsubscribe();
    this.loading = null;
  }
}

function attempt<T>(compute: () => T): { result: T | null; error: string | null } {
  try {
    return { result: compute(), error: null };
  } catch (error) {
    return { result: null, error: describeError(error) };
  }
}
