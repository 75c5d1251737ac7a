/*
 * The element bundle: registers every @polewright/elements component as a pw- custom element. Built into
 * dist/elements/polewright-elements.js (+ polewright-elements.css and the Roboto font files); load it as
 * <script type="module" src=".../elements/polewright-elements.js">.
 */
import { provideHttpClient } from '@angular/common/http';
import { provideZonelessChangeDetection } from '@angular/core';
import { createCustomElement } from '@angular/elements';
import { createApplication } from '@angular/platform-browser';
import { ELEMENTS } from './elements';

createApplication({ providers: [provideZonelessChangeDetection(), provideHttpClient()] })
  .then((app) => {
    for (const [tag, component] of ELEMENTS) {
      if (!customElements.get(tag)) customElements.define(tag, createCustomElement(component, { injector: app.injector }));
    }
  })
  .catch((error: unknown) => console.error('polewright-elements: could not start', error));
