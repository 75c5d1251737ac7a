/** What a key pressed on the focused plot asks for. */
export type PlotKeyAction =
  | { readonly kind: 'gain'; readonly gain: number }
  | { readonly kind: 'zoom'; readonly factor: number }
  | { readonly kind: 'reset' }
  | { readonly kind: 'remove' }
  | { readonly kind: 'cancel' };

/** Gain factor of one arrow press: 40 presses a decade. */
export const ARROW_FACTOR = 10 ** (1 / 40);
/** Gain factor of one PageUp/PageDown press: 4 presses a decade. */
export const PAGE_FACTOR = 10 ** (1 / 4);
/** Zoom factor of one +/− press. */
export const ZOOM_FACTOR = 1.4;

/**
 * The action of a key on the focused plot, or null for keys the plot leaves alone. Arrows move the gain
 * logarithmically (→/↑ up, ←/↓ down; with Shift a page step), PageUp/PageDown by larger steps, + and −
 * zoom, 0 resets to fit, Delete/Backspace removes the selected compensator point, Escape cancels.
 * From K ≤ 0 the first step up goes to `floor` (the smallest non-zero traced gain): a logarithmic step
 * cannot leave zero. Home and End go to the ends of the traced span.
 * Example: plotKeyAction('PageUp', 1, {floor: 0.01, max: 1e4}) = { kind: 'gain', gain: 1.778… }.
 */
export function plotKeyAction(key: string, gain: number, span: { floor: number; max: number }, shift = false): PlotKeyAction | null {
  const step = (factor: number, up: boolean): PlotKeyAction => {
    if (!(gain > 0)) return { kind: 'gain', gain: up ? span.floor : gain };
    return { kind: 'gain', gain: up ? gain * factor : gain / factor };
  };
  switch (key) {
    case 'ArrowRight':
    case 'ArrowUp':
      return step(shift ? PAGE_FACTOR : ARROW_FACTOR, true);
    case 'ArrowLeft':
    case 'ArrowDown':
      return step(shift ? PAGE_FACTOR : ARROW_FACTOR, false);
    case 'PageUp':
      return step(PAGE_FACTOR, true);
    case 'PageDown':
      return step(PAGE_FACTOR, false);
    case 'Home':
      return { kind: 'gain', gain: span.floor };
    case 'End':
      return { kind: 'gain', gain: span.max };
    case '+':
    case '=':
      return { kind: 'zoom', factor: ZOOM_FACTOR };
    case '-':
    case '_':
      return { kind: 'zoom', factor: 1 / ZOOM_FACTOR };
    case '0':
      return { kind: 'reset' };
    case 'Delete':
    case 'Backspace':
      return { kind: 'remove' };
    case 'Escape':
      return { kind: 'cancel' };
    default:
      return null;
  }
}
