import { ARROW_FACTOR, PAGE_FACTOR, plotKeyAction, ZOOM_FACTOR } from './plot-keys';

const span = { floor: 0.01, max: 5e4 };

describe('plot keys', () => {
  it('steps the gain up and down by a fortieth of a decade per arrow press', () => {
    expect(plotKeyAction('ArrowRight', 2, span)).toEqual({ kind: 'gain', gain: 2 * ARROW_FACTOR });
    expect(plotKeyAction('ArrowUp', 2, span)).toEqual({ kind: 'gain', gain: 2 * ARROW_FACTOR });
    expect(plotKeyAction('ArrowLeft', 2, span)).toEqual({ kind: 'gain', gain: 2 / ARROW_FACTOR });
    expect(ARROW_FACTOR ** 40).toBeCloseTo(10, 9);
  });

  it('takes larger steps with PageUp/PageDown or Shift and jumps to the span ends with Home/End', () => {
    expect(plotKeyAction('PageUp', 2, span)).toEqual({ kind: 'gain', gain: 2 * PAGE_FACTOR });
    expect(plotKeyAction('ArrowDown', 2, span, true)).toEqual({ kind: 'gain', gain: 2 / PAGE_FACTOR });
    expect(plotKeyAction('Home', 2, span)).toEqual({ kind: 'gain', gain: 0.01 });
    expect(plotKeyAction('End', 2, span)).toEqual({ kind: 'gain', gain: 5e4 });
  });

  it('leaves a zero gain upwards to the smallest traced gain and not below zero', () => {
    expect(plotKeyAction('ArrowRight', 0, span)).toEqual({ kind: 'gain', gain: 0.01 });
    expect(plotKeyAction('ArrowLeft', 0, span)).toEqual({ kind: 'gain', gain: 0 });
  });

  it('zooms with + and −, fits with 0 and ignores other keys', () => {
    expect(plotKeyAction('+', 1, span)).toEqual({ kind: 'zoom', factor: ZOOM_FACTOR });
    expect(plotKeyAction('-', 1, span)).toEqual({ kind: 'zoom', factor: 1 / ZOOM_FACTOR });
    expect(plotKeyAction('0', 1, span)).toEqual({ kind: 'reset' });
    expect(plotKeyAction('Delete', 1, span)).toEqual({ kind: 'remove' });
    expect(plotKeyAction('a', 1, span)).toBeNull();
  });
});
