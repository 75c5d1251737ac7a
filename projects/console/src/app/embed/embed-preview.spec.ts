import { shownError } from './embed-preview';

describe('shownError', () => {
  it('finds a load error an element already shows, in a shadow root inside another shadow root', () => {
    const page = document.implementation.createHTMLDocument('preview');
    const studio = page.createElement('pw-loop-studio');
    page.body.append(studio);
    const plot = page.createElement('pwl-locus-plot');
    studio.attachShadow({ mode: 'open' }).append(plot);
    const message = page.createElement('p');
    message.className = 'pw-message pw-error';
    message.textContent = ' Forbidden: This embed token is not valid on pages from http://localhost:4300. ';
    plot.attachShadow({ mode: 'open' }).append(message);
    expect(shownError(page)).toBe('Forbidden: This embed token is not valid on pages from http://localhost:4300.');
  });

  it('gives null while no element shows an error', () => {
    const page = document.implementation.createHTMLDocument('preview');
    const plot = page.createElement('pwl-locus-plot');
    page.body.append(plot);
    plot.attachShadow({ mode: 'open' }).append(page.createElement('svg'));
    expect(shownError(page)).toBeNull();
  });
});
