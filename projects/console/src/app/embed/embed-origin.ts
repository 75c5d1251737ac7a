import type { AbstractControl, ValidationErrors } from '@angular/forms';

/** Most origins one embed token may carry (`EmbedTokenCreate.origins`, maxItems). */
export const MAX_ORIGINS = 20;

/** Longest origin the API takes (`EmbedTokenCreate.origins[]`, maxLength). */
export const MAX_ORIGIN_LENGTH = 200;

/**
 * Why `text` is not a page origin the API accepts, or null when it is one. The API's rule
 * (`isOrigin` of the server): an http(s) URL that is exactly its own origin — scheme, host and an optional
 * port, no path, query, fragment or trailing slash, written as the browser sends it in the `Origin` header
 * (lower-case host, no default port). The message proposes the origin when one can be read from the text.
 */
export function originProblem(text: string): string | null {
  const value = text.trim();
  if (value === '') return 'Enter an origin such as https://intranet.example:8443.';
  if (value.length > MAX_ORIGIN_LENGTH) return `At most ${MAX_ORIGIN_LENGTH} characters.`;
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    return 'Not an origin: write scheme://host[:port], e.g. https://intranet.example:8443.';
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') return 'Only http:// and https:// pages can embed the elements.';
  if (url.origin === value) return null;
  if (url.username || url.password) return `An origin has no user name or password: ${url.origin}`;
  const rest = value.slice(value.indexOf('//') + 2).replace(/^[^/?#]*/, '');
  if (rest === '/') return `No trailing slash: ${url.origin}`;
  if (rest !== '') return `Only the origin, without path, query or #fragment: ${url.origin}`;
  // same place, written differently (upper case, default port…): the browser sends the short form
  return `Write it as browsers send it: ${url.origin}`;
}

/** Validator of the list of origins: one at least, at most `MAX_ORIGINS`, each valid. */
export function originListValidator(control: AbstractControl<readonly string[] | null>): ValidationErrors | null {
  const origins = control.value ?? [];
  if (origins.length === 0) return { origins: { message: 'Add at least one origin: the pages that may show the elements.' } };
  if (origins.length > MAX_ORIGINS) return { origins: { message: `At most ${MAX_ORIGINS} origins per token.` } };
  const wrong = origins.find((o) => originProblem(o) !== null);
  return wrong ? { origins: { message: `${wrong}: ${originProblem(wrong) ?? ''}` } } : null;
}
