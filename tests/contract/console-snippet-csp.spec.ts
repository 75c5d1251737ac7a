import { describe, expect, it } from 'vitest';
import { embedSnippet, GAIN_LISTENER_SCRIPT } from '../../projects/console/src/app/embed/embed-snippet.js';
import { CONSOLE_SNIPPET_SCRIPTS } from '../../server/src/http/static-sites.js';

// The console's embed screen runs the snippet it hands out in a Blob URL frame, which inherits the console's
// Content-Security-Policy: the snippet's inline script runs there only if the server allows its exact text.
describe('the console snippet and the server policy', () => {
  it('the server allows, byte for byte, every inline script a console snippet holds', () => {
    expect(CONSOLE_SNIPPET_SCRIPTS).toEqual([GAIN_LISTENER_SCRIPT]);
    const snippet = embedSnippet({
      origin: 'http://127.0.0.1:4300',
      modelId: 'm-1',
      modelName: 'Belt',
      token: 'pwe_x',
      expiresAt: '2026-12-02T13:00:00.000Z',
      elements: ['locus-plot', 'gain-control'],
      theme: 'dark',
      plotHeight: 400,
      loop: 'belt',
    });
    const inline = [...snippet.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/gi)].map((m) => m[1]);
    expect(inline).toEqual([GAIN_LISTENER_SCRIPT]);
  });
});
