import { computed, Directive, input, numberAttribute } from '@angular/core';
import { bindLoop } from './loop-binding';

/** The theme an element draws with (`theme` attribute); the CSS custom properties do the rest. */
export type ElementTheme = 'light' | 'dark';

/**
 * The inputs every pw- element shares (`model`, `model-id`, `api-base`, `token`, `loop`, `gain`,
 * `targets`, `theme`) bound to the element's loop through `bindLoop`, so that all elements read them alike.
 * Extend it in a component; the custom-element attributes are the dash-case of these names.
 */
@Directive({ host: { '[attr.theme]': 'theme() ?? null' } })
export abstract class LoopElement {
  /** The model inline: JSON plant or `{plant, compensator}`, or an expression string (an object as a property). */
  readonly model = input<unknown>();
  /** Id of a saved model to load from the API (with `api-base` and `token`). */
  readonly modelId = input<string>();
  /** Base URL of the API, default `/api`. */
  readonly apiBase = input<string>();
  /** Embed token for `model-id`. */
  readonly token = input<string>();
  /** Shared loop key: elements with the same key share model and gain. */
  readonly loop = input<string>();
  /** Loop gain K to show (applied to the loop whenever it changes). */
  readonly gain = input(Number.NaN, { transform: numberAttribute });
  /** Design targets as JSON DesignTargets. */
  readonly targets = input<unknown>();
  /** `light` (default) or `dark`. */
  readonly theme = input<ElementTheme>();

  /** The element's link to its loop. */
  protected readonly binding = bindLoop({
    // read through the method, so a subclass can supply its own key (computed runs after construction)
    loop: computed(() => this.loopKey()),
    model: this.model,
    modelId: this.modelId,
    apiBase: this.apiBase,
    token: this.token,
    gain: this.gain,
    targets: this.targets,
  });
  /** The loop this element shows. */
  protected readonly state = this.binding.state;

  /** The key of the loop to bind to: the `loop` input (a subclass may give a key of its own). */
  protected loopKey(): string | null | undefined {
    return this.loop();
  }
}
