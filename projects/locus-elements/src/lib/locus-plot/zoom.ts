import { afterNextRender, DestroyRef, Directive, ElementRef, inject, input, signal } from '@angular/core';
import { select } from 'd3-selection';
import { zoom, zoomIdentity, type ZoomBehavior, type ZoomTransform } from 'd3-zoom';

/** How far the plot zooms in and out from the fitted view. */
export const ZOOM_EXTENT: readonly [number, number] = [0.05, 2000];

/**
 * d3-zoom on the plot's svg (wheel, pinch, drag to pan), attached after the first render. The transform
 * lives in a signal the plot reads; `claims` lets the plot keep a pointer press for itself (dragging the
 * gain along a branch, moving a compensator point), which then does not pan.
 */
@Directive({ selector: 'svg[pwlZoom]', exportAs: 'pwlZoom' })
export class PlotZoom {
  /** The drawing size in px (the zoom extent). */
  readonly size = input.required<{ width: number; height: number }>({ alias: 'pwlZoom' });
  /** Whether a press (mousedown/touchstart) belongs to the plot instead of panning. */
  readonly claims = input<(event: Event) => boolean>(() => false, { alias: 'pwlZoomClaims' });
  /** The current zoom relative to the fitted view. */
  readonly transform = signal<ZoomTransform>(zoomIdentity);

  private readonly svg = inject<ElementRef<SVGSVGElement>>(ElementRef).nativeElement;
  private behavior: ZoomBehavior<SVGSVGElement, unknown> | null = null;

  constructor() {
    afterNextRender(() => {
      this.behavior = zoom<SVGSVGElement, unknown>()
        .scaleExtent(ZOOM_EXTENT as [number, number])
        .extent(() => {
          const { width, height } = this.size();
          return [
            [0, 0],
            [width, height],
          ];
        })
        .filter((event: Event) => {
          if (event.type === 'wheel') return true;
          const button = (event as MouseEvent).button ?? 0;
          return button === 0 && !this.claims()(event);
        })
        .on('zoom', (event: { transform: ZoomTransform }) => this.transform.set(event.transform));
      select(this.svg).call(this.behavior).on('dblclick.zoom', null);
    });
    inject(DestroyRef).onDestroy(() => select(this.svg).on('.zoom', null));
  }

  /** Zooms by `factor` about the centre of the drawing. */
  zoomBy(factor: number): void {
    if (this.behavior) select(this.svg).call(this.behavior.scaleBy, factor);
    else this.transform.update((t) => t.scale(factor));
  }

  /** Back to the fitted view. */
  resetZoom(): void {
    if (this.behavior) select(this.svg).call(this.behavior.transform, zoomIdentity);
    else this.transform.set(zoomIdentity);
  }
}
