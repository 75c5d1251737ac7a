/** A run of a message's text: plain text, or a link. */
export type MailSegment =
  | { readonly kind: 'text'; readonly text: string }
  | {
      readonly kind: 'link';
      readonly text: string;
      /** Where the link goes: an invitation link is rewritten to this console's own invitation page. */
      readonly href: string;
      /** Whether the link is an invitation to join (opens the console's invitation page). */
      readonly invitation: boolean;
    };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
/** Punctuation that ends a sentence rather than the address. */
const TRAILING = /[.,;:!?)\]}]+$/;
const INVITATION_PATH = /^\/invitations\/[A-Za-z0-9_-]+$/;

/**
 * Splits a plain-text e-mail into text and links (API addresses stay text: they are for scripts, not for a
 * browser). Invitation links (`…/invitations/<token>`) point at this
 * console's `/invitations/<token>` whatever host the server wrote into the e-mail (its PUBLIC_URL may be
 * another port on a development machine).
 */
export function mailSegments(text: string): MailSegment[] {
  const segments: MailSegment[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const raw = match[0];
    const url = raw.replace(TRAILING, '');
    const start = match.index;
    if (start > last) segments.push({ kind: 'text', text: text.slice(last, start) });
    segments.push(linkOf(url));
    last = start + url.length;
  }
  if (last < text.length) segments.push({ kind: 'text', text: text.slice(last) });
  return segments;
}

function linkOf(url: string): MailSegment {
  let path: string | null = null;
  try {
    path = new URL(url).pathname;
  } catch {
    return { kind: 'text', text: url };
  }
  if (INVITATION_PATH.test(path)) return { kind: 'link', text: url, href: path, invitation: true };
  // API addresses in a message are for scripts (POST…), not pages to open
  if (path.startsWith('/api/')) return { kind: 'text', text: url };
  return { kind: 'link', text: url, href: url, invitation: false };
}
