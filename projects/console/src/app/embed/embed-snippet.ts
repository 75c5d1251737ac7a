/** The elements a snippet can hold: the studio (all parts laid out) or any of the single parts. */
export type EmbedElement = 'studio' | 'locus-plot' | 'gain-control' | 'step-plot' | 'pole-table' | 'stability-summary';

/** One choice of the element picker: its tag and how the screen names it. */
export interface EmbedElementInfo {
  readonly kind: EmbedElement;
  readonly tag: string;
  readonly label: string;
  readonly hint: string;
}

/** Every element, in the order a snippet writes them (README "Embedding the elements"). */
export const EMBED_ELEMENTS: readonly EmbedElementInfo[] = [
  { kind: 'studio', tag: 'pw-loop-studio', label: 'Studio', hint: 'all five parts laid out together' },
  { kind: 'locus-plot', tag: 'pw-locus-plot', label: 'Locus plot', hint: 'the pole paths, with the gain marked' },
  { kind: 'gain-control', tag: 'pw-gain-control', label: 'Gain control', hint: 'slider and number field' },
  { kind: 'step-plot', tag: 'pw-step-plot', label: 'Step plot', hint: 'step response at the current gain' },
  { kind: 'pole-table', tag: 'pw-pole-table', label: 'Pole table', hint: 'closed-loop poles with ζ and ωn' },
  { kind: 'stability-summary', tag: 'pw-stability-summary', label: 'Stability summary', hint: 'stable gain ranges and margins' },
];

/** Smallest and largest height of the locus plot the screen offers (px). */
export const PLOT_HEIGHT = { min: 200, max: 1200, default: 420 } as const;

/**
 * The listener script of every snippet: fixed text, so that the console's Content-Security-Policy can allow
 * it by hash and the preview runs the snippet unchanged. The server lists its hash for the console
 * (`CONSOLE_SNIPPET_SCRIPT_HASHES` in server/src/http/static-sites.ts): change both together.
 */
export const GAIN_LISTENER_SCRIPT = `
  // every gain a reader sets in an element, with the loop key it belongs to
  document.addEventListener('pw-gain-change', (event) => {
    console.log('Polewright gain', event.detail.gain, 'on loop', event.detail.loop);
  });
`;

/** What a snippet holds. */
export interface SnippetOptions {
  /** The origin serving the elements and the API (this console's origin). */
  readonly origin: string;
  readonly modelId: string;
  readonly modelName: string;
  readonly token: string;
  readonly expiresAt: string;
  /** `['studio']`, or any of the single parts. */
  readonly elements: readonly EmbedElement[];
  readonly theme: 'light' | 'dark';
  /** Height of the locus plot in px (the studio and the other parts size themselves). */
  readonly plotHeight: number;
  /** The shared `loop` key. */
  readonly loop: string;
}

/** Escapes text for a double-quoted HTML attribute. */
export function escapeAttribute(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/** A `loop` key from a model name: lower-case words joined by dashes, at most 40 characters. */
export function loopKeyOf(name: string): string {
  const key = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/, '');
  return key || 'loop';
}

/** The elements in snippet order; the studio stands alone (it holds every part already). */
export function orderedElements(elements: readonly EmbedElement[]): EmbedElementInfo[] {
  if (elements.includes('studio')) return EMBED_ELEMENTS.filter((e) => e.kind === 'studio');
  return EMBED_ELEMENTS.filter((e) => elements.includes(e.kind));
}

/**
 * The HTML a host page pastes: the stylesheet and module script of the elements from `origin`, the chosen
 * elements (the first loads the model with the token; the others share it through the `loop` key) and the
 * listener script. The same text runs in the console's preview.
 */
export function embedSnippet(options: SnippetOptions): string {
  const origin = options.origin.replace(/\/+$/, '');
  const chosen = orderedElements(options.elements);
  const attr = (name: string, value: string): string => ` ${name}="${escapeAttribute(value)}"`;
  const lines = [
    `<!-- Polewright elements; the embed token works until ${options.expiresAt}, on pages of its origins only -->`,
    `<link rel="stylesheet" href="${escapeAttribute(origin)}/elements/polewright-elements.css">`,
    `<script type="module" src="${escapeAttribute(origin)}/elements/polewright-elements.js"></script>`,
    '',
  ];
  if (chosen.length > 1) lines.push('<!-- the first element loads the model; the others share it through the same loop key -->');
  chosen.forEach((element, index) => {
    let attributes = '';
    if (index === 0) attributes += attr('model-id', options.modelId) + attr('api-base', `${origin}/api`) + attr('token', options.token);
    attributes += attr('loop', options.loop) + attr('theme', options.theme);
    if (element.kind === 'locus-plot') attributes += attr('label', `Root locus: ${options.modelName}`) + attr('style', `height: ${Math.round(options.plotHeight)}px`);
    lines.push(`<${element.tag}${attributes}></${element.tag}>`);
  });
  lines.push('', `<script>${GAIN_LISTENER_SCRIPT}</script>`);
  return `${lines.join('\n')}\n`;
}

/** A whole HTML document around a snippet, for the preview frame (a host page would have its own). */
export function previewDocument(snippet: string, theme: 'light' | 'dark'): string {
  const background = theme === 'dark' ? '#0f1216' : '#ffffff';
  return [
    '<!doctype html>',
    '<html lang="en">',
    '<head><meta charset="utf-8"><title>Embed preview</title>',
    `<style>body { margin: 12px; background: ${background}; } body > * + * { margin-top: 12px; }</style>`,
    '</head>',
    '<body>',
    snippet,
    '</body>',
    '</html>',
  ].join('\n');
}
