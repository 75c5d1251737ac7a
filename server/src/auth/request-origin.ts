import type { Request } from 'express';

/** The server's own origin as this request names it: `${req.protocol}://${req.get('host')}`. */
export function ownOrigin(req: Request): string | undefined {
  const host = req.get('host');
  return host ? `${req.protocol}://${host}` : undefined;
}

/**
 * The origin of the page that made a request, as an embed token is checked against it: the `Origin`
 * header when there is one; otherwise the server's own origin when the browser says the request comes
 * from a page of that origin. Browsers send no `Origin` on same-origin GET requests, so without this an
 * element on a page served by the Polewright server itself could never use an embed token.
 *
 * The browser says so with `Sec-Fetch-Site: same-origin`. Browsers send the fetch-metadata headers only to
 * potentially trustworthy URLs (HTTPS, localhost); a page on plain HTTP under another host name gets none,
 * so there, and only when `Sec-Fetch-Site` is absent, a `Referer` on the server's own origin says the same
 * (the page must allow it: `<meta name="referrer" content="same-origin">`, helmet sends `no-referrer`).
 * A cross-origin request with a bearer token always carries `Origin` (it is a CORS request), so neither
 * rule ever applies to a page of another origin. Pages cannot set these headers; a non-browser client can,
 * as it can set `Origin` (the token is the secret). Anything else gives undefined: no origin.
 */
export function requestOrigin(req: Request): string | undefined {
  const origin = req.headers.origin;
  if (origin) return origin;
  const own = ownOrigin(req);
  const site = req.headers['sec-fetch-site'];
  if (site !== undefined) return site === 'same-origin' ? own : undefined;
  return own !== undefined && originOf(req.headers.referer) === own ? own : undefined;
}

function originOf(url: string | undefined): string | undefined {
  if (!url || !URL.canParse(url)) return undefined;
  const { origin } = new URL(url);
  return origin === 'null' ? undefined : origin;
}
