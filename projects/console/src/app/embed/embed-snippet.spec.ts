import { embedSnippet, escapeAttribute, GAIN_LISTENER_SCRIPT, loopKeyOf, orderedElements, previewDocument, type SnippetOptions } from './embed-snippet';

const OPTIONS: SnippetOptions = {
  origin: 'https://polewright.quillfield.example',
  modelId: 'm-42',
  modelName: 'Line 3 belt speed',
  token: 'pwe_abc123',
  expiresAt: '2026-12-02T13:00:00.000Z',
  elements: ['studio'],
  theme: 'light',
  plotHeight: 420,
  loop: 'line-3-belt-speed',
};

/** The pw- element tags of a snippet, in order, with their attributes. */
function elementsOf(html: string): { tag: string; attributes: Record<string, string> }[] {
  const doc = new DOMParser().parseFromString(html, 'text/html');
  return [...doc.querySelectorAll('*')]
    .filter((e) => e.tagName.toLowerCase().startsWith('pw-'))
    .map((e) => ({ tag: e.tagName.toLowerCase(), attributes: Object.fromEntries([...e.attributes].map((a) => [a.name, a.value])) }));
}

describe('embedSnippet', () => {
  it('loads the stylesheet and module script of the elements from the console’s origin', () => {
    const html = embedSnippet(OPTIONS);
    expect(html).toContain('<link rel="stylesheet" href="https://polewright.quillfield.example/elements/polewright-elements.css">');
    expect(html).toContain('<script type="module" src="https://polewright.quillfield.example/elements/polewright-elements.js"></script>');
  });

  it('writes the studio alone with model id, API base, token, loop key and theme', () => {
    expect(elementsOf(embedSnippet({ ...OPTIONS, elements: ['studio', 'locus-plot'] }))).toEqual([
      { tag: 'pw-loop-studio', attributes: { 'model-id': 'm-42', 'api-base': 'https://polewright.quillfield.example/api', token: 'pwe_abc123', loop: 'line-3-belt-speed', theme: 'light' } },
    ]);
  });

  it('writes the chosen parts in a fixed order; the first loads the model and all share the loop key', () => {
    const html = embedSnippet({ ...OPTIONS, elements: ['stability-summary', 'gain-control', 'locus-plot'], theme: 'dark', plotHeight: 515.4 });
    const elements = elementsOf(html);
    expect(elements.map((e) => e.tag)).toEqual(['pw-locus-plot', 'pw-gain-control', 'pw-stability-summary']);
    expect(elements[0]?.attributes).toEqual({
      'model-id': 'm-42',
      'api-base': 'https://polewright.quillfield.example/api',
      token: 'pwe_abc123',
      loop: 'line-3-belt-speed',
      theme: 'dark',
      label: 'Root locus: Line 3 belt speed',
      style: 'height: 515px',
    });
    for (const other of elements.slice(1)) expect(other.attributes).toEqual({ loop: 'line-3-belt-speed', theme: 'dark' });
    expect(html).toContain('the first element loads the model');
  });

  it('ends with the fixed listener script of pw-gain-change and says until when the token works', () => {
    const html = embedSnippet(OPTIONS);
    expect(html).toContain(`<script>${GAIN_LISTENER_SCRIPT}</script>`);
    expect(GAIN_LISTENER_SCRIPT).toContain("addEventListener('pw-gain-change'");
    expect(html).toContain('works until 2026-12-02T13:00:00.000Z');
  });

  it('escapes what it puts in attributes', () => {
    const html = embedSnippet({ ...OPTIONS, elements: ['locus-plot'], modelName: 'Dryer "A" <zone 2> & fan' });
    expect(elementsOf(html)[0]?.attributes['label']).toBe('Root locus: Dryer "A" <zone 2> & fan');
    expect(html).toContain('label="Root locus: Dryer &quot;A&quot; &lt;zone 2&gt; &amp; fan"');
    expect(escapeAttribute('a"b')).toBe('a&quot;b');
  });
});

describe('loopKeyOf', () => {
  it('makes a readable key of a model name', () => {
    expect(loopKeyOf('Line 3 belt speed (light load)')).toBe('line-3-belt-speed-light-load');
    expect(loopKeyOf('Trocknungs-Lüfter Zone 2')).toBe('trocknungs-lufter-zone-2');
    expect(loopKeyOf('***')).toBe('loop');
    expect(loopKeyOf('x'.repeat(60))).toHaveLength(40);
  });
});

describe('orderedElements and previewDocument', () => {
  it('keeps the picker’s order whatever order the choice came in', () => {
    expect(orderedElements(['pole-table', 'step-plot']).map((e) => e.tag)).toEqual(['pw-step-plot', 'pw-pole-table']);
  });

  it('wraps the snippet unchanged in a document with the theme’s background', () => {
    const snippet = embedSnippet(OPTIONS);
    const doc = previewDocument(snippet, 'dark');
    expect(doc.startsWith('<!doctype html>')).toBe(true);
    expect(doc).toContain(snippet);
    expect(doc).toContain('background: #0f1216');
  });
});
