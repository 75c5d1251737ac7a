/** Presentation properties copied inline, so that an exported SVG looks the same outside the page. */
const STYLE_PROPERTIES = [
  'fill',
  'fill-opacity',
  'fill-rule',
  'stroke',
  'stroke-width',
  'stroke-opacity',
  'stroke-dasharray',
  'stroke-linecap',
  'stroke-linejoin',
  'opacity',
  'font-family',
  'font-size',
  'font-weight',
  'text-anchor',
  'dominant-baseline',
  'paint-order',
] as const;

const SVG_NS = 'http://www.w3.org/2000/svg';

/**
 * The plot as a standalone SVG document: a copy of the drawing with every element's computed
 * presentation styles written inline (the live drawing takes them from the Shadow DOM stylesheet and the
 * theme tokens), interaction-only parts (`data-export="skip"`) left out, and a background of `background`.
 */
export function serializeSvg(svg: SVGSVGElement, background: string): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  inlineStyles(svg, copy);
  copy.querySelectorAll('[data-export="skip"]').forEach((node) => node.remove());
  removeComments(copy);
  for (const name of ['class', 'tabindex', 'aria-hidden']) copy.removeAttribute(name);
  const width = svg.getAttribute('width') ?? '640';
  const height = svg.getAttribute('height') ?? '400';
  const rect = copy.ownerDocument.createElementNS(SVG_NS, 'rect');
  rect.setAttribute('width', width);
  rect.setAttribute('height', height);
  rect.setAttribute('fill', background || '#ffffff');
  copy.insertBefore(rect, copy.firstChild);
  const text = new XMLSerializer().serializeToString(copy);
  // serializers add the namespace of an svg element themselves; make sure it is there exactly once
  return /^<svg[^>]*\sxmlns="/.test(text) ? text : text.replace(/^<svg/, `<svg xmlns="${SVG_NS}"`);
}

// Angular leaves comment anchors (<!--container-->) in the drawing; a file does not need them
function removeComments(node: Node): void {
  for (const child of [...node.childNodes]) {
    if (child.nodeType === 8) child.remove();
    else removeComments(child);
  }
}

/** Draws an SVG document onto a canvas at `scale` times its size and encodes it as PNG. */
export async function svgToPng(svgText: string, width: number, height: number, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.width = width;
    image.height = height;
    image.src = url;
    await image.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw the plot onto a canvas, so no PNG can be made.');
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('The browser could not encode the PNG.'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Offers a blob as a file download (through a temporary blob URL). */
export function downloadBlob(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  link.style.display = 'none';
  document.body.appendChild(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

// walks the live drawing and its copy in step (same structure) and writes the computed styles inline
function inlineStyles(source: Element, target: Element): void {
  const view = source.ownerDocument.defaultView;
  if (view && source instanceof view.SVGElement) {
    const computed = view.getComputedStyle(source);
    const inline: string[] = [];
    for (const property of STYLE_PROPERTIES) {
      const value = computed.getPropertyValue(property);
      if (value && !value.startsWith('var(')) inline.push(`${property}:${value}`);
    }
    if (inline.length) target.setAttribute('style', inline.join(';'));
  }
  const sources = source.children;
  const targets = target.children;
  for (let i = 0; i < sources.length && i < targets.length; i++) inlineStyles(sources[i], targets[i]);
}

/** What the exporter needs from its plot. */
export interface ExportPlot {
  /** The live drawing, once rendered. */
  svg(): SVGSVGElement | null;
  /** The element whose `--pw-bg` is the background. */
  readonly host: HTMLElement;
}

/** The plot's export: SVG text, PNG blob, and the downloads behind its buttons. */
export class PlotExport {
  constructor(private readonly plot: ExportPlot) {}

  /** The plot as a standalone SVG document; empty before the first render. */
  svg(): string {
    const svg = this.plot.svg();
    if (!svg) return '';
    const view = this.plot.host.ownerDocument.defaultView;
    const background = view?.getComputedStyle(this.plot.host).getPropertyValue('--pw-bg').trim() ?? '';
    return serializeSvg(svg, background);
  }

  /** The plot as PNG at twice its size. */
  png(): Promise<Blob> {
    const svg = this.plot.svg();
    if (!svg) return Promise.reject(new Error('The plot has not been drawn yet.'));
    return svgToPng(this.svg(), Number(svg.getAttribute('width')), Number(svg.getAttribute('height')));
  }

  /** Downloads the SVG (button). */
  downloadSvg(name = 'root-locus'): void {
    downloadBlob(new Blob([this.svg()], { type: 'image/svg+xml' }), `${name}.svg`);
  }

  /** Downloads the PNG (button); a failure is reported through `onError`. */
  downloadPng(onError: (message: string) => void, name = 'root-locus'): void {
    this.png().then(
      (blob) => downloadBlob(blob, `${name}.png`),
      (error: unknown) => onError(error instanceof Error ? error.message : String(error)),
    );
  }
}
