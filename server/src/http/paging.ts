import type { Request } from 'express';

/** Page and page size from the query (already checked against the OpenAPI document), with defaults. */
export function pagingOf(req: Request, defaultSize = 50): { page: number; pageSize: number } {
  const page = Number(req.query['page'] ?? 1);
  const pageSize = Number(req.query['pageSize'] ?? defaultSize);
  return { page: Number.isInteger(page) && page >= 1 ? page : 1, pageSize: Number.isInteger(pageSize) && pageSize >= 1 ? Math.min(pageSize, 200) : defaultSize };
}
