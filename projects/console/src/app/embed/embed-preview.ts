import { ChangeDetectionStrategy, Component, DestroyRef, effect, type ElementRef, inject, input, output, signal, untracked, viewChild } from '@angular/core';
import { DomSanitizer, type SafeResourceUrl } from '@angular/platform-browser';

/** `pw-gain-change` as the host page receives it. */
export interface PreviewGain {
  readonly gain: number;
  readonly loop: string | null;
}

/** Smallest height of the frame before its page has been measured (px). */
const MIN_HEIGHT = 240;

/**
 * Runs an HTML document in an `<iframe>` whose address is a Blob URL made from it (revoked when the
 * document is replaced and when the preview goes away). A Blob URL document has the origin of the page that
 * made it, so the elements inside load their model from this console's origin, with the real token, as a
 * host page would. The frame grows with its page; element events reach the host as outputs.
 */
@Component({
  selector: 'pwc-embed-preview',
  template: `@if (url(); as src) {
    <iframe #frame [src]="src" [title]="label()" [style.height.px]="height()" (load)="watch()"></iframe>
  }`,
  styles: `
    :host {
      display: block;
    }
    iframe {
      display: block;
      width: 100%;
      border: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmbedPreview {
  private readonly sanitizer = inject(DomSanitizer);
  /** The whole document to run. */
  readonly html = input.required<string>();
  /** Accessible name of the frame. */
  readonly label = input('Preview');
  /** A `pw-gain-change` of the page in the frame. */
  readonly gainChange = output<PreviewGain>();
  /** A `pw-load-error` of the page in the frame (the element shows the same message). */
  readonly loadError = output<string>();

  private readonly frame = viewChild<ElementRef<HTMLIFrameElement>>('frame');
  protected readonly url = signal<SafeResourceUrl | null>(null);
  protected readonly height = signal(MIN_HEIGHT);
  private objectUrl: string | null = null;
  private observer: ResizeObserver | null = null;

  constructor() {
    effect(() => {
      const html = this.html();
      untracked(() => this.load(html));
    });
    inject(DestroyRef).onDestroy(() => {
      this.observer?.disconnect();
      this.revoke();
    });
  }

  /** Follows the page in the frame once it loaded: its height and the elements' events. */
  protected watch(): void {
    const frame = this.frame()?.nativeElement;
    const view = frame?.contentWindow as (Window & typeof globalThis) | null | undefined;
    const page = frame?.contentDocument;
    if (!view || !page?.body) return;
    this.observer?.disconnect();
    // the frame's own ResizeObserver watches its own document (same origin: a Blob URL of this page)
    if (typeof view.ResizeObserver === 'function') {
      // the body's own height with its margins: the document's scroll height never drops below the frame's
      const fit = (): void => {
        const style = view.getComputedStyle(page.body);
        const height = page.body.getBoundingClientRect().height + parseFloat(style.marginTop) + parseFloat(style.marginBottom);
        this.height.set(Math.max(MIN_HEIGHT, Math.ceil(height)));
      };
      this.observer = new view.ResizeObserver(fit);
      this.observer.observe(page.body);
    }
    page.addEventListener('pw-gain-change', (event) => {
      const detail = (event as CustomEvent<{ gain?: unknown; loop?: unknown }>).detail ?? {};
      if (typeof detail.gain === 'number') this.gainChange.emit({ gain: detail.gain, loop: typeof detail.loop === 'string' ? detail.loop : null });
    });
    page.addEventListener('pw-load-error', (event) => {
      const message = (event as CustomEvent<{ message?: unknown }>).detail?.message;
      if (typeof message === 'string') this.loadError.emit(message);
    });
    // a refusal can come back before the frame's load event (the stylesheet and fonts load longer than the
    // API answers): the element then shows it already, and its event has passed
    const shown = shownError(page);
    if (shown) this.loadError.emit(shown);
  }

  private load(html: string): void {
    const previous = this.objectUrl;
    this.objectUrl = URL.createObjectURL(new Blob([html], { type: 'text/html' }));
    // a Blob URL made here, from the snippet this screen wrote: trusted as a frame address
    this.url.set(this.sanitizer.bypassSecurityTrustResourceUrl(this.objectUrl));
    if (previous) URL.revokeObjectURL(previous);
  }

  private revoke(): void {
    if (this.objectUrl) URL.revokeObjectURL(this.objectUrl);
    this.objectUrl = null;
  }
}

/** The first load error an element of the page shows (`.pw-error`, in shadow roots at any depth), if any. */
export function shownError(root: Document | ShadowRoot): string | null {
  for (const element of Array.from(root.querySelectorAll('*'))) {
    const shadow = element.shadowRoot;
    if (!shadow) continue;
    const text = shadow.querySelector('.pw-error')?.textContent?.trim();
    if (text) return text;
    const inner = shownError(shadow);
    if (inner) return inner;
  }
  return null;
}
