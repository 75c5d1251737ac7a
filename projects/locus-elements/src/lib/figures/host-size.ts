import { DestroyRef, effect, inject, signal, type ElementRef, type Signal } from '@angular/core';

/** A drawing size in CSS pixels. */
export interface HostSize {
  readonly width: number;
  readonly height: number;
}

/**
 * The content size of an element of the view (a `viewChild`), measured once it exists and then followed
 * with a ResizeObserver (call in the constructor). Until then, and without ResizeObserver, it is `fallback`.
 */
export function elementSize(target: Signal<ElementRef<Element> | undefined>, fallback: HostSize): Signal<HostSize> {
  const size = signal<HostSize>(fallback);
  let observer: ResizeObserver | null = null;
  const update = (width: number, height: number): void => {
    if (width <= 0 || height <= 0) return;
    const next = { width: Math.round(width), height: Math.round(height) };
    if (next.width !== size().width || next.height !== size().height) size.set(next);
  };
  effect(() => {
    const element = target()?.nativeElement;
    observer?.disconnect();
    observer = null;
    if (!element || typeof ResizeObserver === 'undefined') return;
    const box = element.getBoundingClientRect();
    update(box.width, box.height);
    observer = new ResizeObserver((entries) => {
      const rect = entries[entries.length - 1]?.contentRect;
      if (rect) update(rect.width, rect.height);
    });
    observer.observe(element);
  });
  inject(DestroyRef).onDestroy(() => observer?.disconnect());
  return size.asReadonly();
}
