import { HttpClient } from '@angular/common/http';
import { inject, Injectable, InjectionToken, untracked } from '@angular/core';
import { LoopState } from './loop-state';
import { DEFAULT_RETRY, type RetryPolicy } from './model-loader';

/** How loops of this injector repeat failed API requests (tests shorten the waits). */
export const LOOP_RETRY_POLICY = new InjectionToken<RetryPolicy>('LOOP_RETRY_POLICY', { providedIn: 'root', factory: () => DEFAULT_RETRY });

/**
 * The loops of one page (one application injector), keyed by the elements' `loop` attribute. Elements
 * with the same key get the same `LoopState`; a null or blank key gets a fresh private state each call.
 */
@Injectable({ providedIn: 'root' })
export class LoopRegistry {
  private readonly http = inject(HttpClient, { optional: true });
  private readonly retryPolicy = inject(LOOP_RETRY_POLICY);
  private readonly loops = new Map<string, LoopState>();

  /** The state shared under `key`, created on first use; a private one for a null or blank key. */
  loop(key: string | null | undefined): LoopState {
    const name = key?.trim() ?? '';
    // states are made outside any reactive context: their signals come from toSignal()
    if (name === '') return untracked(() => new LoopState(null, this.http, this.retryPolicy));
    let state = this.loops.get(name);
    if (!state) {
      state = untracked(() => new LoopState(name, this.http, this.retryPolicy));
      this.loops.set(name, state);
    }
    return state;
  }

  /** The keys of the shared loops created so far. */
  keys(): string[] {
    return [...this.loops.keys()];
  }
}
