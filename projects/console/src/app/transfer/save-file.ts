/**
 * The file name of a `Content-Disposition` header (RFC 6266): `filename*=UTF-8''…` first, then
 * `filename="…"` or a bare `filename=…`; `fallback` when there is none. Path separators are dropped.
 */
export function fileNameFrom(contentDisposition: string | null, fallback: string): string {
  if (!contentDisposition) return fallback;
  const extended = /filename\*\s*=\s*(?:UTF-8|utf-8)''([^;]+)/.exec(contentDisposition)?.[1];
  let name: string | undefined;
  if (extended) {
    try {
      name = decodeURIComponent(extended.trim());
    } catch {
      name = undefined;
    }
  }
  name ??= /filename\s*=\s*"((?:[^"\\]|\\.)*)"/.exec(contentDisposition)?.[1]?.replace(/\\(.)/g, '$1') ?? /filename\s*=\s*([^;\s]+)/.exec(contentDisposition)?.[1];
  const safe = name?.replace(/[/\\]/g, '_').trim();
  return safe || fallback;
}

/** Saves a Blob as a file through a temporary object URL (revoked right after the click). */
export function saveBlob(blob: Blob, fileName: string, doc: Document = document): void {
  const url = URL.createObjectURL(blob);
  const link = doc.createElement('a');
  link.href = url;
  link.download = fileName;
  link.style.display = 'none';
  doc.body.append(link);
  try {
    link.click();
  } finally {
    link.remove();
    // the browser starts the download after this task; give it time before the URL goes
    setTimeout(() => URL.revokeObjectURL(url), 10000);
  }
}
