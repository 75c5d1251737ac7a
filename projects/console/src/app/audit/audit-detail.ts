/** How long one value may be in the compact summary before it is cut. */
const MAX_VALUE = 48;

function compact(value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (Array.isArray(value)) return value.map(compact).join(', ') || '—';
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

function cut(text: string): string {
  return text.length > MAX_VALUE ? `${text.slice(0, MAX_VALUE - 1)}…` : text;
}

/**
 * A one-line summary of an event's detail: `key: value` pairs joined by " · ", arrays as lists, long
 * values cut. Empty for no detail. The expanded row shows the whole JSON.
 */
export function detailSummary(detail: Record<string, unknown> | null | undefined): string {
  if (!detail) return '';
  return Object.entries(detail)
    .map(([key, value]) => `${key}: ${cut(compact(value))}`)
    .join(' · ');
}
