import type { AuditQuery } from './audit-api';

/** The audit screen's state as it stands in the URL's query parameters. */
export interface AuditUrlState {
  readonly action?: string;
  /** User id of the actor. */
  readonly actor?: string;
  /** First day shown (`YYYY-MM-DD`, local). */
  readonly from?: string;
  /** Last day shown, inclusive (`YYYY-MM-DD`, local). */
  readonly to?: string;
  readonly page?: number;
  readonly size?: number;
}

/** Page sizes offered. */
export const AUDIT_PAGE_SIZES = [25, 50, 100];
export const DEFAULT_AUDIT_PAGE_SIZE = 50;

const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A local day from `YYYY-MM-DD`, or null when the text is not a real day. */
export function parseDay(text: string | null | undefined): Date | null {
  const m = DAY.exec(text ?? '');
  if (!m) return null;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(y, mo - 1, d);
  return date.getFullYear() === y && date.getMonth() === mo - 1 && date.getDate() === d ? date : null;
}

/** `YYYY-MM-DD` of a local day. */
export function formatDay(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** A positive integer from a query parameter, or undefined. */
export function positiveInt(text: string | number | null | undefined): number | undefined {
  const n = Number(text);
  return Number.isInteger(n) && n >= 1 ? n : undefined;
}

/**
 * The API query for the URL's state: days become local-midnight instants, the last day inclusive (the
 * API's `to` is exclusive, so it is the next midnight); unusable values are left out.
 */
export function auditQuery(state: AuditUrlState): AuditQuery {
  const from = parseDay(state.from);
  const to = parseDay(state.to);
  const size = positiveInt(state.size);
  return {
    action: state.action?.trim() || undefined,
    actorId: state.actor || undefined,
    from: from ? from.toISOString() : undefined,
    to: to ? new Date(to.getFullYear(), to.getMonth(), to.getDate() + 1).toISOString() : undefined,
    page: positiveInt(state.page) ?? 1,
    pageSize: size && size <= 200 ? size : DEFAULT_AUDIT_PAGE_SIZE,
  };
}

/** Query parameters for the URL (absent filters removed, so the URL stays short). */
export function urlParams(state: AuditUrlState): Record<string, string | number | null> {
  return {
    action: state.action?.trim() || null,
    actor: state.actor || null,
    from: state.from || null,
    to: state.to || null,
    page: state.page && state.page > 1 ? state.page : null,
    size: state.size && state.size !== DEFAULT_AUDIT_PAGE_SIZE ? state.size : null,
  };
}
